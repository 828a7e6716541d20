import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { quantityRange } from './quantity-validators';
import { type Quantity, UnitInput } from './unit-input';

@Component({
  imports: [ReactiveFormsModule, UnitInput],
  template: `<form [formGroup]="form"><wick-unit-input formControlName="bw" dimension="basisWeight" label="Basis weight" /></form>`,
})
class Host {
  private readonly fb = inject(NonNullableFormBuilder);
  readonly form = this.fb.group({
    bw: this.fb.control<Quantity | null>(null, [Validators.required, quantityRange(0.001, 10)]),
  });
}

function setup() {
  const fixture = TestBed.createComponent(Host);
  fixture.detectChanges();
  return { fixture, host: fixture.componentInstance, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('UnitInput', () => {
  it('turns a typed number and the chosen unit into { si, unit }', async () => {
    const { host, loader } = setup();
    const input = await loader.getHarness(MatInputHarness);
    await input.setValue('45');
    // 45 g/m² = 0.045 kg/m² (definition of the gram).
    expect(host.form.value.bw).toEqual({ si: 0.045, unit: 'g/m^2' });
    expect(host.form.valid).toBeTrue();
  });

  it('keeps the quantity and converts the number shown when the unit changes', async () => {
    const { host, loader } = setup();
    host.form.setValue({ bw: { si: 0.045, unit: 'g/m^2' } });
    const input = await loader.getHarness(MatInputHarness);
    expect(await input.getValue()).toBe('45');
    const unit = await loader.getHarness(MatSelectHarness);
    await unit.open();
    await unit.clickOptions({ text: 'kg/m²' });
    expect(await input.getValue()).toBe('0.045');
    expect(host.form.value.bw).toEqual({ si: 0.045, unit: 'kg/m^2' });
  });

  it('reads a decimal comma, and shows why text that is not a number is refused once touched', async () => {
    const { host, loader } = setup();
    const input = await loader.getHarness(MatInputHarness);
    await input.setValue('12,5');
    expect(host.form.value.bw?.si).toBeCloseTo(0.0125, 12);
    await input.setValue('twelve');
    await input.blur();
    expect(host.form.value.bw).toBeNull();
    expect(host.form.controls.bw.errors?.['number']).toBeDefined();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Basis weight/ }));
    expect(await field.hasErrors()).toBeTrue();
    expect((await field.getTextErrors()).join(' ')).toContain('"twelve" is not a number');
  });

  it('applies named range validators in SI and words the limit in the typed unit', async () => {
    const { host, loader } = setup();
    const input = await loader.getHarness(MatInputHarness);
    await input.setValue('12000');
    await input.blur();
    expect(host.form.controls.bw.errors?.['range']).toBeDefined();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: /Basis weight/ }));
    expect((await field.getTextErrors()).join(' ')).toContain('at most 10000 g/m²');
  });

  it('disables both the number and the unit with the control', async () => {
    const { host, loader } = setup();
    host.form.controls.bw.disable();
    expect(await (await loader.getHarness(MatInputHarness)).isDisabled()).toBeTrue();
    expect(await (await loader.getHarness(MatSelectHarness)).isDisabled()).toBeTrue();
  });
});
