import { STANDARD_GRAVITY } from '../constants';
import { DomainError } from '../errors';
import { simulateStack } from './simulate';
import type { StackInput, StackLayerInput, StackResult } from './types';

/*
 * Behaviour of the stack model: boundary conditions, insults, outputs, properties and input checks.
 * Physical references are named beside each check; the rest are conservation laws and properties.
 */

const liquid = { density: 1000, viscosity: 1e-3, surfaceTension: 0.072 };

/** An invented three-layer stack: open top sheet, bulky acquisition layer, fine absorbent core. */
const topsheet: StackLayerInput = {
  name: 'top sheet',
  thickness: 0.3e-3,
  porosity: 0.85,
  retention: { kind: 'brooks-corey', entryPressure: 150, lambda: 2 },
  permeability: 2e-10,
  initialSaturation: 0.02,
};
const acquisition: StackLayerInput = {
  name: 'acquisition layer',
  thickness: 1.5e-3,
  porosity: 0.92,
  retention: { kind: 'van-genuchten', alpha: 1 / 400, n: 3 },
  permeability: 5e-10,
  initialSaturation: 0.02,
};
const core: StackLayerInput = {
  name: 'core',
  thickness: 3e-3,
  porosity: 0.85,
  residualContent: 0.01,
  retention: { kind: 'van-genuchten', alpha: 1 / 2500, n: 2.5 },
  permeability: 2e-11,
  initialSaturation: 0.03,
};

function stack(overrides: Partial<StackInput> = {}): StackInput {
  return {
    layers: [topsheet, acquisition, core],
    liquid,
    top: { kind: 'insults', insults: [{ start: 0, volume: 1.5e-3, rate: 5e-3 }] },
    endTime: 120,
    cells: 90,
    snapshots: 41,
    ...overrides,
  };
}

/** Every number in the result is finite (the model never returns NaN or Infinity). */
function expectAllFinite(r: StackResult): void {
  const arrays = [
    r.grid.centres,
    r.grid.widths,
    r.snapshots.times,
    r.snapshots.saturation,
    r.snapshots.frontPositions,
    r.snapshots.absorbed,
    r.snapshots.surfaceLiquid,
    r.snapshots.supplied,
    r.snapshots.drained,
  ];
  for (const a of arrays) expect(a.every(Number.isFinite)).toBeTrue();
  for (const v of Object.values(r.totals)) expect(Number.isFinite(v)).toBeTrue();
  expect(Number.isFinite(r.massBalance.relativeError)).toBeTrue();
}

function poreVolume(r: StackResult, input: StackInput): number {
  let v = 0;
  for (let i = 0; i < r.grid.widths.length; i++) v += r.grid.widths[i] * input.layers[r.grid.layerIndex[i]].porosity;
  return v;
}

