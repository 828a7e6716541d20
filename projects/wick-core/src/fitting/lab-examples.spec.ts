import { DomainError } from '../errors';
import { createRng } from '../tolerance/prng';
import { gravityHeight } from '../washburn/gravity';
import { referenceLiquidContactAngle } from './contact-angle';
import { fitGravityWashburn } from './gravity-fit';
import { replicateStatistics } from './replicates';
import { fitWashburnSlope } from './washburn-slope';

/*
 * Checks of the lab-data fits against values from outside the fitting code: the published explicit solution of
 * capillary rise with gravity, and worked examples of the reference-liquid method in its height form.
 */
describe('lab-data fits against published values', () => {
  it('the gravity fit returns h_eq and t* from points of the published explicit solution', () => {
    // Fries & Dreyer, J. Colloid Interface Sci. 320 (2008) 259: H = h/h_eq = 1 + W₀(−exp(−1 − T)), T = t/t*.
    // Rows evaluated in 30-digit arithmetic (REFERENCES.md, "Lucas–Washburn with gravity"):
    // T = 0.01 → H = 0.134834751067; T = 1 → 0.841405660437; T = 5 → 0.997515080665. Plus h(0) = 0.
    // A strip with h_eq = 80 mm and t* = 120 s: a = h_eq²/t*, b = h_eq/t* (h_eq = a/b, t* = a/b²).
    const hEq = 0.08;
    const tStar = 120;
    const T = [0, 0.01, 1, 5];
    const H = [0, 0.134834751067, 0.841405660437, 0.997515080665];
    const fit = fitGravityWashburn({ time: T.map((x) => x * tStar), values: H.map((x) => x * hEq) });
    // 12 printed digits of H bound the agreement to about 1e-9 relative.
    expect((fit.equilibrium?.value ?? 0) / hEq).toBeCloseTo(1, 8);
    expect((fit.characteristicTime ?? 0) / tStar).toBeCloseTo(1, 7);
    expect(fit.a.value / (hEq * hEq / tStar)).toBeCloseTo(1, 7);
    expect(fit.b.value / (hEq / tStar)).toBeCloseTo(1, 7);
    expect(fit.rSquared).toBeCloseTo(1, 12);
  });

  it('the Washburn slope of the early published rows is 2a, biased low by gravity as documented', () => {
    // Early-time expansion of the same solution: h² ≈ 2 a t (Washburn 1921), so d(h²)/dt → 2a as T → 0.
    // At T = 0.01 the published H = 0.134834751067 gives H²/T = 1.818 (2a·t*/h_eq² = 2 would be the no-gravity value).
    const H = 0.134834751067;
    const hEq = 0.1;
    const tStar = 100;
    const a = (hEq * hEq) / tStar;
    const times = [0.25, 0.5, 1].map((f) => f * 0.01 * tStar);
    const heights = times.map((t) => gravityHeight(a, hEq / tStar, t));
    // The generated point at T = 0.01 reproduces the published row (independent evaluation of W₀).
    expect(heights[2] / hEq).toBeCloseTo(H, 11);
    const slope = fitWashburnSlope({ time: times, values: heights, window: 'all' }).slope;
    expect(slope).toBeLessThan(2 * a);
    // d(h²)/dt = 2a(1 − H) (from dh/dt = a/h − b): the fitted slope lies between its values at both ends.
    expect(slope).toBeGreaterThan(2 * a * (1 - H));
  });

  it('reference-liquid method, height form: worked example with a capillary-bundle strip', () => {
    /*
     * Worked example (identity of h² = γ r cosθ t/(2η), Washburn 1921), r_eff = 20 µm:
     * n-hexane γ = 17.9 mN/m (CRC Handbook, 20 °C), η = 0.300 mPa·s (25 °C, from memory):
     *   K_ref = γ r/(2η) = 0.0179 · 20e-6 / 6.0e-4 = 5.9666667e-4 m²/s → C_h = K_ref η/γ = 10 µm = r_eff/2.
     * Water γ = 72.74 mN/m (IAPWS R1-76, 20 °C), η = 1.0016 mPa·s (ISO/TR 3666, 20 °C, from memory), θ = 50°:
     *   K = 0.07274 · 20e-6 · cos 50° / (2 · 1.0016e-3) = 4.6681680e-4 m²/s → cos θ = 0.642788, θ = 50°.
     */
    const hexane = { surfaceTension: 0.0179, viscosity: 0.3e-3 };
    const water = { surfaceTension: 0.07274, viscosity: 1.0016e-3 };
    const kRef = 5.9666667e-4;
    const kWater = 4.668168e-4;
    const r = referenceLiquidContactAngle({
      quantity: 'height',
      reference: { ...hexane, slopes: [kRef] },
      test: { ...water, slopes: [kWater] },
    });
    // Hand values above, rounded to 8 digits: C_h and cos θ to 1e-6, θ to 0.001°.
    expect(r.materialConstant.mean / 10e-6).toBeCloseTo(1, 6);
    expect(r.cosTheta.mean).toBeCloseTo(0.642788, 6);
    expect((r.contactAngle * 180) / Math.PI).toBeCloseTo(50, 3);
    expect(r.caution).toMatch(/flammable/);
  });

  it('height and mass forms agree on the same strips (m = ρ ε A h, so C = (εA)² C_h)', () => {
    // Capillary bundle: C = (εA)² r_eff/2 (REFERENCES.md, "Washburn contact-angle method", exact).
    const epsA = 0.85 * 25e-3 * 1e-3; // porosity × strip cross-section 25 mm × 1 mm, m²
    const rEff = 35e-6;
    const hexane = { surfaceTension: 0.0179, viscosity: 0.3e-3, density: 659.4 };
    const saline = { surfaceTension: 0.07299, viscosity: 1.02e-3, density: 1004.6 };
    const cos = 0.7;
    const kh = (l: typeof hexane, c: number) => (l.surfaceTension * rEff * c) / (2 * l.viscosity);
    const km = (l: typeof hexane, c: number) => (l.density * epsA) ** 2 * kh(l, c);
    const rng = createRng(11);
    const noisy = (k: number) => [0, 1, 2].map(() => k * (1 + 0.03 * rng.nextNormal()));
    const refH = noisy(kh(hexane, 1));
    const testH = noisy(kh(saline, cos));
    const byHeight = referenceLiquidContactAngle({
      quantity: 'height',
      reference: { ...hexane, slopes: refH },
      test: { ...saline, slopes: testH },
    });
    const byMass = referenceLiquidContactAngle({
      reference: { ...hexane, slopes: refH.map((k) => (hexane.density * epsA) ** 2 * k) },
      test: { ...saline, slopes: testH.map((k) => (saline.density * epsA) ** 2 * k) },
    });
    expect(byMass.cosTheta.mean).toBeCloseTo(byHeight.cosTheta.mean, 12);
    expect(byMass.materialConstant.mean / (epsA * epsA * byHeight.materialConstant.mean)).toBeCloseTo(1, 12);
    expect(km(hexane, 1) / kh(hexane, 1)).toBeCloseTo((hexane.density * epsA) ** 2, 12);
    // 3 % noise per run: the true cos θ lies within about 3 combined standard uncertainties.
    expect(Math.abs(byHeight.cosTheta.mean - cos)).toBeLessThan(3 * byHeight.cosTheta.uncertainty + 1e-12);
  });

  it('height form needs no density; the mass form still refuses a missing one', () => {
    const runs = { surfaceTension: 0.0179, viscosity: 0.3e-3, slopes: [1e-4] };
    expect(() => referenceLiquidContactAngle({ quantity: 'height', reference: runs, test: runs })).not.toThrow();
    expect(() => referenceLiquidContactAngle({ reference: runs, test: runs })).toThrowError(DomainError);
    expect(() =>
      referenceLiquidContactAngle({ quantity: 'volume' as unknown as 'mass', reference: runs, test: runs }),
    ).toThrowError(DomainError, /quantity/);
  });

  it('replicate runs of seeded noisy curves: each h_eq within 3 standard errors of the truth, a deviant run flagged', () => {
    // Three replicates generated from a = 3e-5 m²/s, b = 5e-4 m/s (h_eq 60 mm) with 0.5 mm seeded noise, and a
    // fourth run whose strip wicked at half the rate (a/2): the modified z-score (Iglewicz & Hoaglin 1993) flags it.
    const a = 3e-5;
    const b = 5e-4;
    const t = Array.from({ length: 40 }, (_, i) => (i + 1) * 15);
    const runs = [1, 2, 3, 4, 5].map((seed) => {
      const rng = createRng(100 + seed);
      const aRun = seed === 5 ? a / 2 : a;
      return fitGravityWashburn({ time: t, values: t.map((x) => gravityHeight(aRun, b, x) + 5e-4 * rng.nextNormal()) });
    });
    // Each of the four like runs: |ĥ_eq − h_eq| < 3 se (a 99.7 % band for a correct linearised standard error).
    for (const r of runs.slice(0, 4)) {
      const eq = r.equilibrium!;
      expect(Math.abs(eq.value - a / b)).toBeLessThan(3 * eq.stdError);
    }
    const stats = replicateStatistics({ values: runs.map((r) => r.a.value) });
    expect(stats.outliers).toEqual([4]);
    expect(stats.withoutOutliers.mean / a).toBeCloseTo(1, 1);
  });
});
