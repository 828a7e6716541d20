import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleGroupHarness } from '@angular/material/button-toggle/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { Router, provideRouter } from '@angular/router';
import type { LiquidData, RevisionInput } from 'wick-core';
import { EntryForm } from './entry-form';
import { settle, webEntry } from './testing';

describe('EntryForm (liquid)', () => {
  let http: HttpTestingController;
  afterEach(() => http.verify());

  it('sends a table over temperature in kelvin and SI, and constants with the temperature they hold at', async () => {
    TestBed.configureTestingModule({ imports: [EntryForm], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    http = TestBed.inject(HttpTestingController);
    spyOn(TestBed.inject(Router), 'navigate').and.resolveTo(true);
    const fixture = TestBed.createComponent(EntryForm);
    fixture.componentRef.setInput('kind', 'liquid');
    fixture.detectChanges();
    http.expectOne('/api/library/suppliers').flush([]);
    http.expectOne((r) => r.url === '/api/library/fibres').flush({ items: [], total: 0, page: 1, pageSize: 200 });
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const input = async (label: RegExp, index = 0) => {
      const fields = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: label }));
      return (await fields[index].getControl(MatInputHarness))!;
    };

    await (await input(/^Name/)).setValue('Saline batch 12');
    // Surface tension as a table: 20 °C → 72.99 mN/m, 37 °C → 70.30 mN/m.
    const modes = await loader.getAllHarnesses(MatButtonToggleGroupHarness);
    await (await modes[0].getToggles({ text: 'Table over temperature' }))[0].check();
    await (await input(/^Temperature \(°C\)/, 0)).setValue('20');
    await (await input(/^Surface tension \(mN\/m\)/, 0)).setValue('72.99');
    await (await input(/^Temperature \(°C\)/, 1)).setValue('37');
    await (await input(/^Surface tension \(mN\/m\)/, 1)).setValue('70.30');
    await (await input(/^Viscosity$/)).setValue('1.02');
    await (await input(/^Density$/)).setValue('1004.6');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Flammable' }))).uncheck();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();

    await settle(fixture);
    const shown = [...(fixture.nativeElement as HTMLElement).querySelectorAll('mat-error, [role=alert]')].map((e) => e.textContent?.trim()).filter(Boolean);
    expect(shown).toEqual([]);
    const req = http.expectOne('/api/library/liquids');
    const body = req.request.body as RevisionInput<LiquidData>;
    const st = body.data.surfaceTension;
    if (st.mode !== 'table') throw new Error('expected a table');
    // 20 °C = 293.15 K (definition of the Celsius scale); 72.99 mN/m = 0.07299 N/m.
    expect(st.points.map((p) => p.temperature)).toEqual([293.15, 310.15]);
    expect(st.points[0].value).toBeCloseTo(0.07299, 12);
    expect(st.unit).toBe('mN/m');
    const v = body.data.viscosity;
    if (v.mode !== 'constant') throw new Error('expected a constant');
    expect(v.value.si).toBeCloseTo(1.02e-3, 15);
    expect(v.temperature.si).toBeCloseTo(293.15, 9);
    expect(body.data.flammable).toBeFalse();
    req.flush(webEntry({ id: 12, kind: 'liquid' }));
    await settle(fixture);
    // Many harness steps: allow for a busy machine.
  }, 30_000);
});