describe('stack model: insults and acquisition', () => {
  it('takes up a gush slower than the surface can accept as it arrives: acquisition = delivery time', () => {
    // Definition of acquisition time (time until no liquid stands on the surface): with no ponding it
    // is the delivery time V/Q, and everything delivered has entered (conservation).
    const r = simulateStack(stack({ top: { kind: 'insults', insults: [{ start: 5, volume: 1e-3, rate: 1e-4 }] }, endTime: 60 }));
    const ins = r.insults[0];
    expect(ins.pondingTime).toBeNull();
    expect(ins.peakSurfaceLiquid).toBe(0);
    expect(ins.acquisitionTime).toBeCloseTo(10, 9);
    expect(r.totals.absorbed).toBeCloseTo(1e-3, 12);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
    expectAllFinite(r);
  });

  it('ponds when the supply exceeds what the surface takes, then drains the surface liquid', () => {
    // A slow, fine single layer fed fast: liquid stands on the surface (Signorini switch to a ponded
    // inlet) and acquisition outlasts delivery. Conservation: supplied = absorbed + surface liquid at
    // every snapshot.
    const r = simulateStack(
      stack({
        layers: [{ ...core, name: 'tight core', permeability: 1e-12 }],
        top: { kind: 'insults', insults: [{ start: 0, volume: 1e-3, rate: 1e-2 }] },
        endTime: 200,
      }),
    );
    const ins = r.insults[0];
    expect(ins.pondingTime).not.toBeNull();
    expect(ins.pondingTime as number).toBeLessThan(ins.deliveryTime);
    expect(ins.acquisitionTime).not.toBeNull();
    expect(ins.acquisitionTime as number).toBeGreaterThan(ins.deliveryTime);
    expect(ins.peakSurfaceLiquid).toBeGreaterThan(0);
    const s = r.snapshots;
    for (let k = 0; k < s.times.length; k++) {
      expect(s.supplied[k] - s.absorbed[k] - s.surfaceLiquid[k]).toBeCloseTo(0, 12);
      expect(s.surfaceLiquid[k]).toBeGreaterThanOrEqual(0);
    }
    expect(r.totals.surfaceLiquid).toBe(0);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('reports three gushes with an acquisition time each and closes the mass balance', () => {
    const input = stack({
      top: {
        kind: 'insults',
        insults: [
          { start: 0, volume: 1e-3, rate: 5e-3 },
          { start: 60, volume: 1e-3, rate: 5e-3 },
          { start: 120, volume: 1e-3, rate: 5e-3 },
        ],
      },
      endTime: 240,
    });
    const r = simulateStack(input);
    expect(r.status).toBe('completed');
    expect(r.insults.length).toBe(3);
    for (const ins of r.insults) {
      expect(ins.acquisitionTime).not.toBeNull();
      expect(ins.acquisitionTime as number).toBeGreaterThanOrEqual(ins.deliveryTime - 1e-9);
    }
    // Conservation: stored + surface − start = supplied − drained, to 1e-6 of the absorbed volume.
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
    expect(r.totals.storedEnd - r.totals.storedStart + r.totals.surfaceLiquid).toBeCloseTo(3e-3, 9);
    expect(r.upperLayerLiquid).toBe(r.layers[0].liquidEnd);
    expectAllFinite(r);
  });

  it('reports an unreached acquisition when the stack is too small for the insult', () => {
    const input = stack({ top: { kind: 'insults', insults: [{ start: 0, volume: 6e-3, rate: 5e-3 }] }, endTime: 300 });
    const r = simulateStack(input);
    expect(r.insults[0].acquisitionTime).toBeNull();
    const codes = r.warnings.map((w) => w.code);
    expect(codes).toContain('capacity-exceeded');
    expect(codes).toContain('acquisition-not-reached');
    // No liquid created: the stack holds at most its pore volume, the rest stands on the surface.
    expect(r.totals.storedEnd).toBeLessThanOrEqual(poreVolume(r, input) * (1 + 1e-12));
    expect(r.totals.surfaceLiquid).toBeGreaterThan(0);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('says liquid stands from the start of a gush that lands on liquid an earlier gush left standing', () => {
    // Two gushes 30 s apart onto a stack that the first already fills: the second lands on standing liquid.
    const input = stack({
      top: { kind: 'insults', insults: [{ start: 0, volume: 6e-3, rate: 5e-3 }, { start: 30, volume: 1e-3, rate: 5e-3 }] },
      endTime: 90,
    });
    const r = simulateStack(input);
    expect(r.insults[0].pondingTime).not.toBeNull();
    expect(r.insults[1].pondingTime).toBe(0);
    expect(r.insults[1].acquisitionTime).toBeNull();
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });
});

describe('stack model: properties', () => {
  const input = stack({
    top: {
      kind: 'insults',
      insults: [
        { start: 0, volume: 1.2e-3, rate: 5e-3 },
        { start: 40, volume: 1.2e-3, rate: 5e-3 },
      ],
    },
    endTime: 100,
  });
  const r = simulateStack(input);

  it('keeps every saturation within [θr/θs, 1]', () => {
    const s = r.snapshots;
    for (let k = 0; k < s.times.length; k++) {
      for (let i = 0; i < s.cells; i++) {
        const layer = input.layers[r.grid.layerIndex[i]];
        const v = s.saturation[k * s.cells + i];
        expect(v).toBeLessThanOrEqual(1 + 1e-12);
        expect(v).toBeGreaterThanOrEqual((layer.residualContent ?? 0) / layer.porosity - 1e-12);
      }
    }
  });

  it('never creates liquid: absorbed ≤ supplied, absorbed non-decreasing with a closed far face', () => {
    const s = r.snapshots;
    for (let k = 1; k < s.times.length; k++) {
      expect(s.absorbed[k]).toBeLessThanOrEqual(s.supplied[k] + 1e-15);
      expect(s.absorbed[k]).toBeGreaterThanOrEqual(s.absorbed[k - 1] - 1e-15);
      expect(s.times[k]).toBeGreaterThan(s.times[k - 1]);
    }
    expect(s.times[s.times.length - 1]).toBe(100);
    expect(s.saturation.length).toBe(s.times.length * s.cells);
  });

  it('moves the wetting front only forward during uptake', () => {
    const f = r.snapshots.frontPositions;
    for (let k = 1; k < 10; k++) expect(f[k]).toBeGreaterThanOrEqual(f[k - 1]);
    expect(f[0]).toBe(0);
    expect(f[5]).toBeGreaterThan(0);
  });

  it('absorbs more with gravity helping than without, and least against it', () => {
    // Darcy flux q = −K(∂ψ/∂x − cos β): gravity adds K cos β to the uptake (monotone in cos β).
    const one = (inclination: number) =>
      simulateStack(stack({ layers: [core], top: { kind: 'pressure', pressure: 0 }, endTime: 30, inclination })).totals.absorbed;
    const down = one(0);
    const flat = one(Math.PI / 2);
    const up = one(Math.PI);
    expect(down).toBeGreaterThan(flat);
    expect(flat).toBeGreaterThan(up);
  });

  it('uses the in-plane permeability: K → 4K is the same as t → 4t (scaling of Richards’ equation)', () => {
    // ∂θ/∂t = ∂/∂x(K ∂ψ/∂x) without gravity is invariant under K → cK, t → t/c (mathematical identity),
    // so a strip with 4× the in-plane permeability takes up in 5 s what the plain one takes in 20 s;
    // and with I ∝ √t (Boltzmann) that is twice the plain strip's 5 s uptake.
    const strip = (endTime: number, inPlanePermeability?: number) =>
      simulateStack({
        geometry: 'in-plane',
        layers: [{ ...core, thickness: 0.1, cells: 120, inPlanePermeability }],
        liquid,
        top: { kind: 'pressure', pressure: 0 },
        endTime,
        snapshots: 3,
        solver: { initialStep: endTime * 1e-4 },
      }).totals.absorbed;
    const fast = strip(5, 8e-11);
    expect(fast / strip(20)).toBeCloseTo(1, 3);
    expect(fast / strip(5)).toBeCloseTo(2, 1);
  });
});

describe('stack model: boundary conditions', () => {
  it('drains a saturated column at Ks under free drainage (unit gradient)', () => {
    // Darcy with ∂ψ/∂x = 0 at the outlet: q = K(ψ) = Ks while the outlet stays saturated, which a
    // Brooks–Corey medium does until the suction there reaches the entry head (here 5 cm).
    const ks = (2e-11 * 1000 * STANDARD_GRAVITY) / 1e-3;
    const r = simulateStack({
      layers: [
        { ...core, thickness: 0.05, initialSaturation: undefined, cells: 50, retention: { kind: 'brooks-corey', entryPressure: 490, lambda: 2 } },
      ],
      liquid,
      initialPressure: 0,
      top: { kind: 'no-flow' },
      bottom: { kind: 'free-drainage' },
      endTime: 1,
      snapshots: 2,
    });
    expect(r.totals.drained / (ks * 1)).toBeCloseTo(1, 6);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('holds the inlet pressure and lets nothing through a closed far face', () => {
    const r = simulateStack(stack({ top: { kind: 'pressure', pressure: 0, until: 20 }, endTime: 60 }));
    expect(r.totals.drained).toBe(0);
    const s = r.snapshots;
    // Uptake stops when the reservoir is removed at 20 s.
    const k20 = s.times.findIndex((t) => t >= 20);
    expect(s.absorbed[s.times.length - 1]).toBeCloseTo(s.absorbed[k20], 12);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('passes less into a dry layer with harmonic face conductivities than with arithmetic ones', () => {
    // Documented reason for the default: the harmonic mean of a wet and a bone-dry cell is near zero.
    const run = (faceConductivity: 'harmonic' | 'arithmetic') =>
      simulateStack(stack({ top: { kind: 'pressure', pressure: 0 }, endTime: 5, solver: { faceConductivity } })).totals.absorbed;
    expect(run('harmonic')).toBeLessThan(0.5 * run('arithmetic'));
  });

  it('runs a layer described by its pore-size distribution', () => {
    const psdLayer: StackLayerInput = {
      name: 'psd core',
      thickness: 2e-3,
      porosity: 0.85,
      retention: { kind: 'pore-size', diameters: [10e-6, 20e-6, 40e-6, 80e-6, 160e-6], fractions: [0.1, 0.3, 0.3, 0.2, 0.1] },
      permeability: 2e-11,
      initialSaturation: 0.03,
    };
    const r = simulateStack(stack({ layers: [topsheet, psdLayer] }));
    expect(r.insults[0].acquisitionTime).not.toBeNull();
    expect(r.layers[1].liquidEnd).toBeGreaterThan(r.layers[1].liquidStart);
    expect(r.massBalance.relativeError).toBeLessThan(1e-6);
  });
});

describe('stack model: progress, cancellation and input checks', () => {
  it('reports progress up to 1 and stops early when asked', () => {
    const seen: number[] = [];
    simulateStack(stack(), { onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(5);
    for (let k = 1; k < seen.length; k++) expect(seen[k]).toBeGreaterThan(seen[k - 1]);
    expect(seen[seen.length - 1]).toBe(1);

    let calls = 0;
    const r = simulateStack(stack(), { shouldCancel: () => ++calls > 20 });
    expect(r.status).toBe('cancelled');
    expect(r.timeReached).toBeLessThan(120);
    expect(r.snapshots.times.length).toBeLessThan(41);
    expect(r.snapshots.saturation.length).toBe(r.snapshots.times.length * r.snapshots.cells);
    expect(r.warnings.map((w) => w.code)).toContain('cancelled');
  });

  it('refuses invalid input with a DomainError naming the field', () => {
    const refuses = (input: unknown, field: string) =>
      expect(() => simulateStack(input as StackInput)).toThrowMatching((e) => e instanceof DomainError && e.field === field);
    refuses(stack({ layers: [] }), 'layers');
    refuses(stack({ layers: [{ ...core, porosity: 1 }] }), 'layers[0].porosity');
    refuses(stack({ layers: [{ ...core, conductivity: 1e-4 }] }), 'layers[0].permeability');
    refuses(stack({ layers: [{ ...core, retention: { kind: 'van-genuchten', alpha: 1e-3, n: 1 } }] }), 'layers[0].retention.n');
    refuses(stack({ layers: [{ ...core, initialSaturation: 0.01 / 0.85 }] }), 'layers[0].initialSaturation');
    refuses(stack({ layers: [{ ...core, initialSaturation: undefined }] }), 'layers[0].initialSaturation');
    refuses(stack({ endTime: Number.NaN }), 'endTime');
    refuses(stack({ inclination: 4 }), 'inclination');
    refuses(stack({ liquid: { density: 1000, viscosity: 0 } }), 'liquid.viscosity');
    refuses(
      stack({
        top: {
          kind: 'insults',
          insults: [
            { start: 0, volume: 1e-3, rate: 1e-4 },
            { start: 5, volume: 1e-3, rate: 1e-4 },
          ],
        },
      }),
      'top.insults',
    );
    refuses(stack({ top: { kind: 'sprinkler' } as unknown as StackInput['top'] }), 'top.kind');
    refuses(
      stack({
        liquid: { density: 1000, viscosity: 1e-3 },
        layers: [{ ...core, retention: { kind: 'pore-size', diameters: [1e-5, 2e-5, 4e-5], fractions: [0.3, 0.4, 0.3] } }],
      }),
      'liquid.surfaceTension',
    );
    refuses(stack({ snapshots: 1 }), 'snapshots');
    refuses(stack({ layers: [{ ...core, cells: 400, grading: 1.1 }] }), 'layers[0].grading');
    refuses(stack({ solver: { faceConductivity: 'geometric' as 'harmonic' } }), 'solver.faceConductivity');
  });
});
