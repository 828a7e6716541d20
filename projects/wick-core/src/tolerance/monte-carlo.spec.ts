import { DomainError } from '../errors';
import { monteCarlo, monteCarloCurve } from './monte-carlo';
import { summarize } from './statistics';

/**
 * Statistical checks use tolerances derived from sampling theory, wide enough (≥ 5 standard
 * errors) not to fail by chance yet narrow enough to catch a wrong distribution. Runs are seeded,
 * so each check is deterministic.
 */
const N = 100_000;

describe('Monte Carlo sampling of tolerance distributions', () => {
  const identity = (v: Readonly<Record<'x', number>>): number => v.x;

  it('normal: sample mean, sd and P10 match N(μ, σ²)', () => {
    const mu = 0.85;
    const sigma = 0.02;
    const r = monteCarlo(identity, { x: mu }, { x: { kind: 'normal', sd: sigma } }, { samples: N, seed: 11 });
    // Standard error of the mean σ/√N; of the sd ≈ σ/√(2N) (normal sampling theory).
    expect(Math.abs(r.statistics.mean - mu)).toBeLessThan((5 * sigma) / Math.sqrt(N));
    expect(Math.abs(r.statistics.sd - sigma)).toBeLessThan((5 * sigma) / Math.sqrt(2 * N));
    // P10 of a normal = μ − 1.2816σ (standard normal table z₀.₉ = 1.2816); quantile standard error
    // √(p(1−p)/N)/φ(z) = 0.0054σ at N = 10⁵ → allow 0.03σ.
    expect(Math.abs(r.statistics.p10 - (mu - 1.2816 * sigma))).toBeLessThan(0.03 * sigma);
    expect(r.failures.count).toBe(0);
    expect(r.warnings).toEqual([]);
  });

  it('uniform: P10 = min + 0.1(max − min), P90 = min + 0.9(max − min), sd = (max − min)/√12', () => {
    const a = 2e-6;
    const b = 6e-6;
    const r = monteCarlo(identity, { x: 4e-6 }, { x: { kind: 'uniform', min: a, max: b } }, { samples: N, seed: 5 });
    // Uniform quantile standard error √(p(1−p)/N)·(b − a) = 0.00095(b − a) → allow 0.005(b − a).
    expect(Math.abs(r.statistics.p10 - (a + 0.1 * (b - a)))).toBeLessThan(0.005 * (b - a));
    expect(Math.abs(r.statistics.p50 - (a + 0.5 * (b - a)))).toBeLessThan(0.005 * (b - a));
    expect(Math.abs(r.statistics.p90 - (a + 0.9 * (b - a)))).toBeLessThan(0.005 * (b - a));
    // Uniform variance (b − a)²/12 (exact).
    expect(Math.abs(r.statistics.sd / ((b - a) / Math.sqrt(12)) - 1)).toBeLessThan(0.01);
    expect(r.statistics.min).toBeGreaterThanOrEqual(a);
    expect(r.statistics.max).toBeLessThanOrEqual(b);
  });

  it('triangular: empirical distribution follows F(x) within the Dvoretzky–Kiefer–Wolfowitz bound', () => {
    const a = 10;
    const c = 13;
    const b = 20;
    const r = monteCarlo(identity, { x: c }, { x: { kind: 'triangular', min: a, max: b } }, {
      samples: N,
      seed: 9,
      keepSamples: true,
    });
    // Triangular CDF (Evans, Hastings & Peacock, Statistical Distributions, 3rd ed., triangular distribution):
    // F = (x − a)²/((b − a)(c − a)) for a ≤ x ≤ c; 1 − (b − x)²/((b − a)(b − c)) for c < x ≤ b.
    const F = (x: number): number =>
      x <= c ? (x - a) ** 2 / ((b - a) * (c - a)) : 1 - (b - x) ** 2 / ((b - a) * (b - c));
    // DKW inequality (Massart 1990): P(sup|Fₙ − F| > ε) ≤ 2e^(−2Nε²); ε = 0.0085 → ≤ 1e-6.
    const eps = 0.0085;
    const sorted = r.sortedOutputs as Float64Array;
    for (const x of [10.5, 11, 12, 13, 14, 16, 18, 19.5]) {
      let count = 0;
      while (count < sorted.length && sorted[count] <= x) count++;
      expect(Math.abs(count / sorted.length - F(x))).toBeLessThan(eps);
    }
    // Mean of the triangular distribution (a + b + c)/3 = 14.333…; sd √((a²+b²+c²−ab−ac−bc)/18).
    const sd = Math.sqrt((a * a + b * b + c * c - a * b - a * c - b * c) / 18);
    expect(Math.abs(r.statistics.mean - (a + b + c) / 3)).toBeLessThan((5 * sd) / Math.sqrt(N));
    expect(Math.abs(r.statistics.sd / sd - 1)).toBeLessThan(0.01);
  });

  it('truncated normal keeps porosity strictly inside (0, 1) and warns about the cut', () => {
    const r = monteCarlo(identity, { x: 0.95 }, { x: { kind: 'normal', sd: 0.05, lower: 0, upper: 1 } }, {
      samples: 20000,
      seed: 2,
    });
    expect(r.statistics.max).toBeLessThan(1);
    expect(r.statistics.min).toBeGreaterThan(0);
    // 1 − Φ(1) = 15.9 % of N(0.95, 0.05²) lies above 1 (standard normal table).
    expect(r.warnings.map((w) => w.code)).toContain('tolerance-truncated');
    expect(r.warnings[0].message).toContain('15.9 %');
  });

  it('same seed gives identical results; another seed differs slightly', () => {
    const f = (v: Readonly<Record<'r' | 'g', number>>): number => v.r * v.g;
    const tol = { r: { kind: 'normal', sd: 1e-6 }, g: { kind: 'uniform', min: 0.06, max: 0.07 } } as const;
    const nominal = { r: 20e-6, g: 0.065 };
    const r1 = monteCarlo(f, nominal, tol, { samples: 3000, seed: 123 });
    const r2 = monteCarlo(f, nominal, tol, { samples: 3000, seed: 123 });
    const r3 = monteCarlo(f, nominal, tol, { samples: 3000, seed: 124 });
    expect(r2.statistics).toEqual(r1.statistics);
    expect(r3.statistics.p50).not.toBe(r1.statistics.p50);
    // Key order does not change the draws.
    const r4 = monteCarlo(f, nominal, { g: tol.g, r: tol.r }, { samples: 3000, seed: 123 });
    expect(r4.statistics).toEqual(r1.statistics);
  });

  it('linear model: propagated sd = |slope|·sd (identity)', () => {
    const sigma = 0.3;
    const slope = -4.5;
    const lin = (v: Readonly<Record<'x', number>>): number => slope * v.x + 7;
    const r = monteCarlo(lin, { x: 2 }, { x: { kind: 'normal', sd: sigma } }, { samples: N, seed: 17 });
    const x = monteCarlo(identity, { x: 2 }, { x: { kind: 'normal', sd: sigma } }, { samples: N, seed: 17 });
    // Same seed → same x draws, so sd(y) = |slope|·sd(x) and y's P90 = slope·P10(x) + 7 hold to rounding.
    expect(r.statistics.sd).toBeCloseTo(Math.abs(slope) * x.statistics.sd, 10);
    expect(r.statistics.p90).toBeCloseTo(slope * x.statistics.p10 + 7, 10);
    // Against the population value |slope|·σ: standard error of the sd ≈ |slope|σ/√(2N).
    expect(Math.abs(r.statistics.sd - Math.abs(slope) * sigma)).toBeLessThan((5 * Math.abs(slope) * sigma) / Math.sqrt(2 * N));
    expect(r.nominalOutput).toBe(slope * 2 + 7);
  });

  it('counts samples the model refuses and reports them instead of crashing', () => {
    const sqrtModel = (v: Readonly<Record<'x', number>>): number => {
      if (v.x < 0) throw new DomainError('negative', 'x must not be negative');
      return Math.sqrt(v.x);
    };
    const r = monteCarlo(sqrtModel, { x: 0 }, { x: { kind: 'normal', sd: 1 } }, { samples: 10000, seed: 4 });
    // Half of N(0, 1) is negative: the count is binomial(10⁴, ½), sd 50.
    expect(Math.abs(r.failures.count - 5000)).toBeLessThan(250);
    expect(r.failures.byCode['negative']).toBe(r.failures.count);
    expect(r.statistics.n + r.failures.count).toBe(10000);
    expect(r.warnings.some((w) => w.code === 'samples-outside-validity')).toBeTrue();
    expect(r.statistics.min).toBeGreaterThanOrEqual(0);
  });

  it('propagates programming errors and refuses bad options', () => {
    const broken = (): number => {
      throw new TypeError('bug');
    };
    expect(() => monteCarlo(broken, { x: 1 }, { x: { kind: 'uniform', min: 0, max: 1 } })).toThrowError(TypeError);
    expect(() => monteCarlo(identity, { x: 1 }, { x: { kind: 'uniform', min: 1, max: 0 } })).toThrowError(DomainError);
    expect(() => monteCarlo(identity, { x: 1 }, { x: { kind: 'normal', sd: -1 } })).toThrowError(DomainError);
    expect(() => monteCarlo(identity, { x: 1 }, {})).toThrowError(DomainError);
    expect(() => monteCarlo(identity, { x: 1 }, { x: { kind: 'uniform', min: 0, max: 1 } }, { samples: 5 })).toThrowError(
      DomainError,
    );
    // A truncation window 20 sd away from the mean keeps essentially nothing.
    expect(() =>
      monteCarlo(identity, { x: 1 }, { x: { kind: 'normal', sd: 0.01, lower: 1.2, upper: 2 } }),
    ).toThrowError(DomainError, /keep almost none/);
    expect(() =>
      monteCarlo(() => {
        throw new DomainError('out-of-range', 'never valid');
      }, { x: 1 }, { x: { kind: 'uniform', min: 0, max: 1 } }),
    ).toThrowError(DomainError, /never valid/);
  });
});

