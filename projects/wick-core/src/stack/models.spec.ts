import { stackRetentionCurve } from './curve';
import { stackModels } from './models';

describe('stack models (ModelSpec)', () => {
  const liquid = { density: 1000, viscosity: 1e-3, surfaceTension: 0.072 };

  it('lists kebab-case ids of the stack family, once each', () => {
    const ids = stackModels.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of stackModels) {
      expect(m.id).toMatch(/^[a-z]+(-[a-z]+)*$/);
      expect(m.family).toBe('stack');
      expect(m.parameters.length).toBeGreaterThan(0);
    }
  });

  it('runs the flow model and returns JSON-safe arrays', () => {
    const spec = stackModels.find((m) => m.id === 'stack-flow');
    const out = spec?.run({
      layers: [
        {
          thickness: 2e-3,
          porosity: 0.9,
          retention: { kind: 'van-genuchten', alpha: 1 / 1000, n: 2.5 },
          permeability: 5e-11,
          initialSaturation: 0.05,
        },
      ],
      liquid,
      top: { kind: 'insults', insults: [{ start: 0, volume: 5e-4, rate: 1e-3 }] },
      endTime: 30,
      cells: 20,
      snapshots: 4,
    }) as { snapshots: { times: number[]; saturation: number[] }; massBalance: { relativeError: number } };
    expect(Array.isArray(out.snapshots.times)).toBeTrue();
    expect(out.snapshots.saturation.length).toBe(4 * 20);
    const copy = JSON.parse(JSON.stringify(out)) as typeof out;
    expect(copy.snapshots.times).toEqual(out.snapshots.times);
    expect(out.massBalance.relativeError).toBeLessThan(1e-6);
  });

  it('gives the van Genuchten curve with Se = 2^(−m) at Pc = 1/α and S falling with Pc', () => {
    // van Genuchten (1980) Eq. 3 at α Pc = 1 (identity); θr = 0.09 of θs = 0.9 → S = 0.1 + 0.9 Se.
    const r = stackRetentionCurve({
      layer: {
        thickness: 1e-3,
        porosity: 0.9,
        residualContent: 0.09,
        retention: { kind: 'van-genuchten', alpha: 1 / 2000, n: 4 },
        permeability: 1e-11,
      },
      liquid,
      pressures: [0, 500, 2000, 8000],
    });
    expect(r.effectiveSaturation[2]).toBeCloseTo(Math.pow(2, -0.75), 12);
    expect(r.saturation[2]).toBeCloseTo(0.1 + 0.9 * Math.pow(2, -0.75), 12);
    expect(r.saturation[0]).toBe(1);
    expect(r.relativePermeability[0]).toBe(1);
    for (let k = 1; k < 4; k++) {
      expect(r.saturation[k]).toBeLessThan(r.saturation[k - 1]);
      expect(r.relativePermeability[k]).toBeLessThan(r.relativePermeability[k - 1]);
    }
    expect(r.vanGenuchten?.alpha).toBeCloseTo(1 / 2000, 15);
  });

  it('keeps a Brooks–Corey layer saturated up to its entry pressure', () => {
    // Brooks & Corey (1964): Se = 1 for Pc ≤ Pb, (Pb/Pc)^λ above.
    const r = stackRetentionCurve({
      layer: { thickness: 1e-3, porosity: 0.8, retention: { kind: 'brooks-corey', entryPressure: 300, lambda: 3 }, permeability: 1e-10 },
      liquid,
      points: 41,
    });
    for (let k = 0; k < r.pressures.length; k++) {
      const expected = r.pressures[k] <= 300 ? 1 : Math.pow(300 / r.pressures[k], 3);
      expect(r.effectiveSaturation[k]).toBeCloseTo(expected, 12);
    }
    expect(r.vanGenuchten).toBeNull();
  });
});
