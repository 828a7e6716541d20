import { HttpBackend, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { UploadCommitResult, UploadPreview } from 'wick-core';
import { UPLOAD_BACKEND } from './library-api';
import { UploadPanel } from './upload-panel';
import { settle } from './testing';

const PREVIEW: UploadPreview = {
  uploadId: 41,
  entryId: 7,
  file: { fileName: 'run-12.csv', size: 80, sha256: 'b'.repeat(64), encoding: 'utf-8', delimiter: ',', rows: 3 },
  warnings: [{ line: null, message: 'Rows were listed from the largest diameter down; they are stored smallest first.' }],
  preview: {
    purpose: 'psd',
    psd: { form: 'cumulative-finer', diameterUnit: 'um', diameters: [1e-5, 2e-5, 4e-5], fractions: [0.1, 0.5, 1], source: 'measured', file: { fileId: 9, fileName: 'run-12.csv', sha256: 'b'.repeat(64) } },
  },
  expiresAt: '2026-12-02T12:00:00.000Z',
};

describe('UploadPanel', () => {
  let http: HttpTestingController;

  async function setup() {
    TestBed.configureTestingModule({
      imports: [UploadPanel],
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: UPLOAD_BACKEND, useExisting: HttpBackend }],
    });
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(UploadPanel);
    fixture.componentRef.setInput('purpose', 'psd');
    fixture.componentRef.setInput('entryId', 7);
    fixture.componentRef.setInput('version', 4);
    const committed: UploadCommitResult[] = [];
    fixture.componentInstance.committed.subscribe((r) => committed.push(r));
    fixture.detectChanges();
    return { fixture, committed, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => http.verify());

  it('shows what the server read, then applies it for the version on screen', async () => {
    const { fixture, committed, loader, el } = await setup();
    const sent = fixture.componentInstance.send(new File(['diameter (µm),cumulative finer (%)\n10,10\n'], 'run-12.csv', { type: 'text/csv' }));
    const req = http.expectOne('/api/library/webs/7/psd');
    expect(req.request.body instanceof FormData).toBeTrue();
    expect((req.request.body as FormData).get('file')).toBeInstanceOf(File);
    req.event({ type: 1, loaded: 40, total: 80 });
    req.flush(PREVIEW);
    await sent;
    await settle(fixture);
    expect(el.textContent).toContain('Read 3 rows from run-12.csv');
    expect(el.textContent).toContain('largest diameter down');
    // 1e-5 m shown in the typed unit: 10 µm; 0.5 as 50 %.
    expect(el.querySelector('.rows tbody tr:nth-child(2)')?.textContent).toContain('20 µm');
    expect(el.querySelector('.rows tbody tr:nth-child(2)')?.textContent).toContain('50 %');

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Apply' }))).click();
    const commit = http.expectOne('/api/library/uploads/41/commit');
    expect(commit.request.body).toEqual({ version: 4 });
    commit.flush({ purpose: 'psd', entryIds: [7] });
    await settle(fixture);
    expect(committed).toEqual([{ purpose: 'psd', entryIds: [7] }]);
    expect(el.textContent).toContain('Applied to the draft revision.');
  });

  it('lists every problem with its line when the file is refused, and offers nothing to apply', async () => {
    const { fixture, loader, el } = await setup();
    const sent = fixture.componentInstance.send(new File(['x'], 'bad.csv'));
    http.expectOne('/api/library/webs/7/psd').flush(
      {
        error: {
          code: 'upload-invalid',
          message: 'The file was not imported: 2 problems. Nothing was changed.',
          details: { issues: [{ line: 3, column: 'diameter (µm)', message: '"abc" is not a number.' }, { line: 6, message: 'Fraction 250 is outside 0–1.' }] },
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await sent;
    await settle(fixture);
    const items = [...el.querySelectorAll('.issues li')].map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
    expect(items).toEqual(['Line 3 (diameter (µm)): "abc" is not a number.', 'Line 6: Fraction 250 is outside 0–1.']);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Apply' }))).toEqual([]);
  });

  it('discards a preview on request', async () => {
    const { fixture, loader, el } = await setup();
    const sent = fixture.componentInstance.send(new File(['x'], 'run.csv'));
    http.expectOne('/api/library/webs/7/psd').flush(PREVIEW);
    await sent;
    await settle(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Discard' }))).click();
    const del = http.expectOne('/api/library/uploads/41');
    expect(del.request.method).toBe('DELETE');
    del.flush(null, { status: 204, statusText: 'No Content' });
    await settle(fixture);
    expect(el.querySelector('.preview')).toBeNull();
  });
});
