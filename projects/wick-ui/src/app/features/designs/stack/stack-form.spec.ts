import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';
import { evaluateStackVariant, readStackVariantInputs, STACK_VARIANT_EXAMPLE } from 'wick-core';
import { controlAt, layerGroup, layerValueFromLibrary, patchStackForm, stackForm, toStackInputs } from './stack-form';

function setup() {
  const fb = TestBed.inject(NonNullableFormBuilder);
  return { fb, form: stackForm(fb) };
}

describe('stack form', () => {
  it('gives back the inputs it was filled with (saved stack → form → inputs)', () => {
    const { fb, form } = setup();
    patchStackForm(form, fb, STACK_VARIANT_EXAMPLE, 'Example', 'notes');
    expect(form.controls.layers.length).toBe(3);
    // The reader drops nothing it needs and fills no defaults: the round trip is exact.
    expect(readStackVariantInputs(toStackInputs(form.getRawValue()))).toEqual(readStackVariantInputs(STACK_VARIANT_EXAMPLE));
    expect(form.controls.name.value).toBe('Example');
  });

  it('types van Genuchten α as the characteristic pressure 1/α', () => {
    const { fb, form } = setup();
    const g = layerGroup(fb);
    g.patchValue({ retentionMode: 'van-genuchten', vgPressure: { si: 400, unit: 'Pa' }, vgN: { si: 3, unit: '1' } });
    form.controls.layers.push(g);
    const layer = toStackInputs(form.getRawValue()).layers[0];
    expect(layer.retention).toEqual({ mode: 'van-genuchten', alpha: 1 / 400, n: 3 });
  });

  it('sends an empty field as null, which the evaluator refuses naming that field', () => {
    const { fb, form } = setup();
    const g = layerGroup(fb);
    g.controls.thickness.setValue(null);
    form.controls.layers.push(g);
    expect(() => evaluateStackVariant(toStackInputs(form.getRawValue()))).toThrowMatching(
      (e: { field?: string }) => e.field === 'layers[0].structure.thickness',
    );
  });

  it('finds the control an evaluator path names', () => {
    const { fb, form } = setup();
    form.controls.layers.push(layerGroup(fb));
    form.controls.layers.push(layerGroup(fb));
    const second = form.controls.layers.at(1).controls;
    expect(controlAt(form, 'layers[1].structure.thickness')).toBe(second.thickness);
    expect(controlAt(form, 'layers[1].retention.alpha')).toBe(second.vgPressure);
    expect(controlAt(form, 'layers[1].structure.permeability.value')).toBe(second.permeability);
    expect(controlAt(form, 'insult.interval')).toBe(form.controls.insult.controls.interval);
    expect(controlAt(form, 'duration')).toBe(form.controls.duration);
    expect(controlAt(form, 'layers[5].structure.thickness')).toBeNull();
  });

  it('starts a library layer from the pore-size distribution when the web has one, else from van Genuchten defaults', () => {
    const structure = { ...STACK_VARIANT_EXAMPLE.layers[2].structure, web: { kind: 'web' as const, id: 3, revision: 2, name: 'Core', state: 'approved' } };
    const withPsd = layerValueFromLibrary({ layer: { name: 'Core', structure, retention: { mode: 'pore-size' } }, notes: [] });
    expect(withPsd.retentionMode).toBe('pore-size');
    expect(withPsd.web?.revision).toBe(2);
    const without = layerValueFromLibrary({ layer: { name: 'ADL', structure: { ...structure, poreSize: undefined } }, notes: ['enter parameters'] });
    expect(without.retentionMode).toBe('van-genuchten');
    expect(without.notes).toEqual(['enter parameters']);
  });
});
