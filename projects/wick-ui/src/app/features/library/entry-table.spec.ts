import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';
import type { EntrySummary, Page } from 'wick-core';
import { EntryTable } from './entry-table';

function web(id: number, name: string, bw: number, state: EntrySummary['state'] = 'approved'): EntrySummary {
  return {
    id,
    kind: 'web',
    version: 3,
    name,
    supplier: { id: 2, name: 'Calloway Nonwovens' },
    state,
    headRevision: 1,
    approvedRevision: state === 'approved' ? 1 : null,
    updatedAt: '2026-11-30T10:00:00.000Z',
    updatedBy: { id: 2, name: 'Tomás Lindqvist' },
    submittedBy: null,
    figures: { webKind: { text: 'airlaid' }, basisWeight: { si: bw, unit: 'g/m^2' }, porosity: { si: 0.946, unit: '%' } },
  };
}

const page = (items: EntrySummary[], total = items.length, p = 1, pageSize = 25): Page<EntrySummary> => ({ items, total, page: p, pageSize });

describe('EntryTable', () => {
  let http: HttpTestingController;

  async function setup() {
    TestBed.configureTestingModule({ imports: [EntryTable], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(EntryTable);
    fixture.componentRef.setInput('kind', 'web');
    fixture.detectChanges();
    await new Promise((r) => setTimeout(r, 350));
    const first = http.expectOne((r) => r.url === '/api/library/webs');
    expect(first.request.params.get('sort')).toBe('name');
    expect(first.request.params.get('page')).toBe('1');
    first.flush(page([web(1, 'AL-150 airlaid core', 0.15), web(2, 'SB-12 topsheet', 0.012, 'in-review')], 60));
    await fixture.whenStable();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  afterEach(() => http.verify());

  it('shows each entry with its figures in the unit it was typed in', async () => {
    const { loader } = await setup();
    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getRows();
    expect(rows.length).toBe(2);
    const cells = await rows[0].getCellTextByColumnName();
    expect(cells['name']).toBe('AL-150 airlaid core');
    // 0.15 kg/m² typed as g/m² shows as 150 g/m².
    expect(cells['basisWeight']).toBe('150 g/m²');
    expect(cells['porosity']).toBe('94.6 %');
    expect(cells['webKind']).toBe('Airlaid');
    expect((await rows[1].getCellTextByColumnName())['state']).toContain('In review');
  });

  it('asks the server for the order a header sets, and for the next page', async () => {
    const { fixture, loader } = await setup();
    const sort = await loader.getHarness(MatSortHarness);
    const header = (await sort.getSortHeaders({ label: 'Basis weight' }))[0];
    await header.click();
    await new Promise((r) => setTimeout(r, 10));
    const sorted = http.expectOne((r) => r.url === '/api/library/webs');
    expect(sorted.request.params.get('sort')).toBe('basisWeight');
    expect(sorted.request.params.get('dir')).toBe('asc');
    sorted.flush(page([web(2, 'SB-12 topsheet', 0.012)], 60));
    await fixture.whenStable();

    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    await new Promise((r) => setTimeout(r, 10));
    const next = http.expectOne((r) => r.url === '/api/library/webs');
    expect(next.request.params.get('page')).toBe('2');
    expect(next.request.params.get('sort')).toBe('basisWeight');
    next.flush(page([], 60, 2));
  });

  it('filters by text (debounced) and by state on the server, from page 1', async () => {
    const { fixture, loader } = await setup();
    const search = await loader.getHarness(MatInputHarness.with({ placeholder: '' }));
    await search.setValue('airlaid');
    await new Promise((r) => setTimeout(r, 350));
    const byText = http.expectOne((r) => r.url === '/api/library/webs');
    expect(byText.request.params.get('q')).toBe('airlaid');
    byText.flush(page([web(1, 'AL-150 airlaid core', 0.15)]));
    await fixture.whenStable();

    const state = await loader.getHarness(MatSelectHarness.with({ selector: '.filters mat-form-field:nth-of-type(2) mat-select' }));
    await state.open();
    await state.clickOptions({ text: 'Returned' });
    await new Promise((r) => setTimeout(r, 10));
    const byState = http.expectOne((r) => r.url === '/api/library/webs');
    expect(byState.request.params.get('state')).toBe('returned');
    expect(byState.request.params.get('q')).toBe('airlaid');
    byState.flush(page([]));
    await fixture.whenStable();
    const table = await loader.getHarness(MatTableHarness);
    expect(await table.getRows()).toEqual([]);
  });

  it('hides and shows columns as chosen', async () => {
    const { loader } = await setup();
    const table = await loader.getHarness(MatTableHarness);
    const headers = async () => Object.keys(await (await table.getHeaderRows())[0].getCellTextByColumnName());
    expect(await headers()).toContain('supplier');
    const columns = await loader.getHarness(MatSelectHarness.with({ selector: '.columns mat-select' }));
    await columns.open();
    await columns.clickOptions({ text: 'Supplier' });
    await columns.clickOptions({ text: 'By' });
    await columns.close();
    expect(await headers()).not.toContain('supplier');
    expect(await headers()).toContain('updatedBy');
  });
});