describe('Monte Carlo curves', () => {
  const times = Float64Array.from({ length: 50 }, (_, i) => i + 1);
  const curve = (v: Readonly<Record<'k', number>>, out?: Float64Array): Float64Array => {
    const y = out ?? new Float64Array(times.length);
    for (let i = 0; i < times.length; i++) y[i] = v.k * Math.sqrt(times[i]);
    return y;
  };

  it('per-point bands equal the scalar percentiles of the same draws scaled by √t', () => {
    const tol = { k: { kind: 'triangular', min: 0.5, mode: 1, max: 2 } } as const;
    const c = monteCarloCurve(curve, { k: 1 }, tol, { samples: 4000, seed: 8 });
    const s = monteCarlo((v: Readonly<Record<'k', number>>) => v.k, { k: 1 }, tol, { samples: 4000, seed: 8 });
    // Identity: y = k√t is increasing in k, so every percentile of y is √t times that of k.
    for (const i of [0, 9, 49]) {
      const st = Math.sqrt(times[i]);
      expect(c.p10[i]).toBeCloseTo(s.statistics.p10 * st, 12);
      expect(c.p50[i]).toBeCloseTo(s.statistics.p50 * st, 12);
      expect(c.p90[i]).toBeCloseTo(s.statistics.p90 * st, 12);
      expect(c.mean[i]).toBeCloseTo(s.statistics.mean * st, 12);
      expect(c.sd[i]).toBeCloseTo(s.statistics.sd * st, 12);
    }
    expect(c.nominalOutput?.[3]).toBe(2);
  });

  it('bands are ordered and the band curves grow with time (property)', () => {
    const c = monteCarloCurve(curve, { k: 1 }, { k: { kind: 'normal', sd: 0.2, lower: 0 } }, { samples: 2000, seed: 1 });
    for (let i = 0; i < times.length; i++) {
      expect(c.p10[i]).toBeLessThanOrEqual(c.p50[i]);
      expect(c.p50[i]).toBeLessThanOrEqual(c.p90[i]);
      if (i > 0) expect(c.p90[i]).toBeGreaterThan(c.p90[i - 1]);
    }
  });

  it('matches a sort-based summary of one time point when some samples fail', () => {
    const picky = (v: Readonly<Record<'k', number>>, out?: Float64Array): Float64Array => {
      if (v.k > 1.3) throw new DomainError('out-of-range', 'k too large');
      return curve(v, out);
    };
    const tol = { k: { kind: 'uniform', min: 0.5, max: 1.5 } } as const;
    const c = monteCarloCurve(picky, { k: 1 }, tol, { samples: 5000, seed: 21 });
    const s = monteCarlo((v: Readonly<Record<'k', number>>) => picky(v)[24], { k: 1 }, tol, { samples: 5000, seed: 21, keepSamples: true });
    expect(c.n).toBe(s.statistics.n);
    expect(c.failures.count).toBe(s.failures.count);
    const check = summarize(s.sortedOutputs as Float64Array);
    expect(c.p90[24]).toBeCloseTo(check.p90, 12);
    expect(c.p10[24]).toBeCloseTo(check.p10, 12);
    // 20 % of U(0.5, 1.5) lies above 1.3; binomial sd √(5000·0.2·0.8) = 28.
    expect(Math.abs(c.failures.count - 1000)).toBeLessThan(150);
  });
});
