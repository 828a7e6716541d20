import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { EntrySummary } from 'wick-core';
import { AuthStore } from '../../core/auth/auth-store';
import { ReviewQueue } from './review-queue';
import { settle } from '../library/testing';

function submitted(id: number, kind: EntrySummary['kind'], name: string, by: { id: number; name: string }): EntrySummary {
  return {
    id,
    kind,
    version: 5,
    name,
    supplier: null,
    state: 'in-review',
    headRevision: 2,
    approvedRevision: 1,
    updatedAt: '2026-11-29T08:00:00.000Z',
    updatedBy: by,
    submittedBy: by,
    figures: {},
  };
}

describe('ReviewQueue', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  async function setup(items: EntrySummary[]) {
    TestBed.configureTestingModule({
      imports: [ReviewQueue],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: AuthStore, useValue: { user: signal({ id: 6, name: 'Lena Moreau' }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ReviewQueue);
    fixture.detectChanges();
    const req = http.expectOne((r) => r.url === '/api/library/entries');
    expect(req.request.params.get('state')).toBe('in-review');
    req.flush({ items, total: items.length, page: 1, pageSize: 25 });
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  it('lists what waits for review with a link to each entry, and marks one’s own submissions', async () => {
    const { loader, el } = await setup([
      submitted(7, 'web', 'Calloway TAB-40 acquisition layer', { id: 2, name: 'Tomás Lindqvist' }),
      submitted(9, 'liquid', 'Simulated wound exudate', { id: 6, name: 'Lena Moreau' }),
    ]);
    const rows = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(rows['name'].text).toEqual(['Calloway TAB-40 acquisition layer', 'Simulated wound exudate']);
    expect(rows['kind'].text).toEqual(['web', 'liquid']);
    expect(rows['revision'].text).toEqual(['2 (replaces 1)', '2 (replaces 1)']);
    expect(rows['submitted'].text[0]).toBe('Tomás Lindqvist');
    expect(rows['submitted'].text[1]).toContain('yours: another reviewer decides');
    const links = [...el.querySelectorAll('td a')].map((a) => a.getAttribute('href'));
    expect(links).toEqual(['/materials/webs/7', '/liquids/9']);
  });

  it('says so when nothing waits', async () => {
    const { el } = await setup([]);
    expect(el.textContent).toContain('Nothing to review');
  });
});
