import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';
import type { EntrySummary, LabRunCreate, Page } from 'wick-core';
import { RunUpload } from './run-upload';
import { labRun } from './testing';

const web: EntrySummary = {
  id: 7,
  kind: 'web',
  version: 9,
  name: 'TAB-40 acquisition layer',
  supplier: null,
  state: 'approved',
  headRevision: 2,
  approvedRevision: 2,
  updatedAt: '2026-11-30T10:00:00.000Z',
  updatedBy: { id: 2, name: 'Tomás Lindqvist' },
  submittedBy: null,
  figures: {},
};
const page = (items: EntrySummary[]): Page<EntrySummary> => ({ items, total: items.length, page: 1, pageSize: 200 });

describe('RunUpload', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  async function open() {
    TestBed.configureTestingModule({ imports: [RunUpload], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(RunUpload);
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/library/webs').flush(page([web]));
    http.expectOne((r) => r.url === '/api/library/liquids').flush(page([]));
    http.expectOne('/api/lab-data/sets').flush([]);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const input = el.querySelector<HTMLInputElement>('[data-test=file]')!;
    const transfer = new DataTransfer();
    transfer.items.add(new File(['time (s),height (mm)\n10,5\n'], 'rep-1.csv', { type: 'text/csv' }));
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), el };
  }

  async function fill(loader: Awaited<ReturnType<typeof open>>['loader']) {
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=name]' }))).setValue('Specimen 1');
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName=webId]' }))).clickOptions({ text: /TAB-40/ });
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName=newSetName]' }))).setValue('TAB-40 saline');
  }

  it('sends the CSV with the details in SI and opens the new run', async () => {
    const { fixture, loader } = await open();
    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    await fill(loader);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload and fit' }))).click();
    const req = http.expectOne('/api/lab-data/runs');
    const body = req.request.body as FormData;
    expect((body.get('file') as File).name).toBe('rep-1.csv');
    const meta = JSON.parse(body.get('meta') as string) as LabRunCreate;
    // 23 °C = 296.15 K (definition of the Celsius scale).
    expect(meta).toEqual(jasmine.objectContaining({ name: 'Specimen 1', webId: 7, liquid: { builtInId: 'saline-0.9' }, orientation: 'vertical', newSetName: 'TAB-40 saline' }));
    expect(meta.temperature).toBeCloseTo(296.15, 10);
    req.flush(labRun());
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/lab-data/runs', 11]);
  });

  it('lists each problem of a refused file with its line, and stays on the form', async () => {
    const { fixture, loader, el } = await open();
    await fill(loader);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload and fit' }))).click();
    http.expectOne('/api/lab-data/runs').flush(
      {
        error: {
          code: 'upload-invalid',
          message: 'The file was not imported: 1 problem (line 5: A height must not be negative (point 3: -0.008)). Nothing was changed.',
          details: { issues: [{ line: 5, message: 'A height must not be negative (point 3: -0.008).' }] },
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('Nothing was changed');
    expect(el.querySelector('.issues')?.textContent).toContain('Line 5: A height must not be negative');
  });

  it('asks for what is missing before sending anything', async () => {
    const { fixture, loader, el } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Upload and fit' }))).click();
    fixture.detectChanges();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('a run name');
    expect(el.querySelector('[role=alert]')?.textContent).toContain('the web');
  });
});
