import { toleranceModels } from './models';

describe('tolerance model specs', () => {
  const base = { radius: 40e-6, surfaceTension: 0.072, contactAngle: 0.5, viscosity: 1e-3, density: 1000 };
  const tolerances = { radius: { kind: 'normal', sd: 2e-6 }, viscosity: { kind: 'uniform', min: 0.9e-3, max: 1.1e-3 } };

  it('declares unique ids in the tolerance family', () => {
    const ids = toleranceModels.map((m) => m.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of toleranceModels) expect(m.family).toBe('tolerance');
  });

  it('time-to-height run gives ordered percentiles, a tornado and JSON-ready data', () => {
    const spec = toleranceModels.find((m) => m.id === 'tolerance-time-to-height');
    const out = spec?.run({ ...base, height: 0.02, tolerances, samples: 2000, seed: 4 }) as {
      monteCarlo: { statistics: { p10: number; p50: number; p90: number } };
      tornado: { bars: { name: string }[] };
      inputs: unknown;
      warnings: unknown[];
    };
    const s = out.monteCarlo.statistics;
    expect(s.p10).toBeLessThan(s.p50);
    expect(s.p50).toBeLessThan(s.p90);
    expect(out.tornado.bars.length).toBe(2);
    expect(out.inputs).toBeDefined();
    expect(Array.isArray(out.warnings)).toBeTrue();
  });

  it('uptake-band run returns plain arrays', () => {
    const spec = toleranceModels.find((m) => m.id === 'tolerance-uptake-band');
    const out = spec?.run({ ...base, times: [1, 10, 100], tolerances, samples: 500 }) as { p90: number[] };
    expect(Array.isArray(out.p90)).toBeTrue();
    expect(out.p90.length).toBe(3);
  });
});
