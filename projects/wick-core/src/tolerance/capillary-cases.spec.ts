import { gravityTime } from '../washburn/gravity';
import { timeToHeightTolerance, uptakeBand } from './capillary-cases';

describe('capillary tolerance studies', () => {
  const deg = Math.PI / 180;
  const base = {
    radius: 40e-6,
    surfaceTension: 0.072,
    contactAngle: 30 * deg,
    viscosity: 1e-3,
    density: 1000,
  };

  it('time-to-height: the median equals the nominal time when only a symmetric r tolerance acts near-linearly', () => {
    const r = timeToHeightTolerance({
      ...base,
      height: 0.02,
      tolerances: { radius: { kind: 'normal', sd: 0.2e-6 } },
      samples: 20000,
      seed: 3,
    });
    const a = (0.072 * 40e-6 * Math.cos(30 * deg)) / 4e-3;
    const b = (1000 * 9.80665 * 1.6e-9) / 8e-3;
    const t0 = gravityTime(a, b, 0.02) as number;
    expect(r.monteCarlo.nominalOutput).toBeCloseTo(t0, 10);
    // Monotone map r → t: the median of t is t(median r) = t(nominal) (order statistics commute with
    // monotone maps); sampling error of the median of r ≈ 1.25·σ/√N ≈ 0.002 µm → ≪ 0.1 % in t.
    expect(r.monteCarlo.statistics.p50 / t0).toBeCloseTo(1, 3);
    expect(r.monteCarlo.statistics.p10).toBeLessThan(r.monteCarlo.statistics.p90);
    expect(r.tornado.bars.length).toBe(1);
  });

  it('counts samples that cannot reach the height instead of failing, and ranks inputs', () => {
    const r = timeToHeightTolerance({
      ...base,
      height: 0.17, // Jurin height of the nominal: 2γcosθ/(ρgr) = 0.318 m; wide θ tolerance crosses 90° sometimes
      tolerances: {
        contactAngle: { kind: 'uniform', min: 20 * deg, max: 89.9 * deg },
        radius: { kind: 'normal', sd: 1e-6 },
        viscosity: { kind: 'triangular', min: 0.9e-3, max: 1.2e-3 },
      },
      samples: 5000,
    });
    expect(r.monteCarlo.failures.count).toBeGreaterThan(0);
    expect(r.monteCarlo.failures.byCode['out-of-range']).toBe(r.monteCarlo.failures.count);
    expect(r.warnings.some((w) => w.code === 'samples-outside-validity')).toBeTrue();
    // θ spans most of 0–90°: it must dominate the ranking.
    expect(r.tornado.bars[0].name).toBe('contactAngle');
  });

  it('uptake band grows with time and brackets the nominal curve (property)', () => {
    const times = [1, 10, 60, 300, 600];
    const r = uptakeBand({
      ...base,
      times,
      tolerances: { radius: { kind: 'uniform', min: 35e-6, max: 45e-6 }, surfaceTension: { kind: 'normal', sd: 0.002 } },
      samples: 3000,
    });
    for (let i = 0; i < times.length; i++) {
      expect(r.p10[i]).toBeLessThan(r.nominalOutput?.[i] ?? 0);
      expect(r.p90[i]).toBeGreaterThan(r.nominalOutput?.[i] ?? 0);
      if (i > 0) expect(r.p50[i]).toBeGreaterThan(r.p50[i - 1]);
    }
  });
});
