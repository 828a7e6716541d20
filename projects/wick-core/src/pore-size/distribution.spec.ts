import { DomainError, type ModelWarning } from '../errors';
import { createRng } from '../tolerance/prng';
import { cumulativeToDifferential, differentialToCumulative, preparePoreSizeDistribution } from './distribution';

describe('pore-size distribution input', () => {
  const um = 1e-6;
  const diameters = [5 * um, 10 * um, 20 * um, 40 * um];

  it('cumulative ↔ differential conversion round-trips in both conventions (identity)', () => {
    const rng = createRng(12);
    for (let rep = 0; rep < 20; rep++) {
      const f = Array.from({ length: 12 }, () => rng.next());
      for (const conv of ['finer', 'coarser'] as const) {
        const back = cumulativeToDifferential(differentialToCumulative(f, conv), conv);
        for (let i = 0; i < f.length; i++) expect(back[i]).toBeCloseTo(f[i], 14);
      }
    }
  });

  it('reads "fraction finer" and "fraction coarser" tables of the same distribution identically', () => {
    const f = [0.1, 0.4, 0.3, 0.2];
    // By definition: finer Fᵢ = Σ_{j≤i} fⱼ = 0.1, 0.5, 0.8, 1; coarser Gᵢ = Σ_{j≥i} fⱼ = 1, 0.9, 0.5, 0.2.
    const w: ModelWarning[] = [];
    const a = preparePoreSizeDistribution({ diameters, fractions: f, form: 'differential' }, w);
    const b = preparePoreSizeDistribution({ diameters, fractions: [0.1, 0.5, 0.8, 1], form: 'cumulative-finer' }, w);
    const c = preparePoreSizeDistribution({ diameters, fractions: [1, 0.9, 0.5, 0.2], form: 'cumulative-coarser' }, w);
    for (let i = 0; i < 4; i++) {
      expect(b.fractions[i]).toBeCloseTo(f[i], 14);
      expect(c.fractions[i]).toBeCloseTo(f[i], 14);
    }
    [0.1, 0.5, 0.8, 1].forEach((v, i) => expect(a.cumulativeFiner[i]).toBeCloseTo(v, 14));
    expect(w).toEqual([]);
  });

  it('rescales a total within 5 % of 1 with a warning, silently within 1e-6', () => {
    const w: ModelWarning[] = [];
    const p = preparePoreSizeDistribution({ diameters, fractions: [0.1, 0.4, 0.3, 0.18], form: 'differential' }, w);
    expect(w.map((x) => x.code)).toEqual(['psd-normalised']);
    let s = 0;
    for (const v of p.fractions) s += v;
    expect(s).toBeCloseTo(1, 14);
    expect(p.fractions[1] / p.fractions[0]).toBeCloseTo(4, 12); // shape kept
    const quiet: ModelWarning[] = [];
    preparePoreSizeDistribution({ diameters, fractions: [0.1, 0.4, 0.3, 0.2 + 5e-7], form: 'differential' }, quiet);
    expect(quiet).toEqual([]);
  });

  it('refuses bad distributions with a DomainError naming the problem', () => {
    const w: ModelWarning[] = [];
    const bad = (fractions: number[], form: 'differential' | 'cumulative-finer' | 'cumulative-coarser', d = diameters) =>
      () => preparePoreSizeDistribution({ diameters: d, fractions, form }, w);
    expect(bad([0.2, -0.1, 0.5, 0.4], 'differential')).toThrowMatching((e) => e instanceof DomainError && e.code === 'negative');
    expect(bad([0.1, 0.6, 0.5, 1], 'cumulative-finer')).toThrowError(DomainError, /must not decrease/);
    expect(bad([1, 0.5, 0.6, 0.2], 'cumulative-coarser')).toThrowError(DomainError, /must not increase/);
    // Percentages typed as fractions: total 100, far beyond the 5 % tolerance.
    expect(bad([10, 40, 30, 20], 'differential')).toThrowError(DomainError, /not percentages/);
    expect(bad([0.1, 0.5, 0.8, 0.9], 'cumulative-finer')).toThrowError(DomainError, /total 0\.9/);
    expect(bad([0.25, 0.25, 0.25, 0.25], 'differential', [5 * um, 20 * um, 10 * um, 40 * um])).toThrowError(
      DomainError,
      /strictly increasing/,
    );
    expect(bad([0.5, 0.5], 'differential')).toThrowError(DomainError, /one fraction per diameter/);
    expect(bad([0, 0, 0, 0], 'differential')).toThrowError(DomainError);
    expect(bad([0.25, 0.25, 0.25, 0.25], 'differential', [0, 1, 2, 3])).toThrowError(DomainError);
  });
});
