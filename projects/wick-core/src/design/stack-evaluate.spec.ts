import { DomainError } from '../errors';
import { STANDARD_GRAVITY } from '../constants';
import { simulateStack } from '../stack/simulate';
import { evaluateStackVariant, stackKeyFigures } from './stack-evaluate';
import { STACK_VARIANT_EXAMPLE, stackVariantModels } from './stack-models';
import { readStackVariantInputs } from './stack-read-inputs';
import type { StackLayerInputs, StackVariantInputs } from './stack-variant';

const deg = (d: number) => (d * Math.PI) / 180;

/** A user-defined liquid with constant properties, so the test can compute Ks by hand. */
const LIQUID = { ref: { name: 'test liquid', surfaceTension: 0.07, viscosity: 1e-3, density: 1000 }, temperature: 296.15 };

/** One layer with measured porosity and permeability and a Brooks–Corey curve. */
function layer(over: Partial<StackLayerInputs['structure']> = {}, retention: StackLayerInputs['retention'] = { mode: 'brooks-corey', entryPressure: 490, lambda: 20 }): StackLayerInputs {
  return {
    name: 'Layer',
    structure: {
      fibreDiameter: 20e-6,
      fibreDensity: 1380,
      basisWeight: 0.1,
      thickness: 0.02,
      porosity: 0.9,
      contactAngle: deg(40),
      permeability: { mode: 'measured', value: 1e-11 },
      ...over,
    },
    retention,
  };
}

function stack(over: Partial<StackVariantInputs> = {}): StackVariantInputs {
  return {
    configuration: 'stack',
    layers: [layer()],
    liquid: LIQUID,
    insult: { volume: 4e-6, rate: 0.2e-6, area: 1e-3, count: 1 },
    duration: 60,
    cells: 100,
    ...over,
  };
}

