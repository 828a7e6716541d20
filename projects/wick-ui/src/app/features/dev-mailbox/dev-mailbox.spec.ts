import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatExpansionPanelHarness } from '@angular/material/expansion/testing';
import type { DevMailbox as Box } from 'wick-core';
import { DevMailbox } from './dev-mailbox';
import { settle } from '../library/testing';

const BOX: Box = {
  available: true,
  messages: [
    {
      id: 'm1',
      receivedAt: '2026-12-01T10:00:00.000Z',
      from: 'wickwright@brightwell.example',
      to: ['grace.adebayo@brightwell.example'],
      subject: 'Review requested: web "TAB-40", revision 2',
      text: 'Hello Grace,\n\nOpen it: http://127.0.0.1:4610/materials/webs/7',
    },
  ],
};

describe('DevMailbox', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  async function setup(box: Box) {
    TestBed.configureTestingModule({ imports: [DevMailbox], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(DevMailbox);
    fixture.detectChanges();
    http.expectOne('/api/dev/mailbox').flush(box);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  it('shows each message with its recipients, and its text when opened', async () => {
    const { loader } = await setup(BOX);
    const panels = await loader.getAllHarnesses(MatExpansionPanelHarness);
    expect(panels.length).toBe(1);
    expect(await panels[0].getTitle()).toBe('Review requested: web "TAB-40", revision 2');
    expect(await panels[0].getDescription()).toContain('grace.adebayo@brightwell.example');
    await panels[0].expand();
    expect(await panels[0].getTextContent()).toContain('/materials/webs/7');
  });

  it('empties the mailbox on request', async () => {
    const { loader, fixture } = await setup(BOX);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Empty/ }))).click();
    const req = http.expectOne('/api/dev/mailbox');
    expect(req.request.method).toBe('DELETE');
    req.flush({ available: true, messages: [] });
    await settle(fixture);
    expect(await loader.getAllHarnesses(MatExpansionPanelHarness)).toEqual([]);
  });

  it('says when the mail fake is not running', async () => {
    const { el } = await setup({ available: false, messages: [] });
    expect(el.textContent).toContain('The mail fake is not running');
  });
});
