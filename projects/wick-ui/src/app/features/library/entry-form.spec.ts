import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router, provideRouter } from '@angular/router';
import type { RevisionInput, WebData } from 'wick-core';
import { EntryForm } from './entry-form';
import { settle, webEntry } from './testing';

/** The text input inside the form field labelled `label` (also the number part of a unit input). */
async function inputLabelled(loader: HarnessLoader, label: string | RegExp): Promise<MatInputHarness> {
  const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  return (await field.getControl(MatInputHarness))!;
}

describe('EntryForm (web)', () => {
  let http: HttpTestingController;

  async function open(id?: number) {
    TestBed.configureTestingModule({ imports: [EntryForm], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    const navigate = spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    const fixture = TestBed.createComponent(EntryForm);
    fixture.componentRef.setInput('collection', 'webs');
    if (id) fixture.componentRef.setInput('id', String(id));
    fixture.detectChanges();
    http.expectOne('/api/library/suppliers').flush([{ id: 2, name: 'Calloway Nonwovens' }]);
    http.expectOne((r) => r.url === '/api/library/fibres').flush({ items: [{ id: 11, name: 'Pinecrest fluff pulp', kind: 'fibre' }], total: 1, page: 1, pageSize: 200 });
    if (id) http.expectOne(`/api/library/webs/${id}`).flush(webEntry({ id }));
    await settle(fixture);
    return { fixture, navigate, loader: TestbedHarnessEnvironment.loader(fixture), el: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => http.verify());

  it('sends a new web in SI with the units typed, then opens it', async () => {
    const { loader, fixture, navigate } = await open();
    await (await inputLabelled(loader, /^Name/)).setValue('TAB-45 trial ADL');
    await (await inputLabelled(loader, /^Basis weight/)).setValue('45');
    await (await inputLabelled(loader, /^Thickness$/)).setValue('1.1');
    await (await inputLabelled(loader, /^Thickness measured under/)).setValue('0.5');
    const fibre = await loader.getHarness(MatSelectHarness.with({ selector: '.fibre mat-select' }));
    await fibre.open();
    await fibre.clickOptions({ text: 'Pinecrest fluff pulp' });
    await (await inputLabelled(loader, /^Share/)).setValue('100');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();

    const req = http.expectOne('/api/library/webs');
    expect(req.request.method).toBe('POST');
    const body = req.request.body as RevisionInput<WebData>;
    expect(body.name).toBe('TAB-45 trial ADL');
    // 45 g/m² = 0.045 kg/m²; 1.1 mm = 0.0011 m; 0.5 kPa = 500 Pa (unit definitions).
    expect(body.data.basisWeight).toEqual({ si: 0.045, unit: 'g/m^2', source: 'measured' });
    expect(body.data.thickness?.si).toBeCloseTo(0.0011, 12);
    expect(body.data.thicknessPressure?.si).toBeCloseTo(500, 9);
    expect(body.data.blend).toEqual([{ fibreId: 11, fibreName: 'Pinecrest fluff pulp', massFraction: 1 }]);
    expect(body.data.porosityMode).toBe('computed');
    req.flush(webEntry({ id: 31 }));
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/materials', 'webs', '31']);
  });

  it('does not send a blend that does not add up to 100 %, and says why', async () => {
    const { loader, el } = await open();
    await (await inputLabelled(loader, /^Name/)).setValue('Half a web');
    await (await inputLabelled(loader, /^Basis weight/)).setValue('45');
    await (await inputLabelled(loader, /^Fibre name/)).setValue('PP');
    await (await inputLabelled(loader, /^Share/)).setValue('80');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();
    const alerts = [...el.querySelectorAll('[role=alert]')].map((a) => a.textContent).join(' | ');
    expect(alerts).toContain('The shares add up to 80 %, not 100 %.');
    expect(alerts).toContain('Some values are missing');
  });

  it('puts the server’s field errors on the fields they name', async () => {
    const { loader, fixture } = await open();
    await (await inputLabelled(loader, /^Name/)).setValue('Odd web');
    await (await inputLabelled(loader, /^Basis weight/)).setValue('45');
    await (await inputLabelled(loader, /^Fibre name/)).setValue('PP');
    await (await inputLabelled(loader, /^Share/)).setValue('100');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();
    http.expectOne('/api/library/webs').flush(
      {
        error: {
          code: 'validation-failed',
          message: 'Invalid body: data.basisWeight.si — too heavy',
          details: { issues: [{ field: 'data.basisWeight.si', rule: 'range', message: 'Outside the plausible range.' }] },
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle(fixture);
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /^Basis weight/ }));
    expect(await field.getTextErrors()).toEqual(['Outside the plausible range.']);
  });

  it('edits an existing draft with its version, and offers to reload when someone changed it meanwhile', async () => {
    const { loader, fixture, el } = await open(7);
    expect(await (await inputLabelled(loader, /^Basis weight/)).getValue()).toBe('150');
    await (await inputLabelled(loader, /^Basis weight/)).setValue('155');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();
    const put = http.expectOne('/api/library/webs/7');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body.version).toBe(4);
    expect(put.request.body.data.basisWeight.si).toBeCloseTo(0.155, 12);
    put.flush({ error: { code: 'version-conflict', message: 'This entry changed since you opened it.', details: { current: webEntry({ version: 5 }) } } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(el.querySelector('[role=alert]')?.textContent).toContain('This entry changed since you opened it.');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Load the current version/ }))).click();
    http.expectOne('/api/library/webs/7').flush(webEntry({ version: 5 }));
    await settle(fixture);
    expect(await (await inputLabelled(loader, /^Basis weight/)).getValue()).toBe('150');
  });
});
