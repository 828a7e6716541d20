import { DomainError } from '../errors';
import { fitPoreSizeRetention } from './pore-size-fit';

/** Volume fractions of a capillary bundle whose cumulative "finer" curve follows a given Se(Pc). */
function classesFrom(se: (pc: number) => number, diameters: number[], wettingTension: number): number[] {
  const cumulative = diameters.map((d, j) => (j === diameters.length - 1 ? 1 : se((4 * wettingTension) / d)));
  return cumulative.map((c, j) => c - (j > 0 ? cumulative[j - 1] : 0));
}

describe('stack pore-size retention (capillary bundle)', () => {
  const gamma = 0.072;
  const diameters = [5, 10, 20, 40, 60, 80, 120, 160, 240, 400].map((d) => d * 1e-6);

  it('recovers the van Genuchten α and n of a bundle built from that curve', () => {
    // Capillary bundle: at Pc the pores with d ≤ 4γcosθ/Pc are full (Young–Laplace for a cylinder),
    // so cumulative fractions sampled from Se = [1 + (αPc)^n]^(−m) must give back α and n. The largest
    // class (4 mm, Se = 1 − 4e-5 on the curve, 1 in the table) adds a bias far below the tolerance.
    const alpha = 1 / 3000;
    const n = 2.6;
    const d = [...diameters, 4000e-6];
    const se = (pc: number) => Math.pow(1 + Math.pow(alpha * pc, n), -(1 - 1 / n));
    const fit = fitPoreSizeRetention({ diameters: d, fractions: classesFrom(se, d, gamma), surfaceTension: gamma, contactAngle: 0 });
    expect(fit.alpha / alpha).toBeCloseTo(1, 3);
    expect(fit.n / n).toBeCloseTo(1, 3);
    expect(fit.rmsResidual).toBeLessThan(1e-4);
    expect(fit.pressures.length).toBe(d.length);
    expect(fit.pressures[0]).toBeCloseTo((4 * gamma) / 5e-6, 6);
    expect(fit.warnings.length).toBe(0);
  });

  it('scales the fitted α with 1/cos θ (Young–Laplace)', () => {
    // Pc = 4γcosθ/d: halving cos θ halves every pressure, so α doubles and n is unchanged.
    const se = (pc: number) => Math.pow(1 + Math.pow(pc / 2000, 3), -(2 / 3));
    const fractions = classesFrom(se, diameters, gamma);
    const wet = fitPoreSizeRetention({ diameters, fractions, surfaceTension: gamma, contactAngle: 0 });
    const partial = fitPoreSizeRetention({ diameters, fractions, surfaceTension: gamma, contactAngle: Math.PI / 3 });
    expect(partial.alpha / wet.alpha).toBeCloseTo(2, 6);
    expect(partial.n).toBeCloseTo(wet.n, 6);
  });

  it('accepts cumulative input forms with the same result', () => {
    const se = (pc: number) => Math.pow(1 + Math.pow(pc / 2000, 3), -(2 / 3));
    const f = classesFrom(se, diameters, gamma);
    let s = 0;
    const finer = f.map((x) => (s += x));
    const a = fitPoreSizeRetention({ diameters, fractions: f, surfaceTension: gamma, contactAngle: 0 });
    const b = fitPoreSizeRetention({ diameters, fractions: finer, form: 'cumulative-finer', surfaceTension: gamma, contactAngle: 0 });
    expect(b.alpha).toBeCloseTo(a.alpha, 10);
    expect(b.n).toBeCloseTo(a.n, 8);
  });

  it('warns when a bimodal distribution is only loosely summarised', () => {
    const fractions = [0.5, 0, 0, 0, 0, 0, 0, 0, 0.5, 0];
    const fit = fitPoreSizeRetention({ diameters, fractions, surfaceTension: gamma, contactAngle: 0 });
    expect(fit.warnings.some((w) => w.code === 'psd-fit-loose')).toBeTrue();
    expect(Number.isFinite(fit.alpha) && Number.isFinite(fit.n)).toBeTrue();
  });

  it('refuses too few classes, non-wetting contact angles and bad surface tension', () => {
    const d = [10e-6, 20e-6, 30e-6];
    expect(() => fitPoreSizeRetention({ diameters: d, fractions: [0, 0.5, 0.5], surfaceTension: gamma, contactAngle: 0 })).toThrowMatching(
      (e) => e instanceof DomainError && e.code === 'insufficient-data',
    );
    expect(() =>
      fitPoreSizeRetention({ diameters, fractions: diameters.map(() => 0.1), surfaceTension: gamma, contactAngle: Math.PI / 2 }),
    ).toThrowMatching((e) => e instanceof DomainError && e.field === 'contactAngle');
    expect(() =>
      fitPoreSizeRetention({ diameters, fractions: diameters.map(() => 0.1), surfaceTension: -1, contactAngle: 0 }),
    ).toThrowMatching((e) => e instanceof DomainError && e.field === 'surfaceTension');
  });
});
