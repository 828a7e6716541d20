import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import { SetPage } from './set-page';
import { labSet, PRIYA } from './testing';

describe('SetPage', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  async function open(set = labSet()) {
    TestBed.configureTestingModule({ imports: [SetPage], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(SetPage);
    fixture.componentRef.setInput('id', '5');
    fixture.detectChanges();
    http.expectOne('/api/lab-data/sets/5').flush(set);
    await fixture.whenStable();
    fixture.detectChanges();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  it('flags the run that wicked at half the rate and gives mean ± sd without it', async () => {
    const { el, loader } = await open();
    expect(el.querySelector('[data-outlier="14"]')?.textContent).toContain('Capillary term a');
    const [, stats] = await loader.getAllHarnesses(MatTableHarness);
    const rows = await stats.getCellTextByColumnName();
    const a = rows['label'].text.indexOf('Capillary term a');
    expect(rows['outliers'].text[a]).toBe('Specimen 4');
    expect(rows['kept'].text[a]).toContain('(3)');
  });

  it('proposes with the web version read from the library, and reports the new revision in review', async () => {
    const { fixture, loader, el } = await open();
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'The runs\' curves and files' }))).uncheck();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Propose to library/ }))).click();
    http.expectOne('/api/library/webs/7').flush({ id: 7, version: 9 });
    await fixture.whenStable();
    const req = http.expectOne('/api/lab-data/sets/5/propose');
    expect(req.request.body).toEqual({ webVersion: 9, submit: true, permeability: true, curves: false });
    req.flush(
      labSet({
        proposals: [{ entryId: 7, revision: 3, webName: 'TAB-40 acquisition layer', submitted: true, proposedBy: PRIYA, proposedAt: '2026-12-01T09:00:00.000Z', runIds: [11, 12, 13, 14], figures: {} }],
      }),
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Revision 3 of TAB-40 acquisition layer created and submitted for review');
    expect(el.querySelector('.proposal')?.textContent).toContain('revision 3');
  });

  it('shows the library’s refusal when the web has an open revision', async () => {
    const { fixture, loader, el } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Propose to library/ }))).click();
    http.expectOne('/api/library/webs/7').flush({ id: 7, version: 9 });
    await fixture.whenStable();
    http
      .expectOne('/api/lab-data/sets/5/propose')
      .flush({ error: { code: 'open-revision', message: 'Revision 3 of the web "TAB-40" is in review: …' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('is in review');
  });
});
