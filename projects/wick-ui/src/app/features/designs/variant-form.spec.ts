import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';
import { evaluateVariant, type VariantFixture } from 'wick-core';
import fixtureJson from '../../../../../wick-core/src/design/fixture/variants.json';
import { fromInputs, NO_EXTRAS, nominalOf, toInputs, toleranceFrom, toleranceRow, variantForm } from './variant-form';

describe('variant form ↔ variant inputs', () => {
  let fb: NonNullableFormBuilder;
  beforeEach(() => (fb = TestBed.inject(NonNullableFormBuilder)));

  it('the default form gives inputs the evaluator accepts', () => {
    const form = variantForm(fb);
    const r = evaluateVariant(toInputs(form.getRawValue(), NO_EXTRAS));
    expect(r.status).toBe('ok');
  });

  it('saved inputs of every fixture case come back unchanged through the form', () => {
    for (const c of (fixtureJson as unknown as VariantFixture).cases) {
      const form = variantForm(fb);
      const { value, extras, tolerances } = fromInputs(c.inputs);
      form.patchValue(value);
      for (const t of tolerances) form.controls.tolerances.push(toleranceRow(fb, t.parameter, t.kind, t.plusMinus, t.original));
      const back = toInputs(form.getRawValue(), extras);
      // Same physics: the evaluator's key numbers agree exactly.
      const a = evaluateVariant(back, c.options);
      const b = evaluateVariant(c.inputs, c.options);
      expect(JSON.stringify(a)).withContext(c.name).toEqual(JSON.stringify(b));
    }
  });

  it('a ± row becomes the tolerance family’s distribution about the nominal value', () => {
    // Normal: ± is the standard deviation, truncated at the physical bound (porosity between 0 and 1).
    expect(toleranceFrom('normal', 0.9, 0.02, 'porosity')).toEqual({ kind: 'normal', sd: 0.02, lower: 0, upper: 1 });
    expect(toleranceFrom('uniform', 0.001, 0.0001, 'thickness')).toEqual({ kind: 'uniform', min: 0.0009, max: 0.0011 });
    expect(toleranceFrom('triangular', 1, 0.5, 'width')).toEqual({ kind: 'triangular', min: 0.5, max: 1.5, mode: 1 });
  });

  it('offers tolerances only on inputs the variant uses', () => {
    const form = variantForm(fb);
    const v = form.getRawValue();
    expect(nominalOf(v, 'thickness')).toBe(0.001);
    expect(nominalOf(v, 'porosity')).toBeUndefined();
    expect(nominalOf(v, 'capillaryRadius')).toBeUndefined();
  });
});
