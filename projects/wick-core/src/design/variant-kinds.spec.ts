import { DEFAULT_STACK_OPTIONS } from './stack-variant';
import { evaluateStackVariant } from './stack-evaluate';
import { STACK_VARIANT_EXAMPLE } from './stack-models';
import { anyKeyFigures, describeAnyInputs, evaluateAnyVariant, isStackResults, pinnedMaterials, readAnyVariantInputs } from './variant-kinds';
import type { VariantInputs } from './variant';

const pin = (kind: 'web' | 'liquid', id: number) => ({ kind, id, revision: 2, name: `#${id}`, state: 'approved' });

const LAYER_VARIANT: VariantInputs = {
  configuration: 'vertical-strip',
  structure: { ...STACK_VARIANT_EXAMPLE.layers[1].structure, web: pin('web', 9) },
  liquid: { ref: 'water', temperature: 296.15 },
  dimensions: { width: 0.025, duration: 60 },
  checkpoints: { heights: [0.01], times: [10, 60] },
};

describe('variant kinds (single layer and stack behind one door)', () => {
  it('reads and evaluates a stack with the stack evaluator and its saved-variant options', () => {
    const inputs = readAnyVariantInputs(JSON.parse(JSON.stringify(STACK_VARIANT_EXAMPLE)));
    const { results, options } = evaluateAnyVariant(inputs);
    expect(options).toEqual({ ...DEFAULT_STACK_OPTIONS });
    expect(isStackResults(results)).toBeTrue();
    // Same inputs, same code: identical numbers to the worker's call (determinism of the shared evaluator).
    expect(JSON.stringify(results)).toBe(JSON.stringify(evaluateStackVariant(STACK_VARIANT_EXAMPLE, DEFAULT_STACK_OPTIONS)));
    expect(anyKeyFigures(results)[0].key).toBe('acquisition@1');
  });

  it('leaves single-layer variants to their own reader and evaluator', () => {
    const inputs = readAnyVariantInputs(LAYER_VARIANT);
    const { results } = evaluateAnyVariant(inputs);
    expect(isStackResults(results)).toBeFalse();
    expect(anyKeyFigures(results)[0].key).toBe('capillaryPressure');
    expect(pinnedMaterials(inputs)).toEqual([pin('web', 9)]);
  });

  it('lists every pinned revision of a stack: each layer’s web and the liquid', () => {
    const stack = {
      ...STACK_VARIANT_EXAMPLE,
      layers: STACK_VARIANT_EXAMPLE.layers.map((l, j) => (j === 1 ? l : { ...l, structure: { ...l.structure, web: pin('web', 10 + j) } })),
      liquid: { ...STACK_VARIANT_EXAMPLE.liquid, pinned: pin('liquid', 3) },
    };
    expect(pinnedMaterials(stack).map((p) => p.id)).toEqual([10, 12, 3]);
  });

  it('describes a stack layer by layer, in SI with sources, then the liquid and the insult', () => {
    const rows = describeAnyInputs(STACK_VARIANT_EXAMPLE);
    const thickness = rows.find((r) => r.path === 'layers[2].structure.thickness')!;
    expect(thickness.label).toBe('Core: Thickness');
    expect(thickness.value).toBe(6e-3);
    expect(thickness.unit).toBe('m');
    expect(rows.find((r) => r.path === 'layers[2].retention')!.value).toContain('pore-size');
    expect(rows.find((r) => r.path === 'insult.interval')!.value).toBe(300);
    expect(rows.find((r) => r.path === 'insult.volume')!.unit).toBe('m^3');
  });
});