describe('stack variant: mapping to the Richards solver', () => {
  it('runs the solver on the insult per area, V/A at Q/A (definition of the 1-D model), and scales volumes back by A', () => {
    const v = stack();
    const r = evaluateStackVariant(v);
    // Same problem written directly for the stack family: 4 mL over 10 cm² = 4 mm, 0.2 mL/s over 10 cm² = 0.2 mm/s.
    const direct = simulateStack({
      layers: [{ name: 'Layer', thickness: 0.02, porosity: 0.9, retention: { kind: 'brooks-corey', entryPressure: 490, lambda: 20 }, permeability: 1e-11, initialSaturation: 0.02 }],
      liquid: { density: 1000, viscosity: 1e-3, surfaceTension: 0.07 },
      top: { kind: 'insults', insults: [{ start: 0, volume: 4e-3, rate: 2e-4 }] },
      endTime: 60,
      cells: 100,
      snapshots: 61,
    });
    expect(r.insults[0].acquisitionTime!).toBeCloseTo(direct.insults[0].acquisitionTime!, 9);
    expect(r.totals.absorbed).toBeCloseTo(direct.totals.absorbed * 1e-3, 15);
    expect(r.curves.absorbed[30]).toBeCloseTo(direct.snapshots.absorbed[30] * 1e-3, 15);
    expect(r.heatMap.saturation[30][5]).toBeCloseTo(direct.snapshots.saturation[30 * 100 + 5], 4);
  });

  it('gives the same per-area answer for twice the volume on twice the area, and twice the volumes (V/A invariance)', () => {
    const a = evaluateStackVariant(stack());
    const b = evaluateStackVariant(stack({ insult: { volume: 8e-6, rate: 0.4e-6, area: 2e-3, count: 1 } }));
    expect(b.insults[0].acquisitionTime).toBe(a.insults[0].acquisitionTime);
    expect(b.totals.absorbed / a.totals.absorbed).toBeCloseTo(2, 12);
    expect(b.totals.upperLayerLiquid / a.totals.upperLayerLiquid).toBeCloseTo(2, 12);
  });

  it('computes porosity from basis weight, ε = 1 − BW/(ρf t) (mass balance), when none is measured', () => {
    const r = evaluateStackVariant(stack({ layers: [layer({ porosity: undefined, basisWeight: 0.5, thickness: 0.004 })], insult: { volume: 1e-6, rate: 0.1e-6, area: 1e-3, count: 1 } }));
    // ε = 1 − 0.5/(1380 × 0.004) = 0.909420…
    expect(r.layers[0].porosity).toBeCloseTo(1 - 0.5 / (1380 * 0.004), 12);
    expect(r.layers[0].porositySource).toBe('basis weight');
    expect(r.equations.some((e) => e.id === 'porosity')).toBeTrue();
  });

  it('uses the Tomadakis–Robertson through-plane correlation for a through-plane layer', () => {
    const r = evaluateStackVariant(
      stack({ layers: [layer({ permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-through-plane' } })] }),
    );
    // Tomadakis & Robertson, J. Compos. Mater. 39 (2005) 163: K = r² ε (ε − εp)^(α+2) / (8 ln²ε (1 − εp)^α ((α+1)ε − εp)²),
    // 2-D random mat, flow through the plane: εp = 0.11, α = 0.785 (table values from memory).
    const eps = 0.9;
    const rf = 10e-6;
    const ep = 0.11;
    const al = 0.785;
    const k = ((rf * rf * eps) / (8 * Math.log(eps) ** 2)) * ((eps - ep) ** (al + 2) / ((1 - ep) ** al * ((al + 1) * eps - ep) ** 2));
    expect(r.layers[0].permeability / k).toBeCloseTo(1, 3);
    expect(r.layers[0].permeabilityLabel).toMatch(/through-plane/);
  });

  it('refuses a layer with an invalid structure, naming the layer and the field path', () => {
    const bad = stack({ layers: [layer(), { ...layer({ thickness: -1 }), name: 'Core' }] });
    let err: unknown;
    try {
      evaluateStackVariant(bad);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(DomainError);
    expect((err as DomainError).field).toBe('layers[1].structure.thickness');
    expect((err as DomainError).message).toContain('Core');
  });
});

describe('stack variant: insults, acquisition and balances', () => {
  it('acquires a gush in its delivery time when the supply stays below Ks (no ponding: Mein & Larson 1973)', () => {
    // Ks = k ρ g/η = 1e-11 × 1000 × 9.80665 / 1e-3 = 9.8e-5 m/s; supply 0.2 mL/s over 10 cm² = 2e-4 m/s is above it,
    // so use 0.05 mL/s = 5e-5 m/s ≈ 0.5 Ks.
    const ks = (1e-11 * 1000 * STANDARD_GRAVITY) / 1e-3;
    const rate = 0.5 * ks * 1e-3;
    const r = evaluateStackVariant(stack({ insult: { volume: 1e-6, rate, area: 1e-3, count: 1 }, duration: 60 }));
    expect(r.insults[0].acquisitionTime).toBeCloseTo(1e-6 / rate, 9);
    expect(r.insults[0].pondingTime).toBeNull();
    expect(r.totals.surfaceLiquid).toBe(0);
  });

  it('ponds when the supply far exceeds what the surface takes, then clears it: acquisition > delivery', () => {
    // 20 mL/s over 10 cm² = 20 mm/s ≈ 200 Ks on a sharp (λ = 20) curve: Mein & Larson's (1973) ponding time
    // t_p = Ks ψf Δθ/(R(R − Ks)) is about 0.01 s, well inside the 0.2 s delivery.
    const r = evaluateStackVariant(stack({ insult: { volume: 4e-6, rate: 20e-6, area: 1e-3, count: 1 }, duration: 120 }));
    const i = r.insults[0];
    expect(i.pondingTime).not.toBeNull();
    expect(i.pondingTime!).toBeLessThan(i.deliveryTime);
    expect(i.acquisitionTime).not.toBeNull();
    expect(i.acquisitionTime!).toBeGreaterThan(i.deliveryTime);
    expect(i.peakSurfaceLiquid).toBeGreaterThan(0);
  });

  it('closes the volume balance: supplied = absorbed + surface liquid at every snapshot, error below 1e-6', () => {
    const r = evaluateStackVariant(STACK_VARIANT_EXAMPLE);
    expect(r.run).toBe('completed');
    for (let k = 0; k < r.curves.time.length; k++) {
      // Volume conservation at the inlet (the mass-balance requirement), closed far face.
      expect(Math.abs(r.curves.supplied[k] - r.curves.absorbed[k] - r.curves.surfaceLiquid[k])).toBeLessThan(1e-6 * r.totals.supplied);
    }
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
    // Capacity used = stored / pore volume (definition); pore volume = Σ ε t A.
    const pores = r.layers.reduce((s, l) => s + l.porosity * l.thickness, 0) * r.insult.area;
    expect(r.totals.poreVolume).toBeCloseTo(pores, 15);
    expect(r.capacityUsed).toBeCloseTo(r.totals.stored / pores, 12);
    expect(r.insults.length).toBe(3);
    expect(r.insult.starts).toEqual([0, 300, 600]);
    expect(r.heatMap.saturation.length).toBe(61);
    expect(r.heatMap.saturation[0].length).toBe(r.heatMap.depth.length);
    expect(r.heatMap.boundaries.length).toBe(4);
  });

  it('leaves more liquid near the surface and uses more capacity as the gush grows (monotonic property)', () => {
    const small = evaluateStackVariant(stack({ insult: { volume: 2e-6, rate: 0.05e-6, area: 1e-3, count: 1 }, layers: [layer({ thickness: 0.002 }), layer({ thickness: 0.02 })], duration: 200 }));
    const big = evaluateStackVariant(stack({ insult: { volume: 6e-6, rate: 0.05e-6, area: 1e-3, count: 1 }, layers: [layer({ thickness: 0.002 }), layer({ thickness: 0.02 })], duration: 200 }));
    expect(big.capacityUsed).toBeGreaterThan(small.capacityUsed);
    expect(big.totals.upperLayerLiquid).toBeGreaterThanOrEqual(small.totals.upperLayerLiquid);
  });

  it('reports progress and stops when asked, returning what it reached', () => {
    const seen: number[] = [];
    const r = evaluateStackVariant(STACK_VARIANT_EXAMPLE, {}, {
      onProgress: (f) => seen.push(f),
      shouldCancel: () => seen.length > 0 && seen[seen.length - 1] > 0.2,
    });
    expect(r.run).toBe('cancelled');
    expect(r.timeReached).toBeLessThan(STACK_VARIANT_EXAMPLE.duration);
    expect(seen.length).toBeGreaterThan(0);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
  });

  it('is deterministic: the registry model and a second evaluation give identical results', () => {
    const a = evaluateStackVariant(STACK_VARIANT_EXAMPLE);
    const b = stackVariantModels[0].run({ variant: STACK_VARIANT_EXAMPLE, snapshots: 61 });
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
  });
});

describe('stack variant: key figures for comparison', () => {
  it('lists an acquisition time per gush and marks the smaller rewet indicator as better', () => {
    const base = evaluateStackVariant(STACK_VARIANT_EXAMPLE);
    const thinner = evaluateStackVariant({
      ...STACK_VARIANT_EXAMPLE,
      insult: { ...STACK_VARIANT_EXAMPLE.insult, volume: 10e-6 },
    });
    const figs = stackKeyFigures(base);
    expect(figs.map((f) => f.key)).toEqual(
      jasmine.arrayContaining(['acquisition@1', 'acquisition@2', 'acquisition@3', 'surfaceLiquidEnd', 'rewetIndicator', 'capacityUsed', 'massBalanceError']),
    );
    expect(figs.find((f) => f.key === 'acquisition@1')!.better).toBe('lower');
    const byKey = (r: typeof base) => new Map(stackKeyFigures(r).map((f) => [f.key, f.value]));
    expect(byKey(thinner).get('capacityUsed')!).toBeLessThan(byKey(base).get('capacityUsed')!);
  });
});

describe('stack variant: reading inputs', () => {
  const fieldOf = (raw: unknown): string | undefined => {
    try {
      readStackVariantInputs(raw);
    } catch (e) {
      if (e instanceof DomainError) return e.field;
      throw e;
    }
    return undefined;
  };

  it('accepts the example and drops unknown fields', () => {
    const read = readStackVariantInputs({ ...STACK_VARIANT_EXAMPLE, extra: 1 });
    expect((read as unknown as Record<string, unknown>)['extra']).toBeUndefined();
    expect(read.layers.length).toBe(3);
  });

  it('names the field of each refusal', () => {
    const E = STACK_VARIANT_EXAMPLE;
    expect(fieldOf({ ...E, configuration: 'vertical-strip' })).toBe('configuration');
    expect(fieldOf({ ...E, layers: [] })).toBe('layers');
    expect(fieldOf({ ...E, insult: { ...E.insult, interval: 1 } })).toBe('insult.interval');
    expect(fieldOf({ ...E, insult: { ...E.insult, count: 2.5 } })).toBe('insult.count');
    expect(fieldOf({ ...E, duration: 500 })).toBe('duration');
    expect(fieldOf({ ...E, layers: [{ ...E.layers[0], retention: { mode: 'pore-size' } }] })).toBe('layers[0].retention.mode');
    expect(fieldOf({ ...E, layers: [{ ...E.layers[0], retention: { mode: 'van-genuchten', alpha: 0.001, n: 0.5 } }] })).toBe('layers[0].retention.n');
    expect(fieldOf({ ...E, liquid: { ref: 'water', temperature: 20 } })).toBe('liquid.temperature');
  });
});
