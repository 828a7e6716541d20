import { describeInputs } from './describe';
import { evaluateVariant } from './evaluate';
import { compareKeyFigures, keyFigures } from './key-figures';
import { readVariantInputs } from './read-inputs';
import type { VariantInputs } from './variant';

const deg = (d: number) => (d * Math.PI) / 180;

function variant(thickness: number, contactAngle = 50): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure: {
      fibreDiameter: 20e-6,
      fibreDensity: 1390,
      basisWeight: 0.05,
      thickness,
      contactAngle: deg(contactAngle),
      permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
      web: { kind: 'web', id: 4, revision: 2, name: 'Demo ADL', state: 'in-review' },
      sources: { basisWeight: 'supplier datasheet' },
    },
    liquid: { ref: 'water', temperature: 293.15 },
    dimensions: { width: 0.025, duration: 600 },
    checkpoints: { heights: [0.01, 0.02], times: [60, 600] },
  };
}

describe('keyFigures and compareKeyFigures', () => {
  it('lists the figures a comparison needs, each with a unit and a better direction', () => {
    const figs = keyFigures(evaluateVariant(variant(0.001)));
    const keys = figs.map((f) => f.key);
    expect(keys).toContain('equilibriumHeight');
    expect(keys).toContain('height@600');
    expect(keys).toContain('timeTo@0.01');
    expect(keys).toContain('capacityPerMass');
    expect(figs.find((f) => f.key === 'timeTo@0.01')!.better).toBe('lower');
    expect(figs.every((f) => f.unit.length > 0)).toBeTrue();
  });

  it('computes deltas against the baseline and marks the best value (higher or lower as the figure says)', () => {
    const thin = { id: 1, results: evaluateVariant(variant(0.0008)) };
    const thick = { id: 2, results: evaluateVariant(variant(0.0012)) };
    const wet = { id: 3, results: evaluateVariant(variant(0.001, 20)) };
    const table = compareKeyFigures([thin, thick, wet], 2);
    const eq = table.find((f) => f.key === 'equilibriumHeight')!;
    const base = eq.values.find((v) => v.variantId === 2)!;
    expect(base.delta).toBe(0);
    for (const v of eq.values) expect(v.delta).toBeCloseTo(v.value! - base.value!, 15);
    // A smaller contact angle (cos θ larger) raises the capillary pressure, so the best equilibrium height
    // is the well-wetted variant (Pc = γ cos θ / r_h).
    expect(eq.values.filter((v) => v.best).map((v) => v.variantId)).toEqual([3]);
    const t = table.find((f) => f.key === 'timeTo@0.01')!;
    const best = t.values.find((v) => v.best)!;
    expect(best.value).toBe(Math.min(...t.values.map((v) => v.value!)));
    const porosity = table.find((f) => f.key === 'porosity')!;
    expect(porosity.values.some((v) => v.best)).toBeFalse();
  });

  it('says "not reached" for a target height a variant never reaches, and the one that reaches it is best', () => {
    // A poorly wetted web (θ = 85°) levels off far below 20 mm; the well-wetted one reaches it (Jurin: h ∝ cos θ).
    const low = { id: 1, results: evaluateVariant(variant(0.001, 85)) };
    const high = { id: 2, results: evaluateVariant(variant(0.001, 20)) };
    const t = compareKeyFigures([low, high], 1).find((f) => f.key === 'timeTo@0.02')!;
    const [a, b] = t.values;
    expect(a.value).toBeNull();
    expect(a.note).toBe('not reached');
    expect(a.best).toBeFalse();
    expect(b.value).not.toBeNull();
    expect(b.note).toBeUndefined();
    expect(b.best).toBeTrue();
  });

  it('marks no best when only one variant has a figure at all (the others lack it, rather than miss it)', () => {
    const only = { id: 1, results: evaluateVariant(variant(0.001)) };
    const other = { id: 2, results: evaluateVariant({ ...variant(0.001), checkpoints: { heights: [], times: [60, 600] } }) };
    const t = compareKeyFigures([only, other], 1).find((f) => f.key === 'timeTo@0.01')!;
    expect(t.values.map((v) => v.best)).toEqual([false, false]);
    expect(t.values[1].note).toBeUndefined();
  });
});

describe('readVariantInputs and describeInputs', () => {
  it('drops fields the configuration does not use and keeps the SI values', () => {
    const read = readVariantInputs({ ...variant(0.001), capillary: { radius: 1, contactAngle: 0 }, extra: 1 });
    expect(read.capillary).toBeUndefined();
    expect(read.structure!.thickness).toBe(0.001);
    expect(JSON.parse(JSON.stringify(read))).toEqual(read);
  });

  it('lists every input with its SI unit and source, marking an unapproved pinned web', () => {
    const inputs = variant(0.001);
    const rows = describeInputs(inputs, evaluateVariant(inputs));
    const bw = rows.find((r) => r.path === 'structure.basisWeight')!;
    expect(bw.unit).toBe('kg/m^2');
    expect(bw.source).toBe('supplier datasheet');
    const thickness = rows.find((r) => r.path === 'structure.thickness')!;
    expect(thickness.source).toContain('not approved');
    expect(rows.find((r) => r.path === 'liquid.surfaceTension')!.source).toContain('IAPWS');
  });
});
