import { DomainError } from '../errors';
import { createRng } from '../tolerance/prng';
import { gravityHeight } from '../washburn/gravity';
import { fitGravityWashburn } from './gravity-fit';
import { gravityHeightDerivatives } from './gravity-jacobian';

const G = 9.80665;

describe('gravity-restrained Washburn fit', () => {
  it('analytic derivatives agree with central differences of the exact solution (identity)', () => {
    const a = 3e-5;
    const b = 5e-4;
    for (const t of [0.01, 1, 30, 60, 200, 1000]) {
      const h = gravityHeight(a, b, t);
      const [da, db] = gravityHeightDerivatives(a, b, h);
      const ea = a * 1e-6;
      const eb = b * 1e-6;
      const fa = (gravityHeight(a + ea, b, t) - gravityHeight(a - ea, b, t)) / (2 * ea);
      const fb = (gravityHeight(a, b + eb, t) - gravityHeight(a, b - eb, t)) / (2 * eb);
      expect(da / fa).toBeCloseTo(1, 7);
      expect(db / fb).toBeCloseTo(1, 7);
    }
    // b = 0 limits: ∂h/∂a = h/(2a) and ∂h/∂b = −h²/(3a) (from h = √(2at), t ≈ h²/(2a) + b h³/(3a²)).
    const h0 = gravityHeight(a, 0, 10);
    const [da0, db0] = gravityHeightDerivatives(a, 0, h0);
    expect(da0).toBeCloseTo(h0 / (2 * a), 10);
    expect(db0 / (-(h0 * h0) / (3 * a))).toBeCloseTo(1, 14);
  });

  it('recovers a and b exactly from noise-free synthetic data', () => {
    const a = 4e-5;
    const b = 4e-4; // h_eq 0.1 m, t* 250 s
    const t = Array.from({ length: 60 }, (_, i) => (i + 1) * 10);
    const r = fitGravityWashburn({ time: t, values: t.map((x) => gravityHeight(a, b, x)) });
    expect(r.a.value / a).toBeCloseTo(1, 9);
    expect(r.b.value / b).toBeCloseTo(1, 9);
    expect(r.equilibrium?.value ?? 0).toBeCloseTo(0.1, 10);
    expect(r.characteristicTime ?? 0).toBeCloseTo(250, 5);
    expect(r.washburnCoefficient.value / (2 * a)).toBeCloseTo(1, 9);
    expect(r.warnings).toEqual([]);
  });

  it('noisy synthetic curves: true a, b and h_eq fall inside the 95 % intervals at the expected rate', () => {
    // 30 seeded data sets, 1 mm Gaussian noise. Inside-count binomial(30, 0.95): fewer than 25 has
    // probability 0.3 % (binomial distribution, computed) for a correct linearised interval.
    const a = 4e-5;
    const b = 4e-4;
    const t = Array.from({ length: 50 }, (_, i) => (i + 1) * 12);
    let inA = 0;
    let inB = 0;
    let inEq = 0;
    for (let seed = 1; seed <= 30; seed++) {
      const rng = createRng(seed);
      const h = t.map((x) => gravityHeight(a, b, x) + 1e-3 * rng.nextNormal());
      const r = fitGravityWashburn({ time: t, values: h });
      if (r.a.ci95[0] <= a && a <= r.a.ci95[1]) inA++;
      if (r.b.ci95[0] <= b && b <= r.b.ci95[1]) inB++;
      const eq = r.equilibrium;
      if (eq && eq.ci95[0] <= 0.1 && 0.1 <= eq.ci95[1]) inEq++;
      // The residual sd must estimate the 1 mm noise: rmse within ±30 % (χ² with 48 dof).
      expect(r.rmse).toBeGreaterThan(0.7e-3);
      expect(r.rmse).toBeLessThan(1.3e-3);
    }
    expect(inA).toBeGreaterThanOrEqual(25);
    expect(inB).toBeGreaterThanOrEqual(25);
    expect(inEq).toBeGreaterThanOrEqual(25);
  });

  it('capillary picture: static and dynamic radii return the radius that generated the data', () => {
    // a = γ r cosθ/(4η), b = ρ g r²/(8η) (Washburn 1921) for r = 30 µm, γ = 0.03 N/m, θ = 40°, η = 2 mPa·s, ρ = 850.
    const r0 = 30e-6;
    const gamma = 0.03;
    const theta = (40 * Math.PI) / 180;
    const eta = 2e-3;
    const rho = 850;
    const a = (gamma * r0 * Math.cos(theta)) / (4 * eta);
    const b = (rho * G * r0 * r0) / (8 * eta);
    const tStar = a / (b * b);
    const t = Array.from({ length: 40 }, (_, i) => ((i + 1) * 4 * tStar) / 40);
    const fit = fitGravityWashburn({
      time: t,
      values: t.map((x) => gravityHeight(a, b, x)),
      surfaceTension: gamma,
      contactAngle: theta,
      density: rho,
      viscosity: eta,
    });
    expect((fit.capillary?.staticRadius?.value ?? 0) / r0).toBeCloseTo(1, 8);
    expect((fit.capillary?.dynamicRadius.value ?? 0) / r0).toBeCloseTo(1, 8);
    // Jurin: h_eq = 2γcosθ/(ρ g r).
    expect((fit.equilibrium?.value ?? 0) / ((2 * gamma * Math.cos(theta)) / (rho * G * r0))).toBeCloseTo(1, 8);
  });

  it('porous-layer picture: permeability and capillary pressure return the generating values', () => {
    // a = k Pc/(εη), b = kρg/(εη) (Darcy, saturated behind the front).
    const k = 2e-11;
    const pc = 1500;
    const eps = 0.85;
    const eta = 1e-3;
    const rho = 1000;
    const a = (k * pc) / (eps * eta);
    const b = (k * rho * G) / (eps * eta);
    const tStar = a / (b * b);
    const t = Array.from({ length: 40 }, (_, i) => ((i + 1) * 5 * tStar) / 40);
    const fit = fitGravityWashburn({
      time: t,
      values: t.map((x) => gravityHeight(a, b, x)),
      density: rho,
      viscosity: eta,
      porosity: eps,
    });
    expect((fit.porousLayer?.permeability.value ?? 0) / k).toBeCloseTo(1, 8);
    expect((fit.porousLayer?.capillaryPressure.value ?? 0) / pc).toBeCloseTo(1, 8);
    expect(fit.capillary).toBeNull();
  });

  it('warns when the record stops far below equilibrium', () => {
    const a = 4e-5;
    const b = 4e-4;
    // Up to t = 40 s: h ≈ 0.046 m, under half of h_eq = 0.1 m.
    const t = Array.from({ length: 40 }, (_, i) => i + 1);
    const rng = createRng(77);
    const r = fitGravityWashburn({ time: t, values: t.map((x) => gravityHeight(a, b, x) + 2e-4 * rng.nextNormal()) });
    expect(r.warnings.map((w) => w.code)).toContain('equilibrium-not-approached');
    expect(r.approachToEquilibrium ?? 1).toBeLessThan(0.6);
  });

  it('reports no equilibrium when the data show no gravity slowing', () => {
    const t = Array.from({ length: 30 }, (_, i) => (i + 1) * 2);
    const rng = createRng(5);
    const r = fitGravityWashburn({ time: t, values: t.map((x) => Math.sqrt(4e-5 * x) * (1 + 0.01 * rng.nextNormal())) });
    expect(r.equilibrium).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('no-gravity-slowing');
    expect(r.a.value / 2e-5).toBeCloseTo(1, 1);
  });

  it('refuses too few points and bad series', () => {
    expect(() => fitGravityWashburn({ time: [1, 2, 3], values: [0.01, 0.015, 0.018] })).toThrowError(DomainError, /at least 4/);
    expect(() => fitGravityWashburn({ time: [1, 2, 3, 3], values: [0.01, 0.015, 0.018, 0.02] })).toThrowError(DomainError);
  });
});
