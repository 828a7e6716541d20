import { DomainError } from '../errors';
import { laplaceModels } from './models';
import {
  laplaceBubble,
  laplaceCylinder,
  laplaceSphere,
  slitMeniscus,
  tubeMeniscus,
  youngLaplace,
} from './young-laplace';

const deg = (d: number): number => (d * Math.PI) / 180;
const codes = (r: { warnings: readonly { code: string }[] }): string[] => r.warnings.map((w) => w.code);

describe('Young–Laplace: identities between the special cases', () => {
  const gamma = 0.0728;

  it('sphere equals the general equation with R1 = R2', () => {
    // Identity: ΔP = γ(1/R + 1/R) = 2γ/R.
    for (const R of [1e-6, 3.3e-4, 0.02]) {
      expect(laplaceSphere({ surfaceTension: gamma, radius: R }).pressure).toBeCloseTo(
        youngLaplace({ surfaceTension: gamma, radius1: R, radius2: R }).pressure,
        9,
      );
    }
  });

  it('cylinder equals the general equation with R2 → ∞', () => {
    // Identity: 1/R2 → 0.
    const R = 2e-4;
    const cyl = laplaceCylinder({ surfaceTension: gamma, radius: R }).pressure;
    expect(youngLaplace({ surfaceTension: gamma, radius1: R }).pressure).toBe(cyl);
    const nearlyFlat = youngLaplace({ surfaceTension: gamma, radius1: R, radius2: 1e9 }).pressure;
    expect(Math.abs(nearlyFlat - cyl) / cyl).toBeLessThan(1e-12);
  });

  it('a bubble with two surfaces has twice the pressure of a droplet', () => {
    // Identity: 4γ/R = 2 · (2γ/R).
    for (const R of [5e-4, 0.01]) {
      expect(laplaceBubble({ surfaceTension: 0.025, radius: R }).pressure).toBeCloseTo(
        2 * laplaceSphere({ surfaceTension: 0.025, radius: R }).pressure,
        10,
      );
    }
  });

  it('a saddle with R1 = −R2 has no pressure jump (minimal surface)', () => {
    // Identity: mean curvature zero.
    expect(youngLaplace({ surfaceTension: gamma, radius1: 1e-3, radius2: -1e-3 }).pressure).toBe(0);
  });

  it('a concave surface (negative radii) has the opposite sign of the convex one', () => {
    // Symmetry of ΔP = γ(1/R1 + 1/R2) under R → −R.
    const convex = youngLaplace({ surfaceTension: gamma, radius1: 1e-4, radius2: 2e-4 }).pressure;
    const concave = youngLaplace({ surfaceTension: gamma, radius1: -1e-4, radius2: -2e-4 }).pressure;
    expect(concave).toBe(-convex);
  });

  it('a slit of gap w equals a tube of radius w, and half a tube whose diameter is w', () => {
    // Identity: 2γcosθ/w vs 2γcosθ/r.
    for (const theta of [0, deg(40), deg(75)]) {
      const w = 1e-4;
      const slit = slitMeniscus({ surfaceTension: gamma, contactAngle: theta, gap: w }).pressure;
      expect(slit).toBeCloseTo(tubeMeniscus({ surfaceTension: gamma, contactAngle: theta, radius: w }).pressure, 9);
      expect(slit).toBeCloseTo(tubeMeniscus({ surfaceTension: gamma, contactAngle: theta, radius: w / 2 }).pressure / 2, 9);
    }
  });

  it('the tube meniscus is a spherical cap of radius r/cos θ', () => {
    // Identity: 2γcosθ/r = 2γ/(r/cosθ).
    const tube = tubeMeniscus({ surfaceTension: gamma, contactAngle: deg(50), radius: 3e-5 });
    expect(tube.meniscusRadius).not.toBeNull();
    expect(tube.pressure).toBeCloseTo(laplaceSphere({ surfaceTension: gamma, radius: tube.meniscusRadius! }).pressure, 9);
    // Between plates the meniscus is a cylinder of radius w/(2 cos θ).
    const slit = slitMeniscus({ surfaceTension: gamma, contactAngle: deg(50), gap: 3e-5 });
    expect(slit.pressure).toBeCloseTo(laplaceCylinder({ surfaceTension: gamma, radius: slit.meniscusRadius! }).pressure, 9);
  });

  it('scales with cos θ: 60° gives half of 0°, and θ ↔ 180° − θ flips the sign', () => {
    // cos 60° = 1/2 exactly; cos(π − θ) = −cos θ.
    const p0 = tubeMeniscus({ surfaceTension: gamma, contactAngle: 0, radius: 1e-5 }).pressure;
    expect(tubeMeniscus({ surfaceTension: gamma, contactAngle: deg(60), radius: 1e-5 }).pressure).toBeCloseTo(p0 / 2, 6);
    const a = tubeMeniscus({ surfaceTension: gamma, contactAngle: deg(30), radius: 1e-5 }).pressure;
    const b = tubeMeniscus({ surfaceTension: gamma, contactAngle: deg(150), radius: 1e-5 }).pressure;
    expect(b).toBeCloseTo(-a, 6);
  });

  it('falls as the radius grows (property)', () => {
    let prev = Infinity;
    for (let r = 1e-7; r < 1e-2; r *= 1.7) {
      const p = tubeMeniscus({ surfaceTension: gamma, contactAngle: deg(20), radius: r }).pressure;
      expect(p).toBeLessThan(prev);
      expect(p * r).toBeCloseTo(2 * gamma * Math.cos(deg(20)), 12);
      prev = p;
    }
  });
});

describe('Young–Laplace: worked numbers', () => {
  it('OpenStax College Physics Ex. 11.12: a 1.41e-7 m tube holds a 100 m sap column', () => {
    // OpenStax College Physics, Ex. 11.12: γ = 0.0728 N/m, θ = 0, ρ = 1050 kg/m³, g = 9.80 m/s²,
    // h = 100 m → r = 1.41 × 10⁻⁷ m; the meniscus pressure balances ρgh (r rounded to 3 digits).
    const p = tubeMeniscus({ surfaceTension: 0.0728, contactAngle: 0, radius: 1.41e-7 }).pressure;
    const rhoGh = 1050 * 9.8 * 100;
    expect(Math.abs(p - rhoGh) / rhoGh).toBeLessThan(0.005);
  });

  it('water droplets: 144 Pa at 1 mm, 1.44 bar at 1 µm', () => {
    // Butt, Graf & Kappl, Physics and Chemistry of Interfaces (2003) Ch. 2, from memory:
    // γ = 72 mN/m; 1 mm → 144 Pa; 1 µm → 1.44 × 10⁵ Pa; 10 nm → 144 bar.
    expect(laplaceSphere({ surfaceTension: 0.072, radius: 1e-3 }).pressure).toBeCloseTo(144, 9);
    expect(laplaceSphere({ surfaceTension: 0.072, radius: 1e-6 }).pressure).toBeCloseTo(1.44e5, 6);
    expect(laplaceSphere({ surfaceTension: 0.072, radius: 10e-9 }).pressure).toBeCloseTo(1.44e7, 3);
  });
});

describe('Young–Laplace: warnings and errors', () => {
  it('warns that a non-wetting liquid does not enter by itself', () => {
    const r = tubeMeniscus({ surfaceTension: 0.0728, contactAngle: deg(110), radius: 1e-5 });
    expect(r.pressure).toBeLessThan(0);
    expect(codes(r)).toContain('non-wetting');
    expect(r.meniscusRadius!).toBeLessThan(0);
  });

  it('reports a flat meniscus at 90° without an infinite radius', () => {
    const r = slitMeniscus({ surfaceTension: 0.0728, contactAngle: Math.PI / 2, gap: 1e-4 });
    expect(r.pressure).toBe(0);
    expect(r.meniscusRadius).toBeNull();
    expect(codes(r)).toContain('flat-meniscus');
  });

  it('warns below 10 nm', () => {
    expect(codes(laplaceSphere({ surfaceTension: 0.072, radius: 2e-9 }))).toContain('nanoscale');
    expect(codes(laplaceSphere({ surfaceTension: 0.072, radius: 2e-6 }))).toEqual([]);
  });

  it('refuses zero radii, non-positive surface tension and impossible angles', () => {
    expect(() => youngLaplace({ surfaceTension: 0.07, radius1: 0 })).toThrowError(DomainError);
    expect(() => youngLaplace({ surfaceTension: 0.07, radius1: 1e-3, radius2: 0 })).toThrowError(DomainError);
    expect(() => laplaceSphere({ surfaceTension: 0, radius: 1e-3 })).toThrowError(DomainError);
    expect(() => laplaceSphere({ surfaceTension: 0.07, radius: -1e-3 })).toThrowError(DomainError);
    expect(() => tubeMeniscus({ surfaceTension: 0.07, contactAngle: deg(200), radius: 1e-3 })).toThrowError(DomainError);
    expect(() => tubeMeniscus({ surfaceTension: 0.07, contactAngle: Number.NaN, radius: 1e-3 })).toThrowError(DomainError);
  });

  it('echoes the inputs and runs through the model registry', () => {
    const model = laplaceModels.find((m) => m.id === 'capillary-pressure-tube')!;
    const r = model.run({ surfaceTension: 0.072, contactAngle: 0, radius: 1e-3 }) as { pressure: number; inputs: unknown };
    // 2γ/r = 2 · 0.072 / 1e-3 = 144 Pa.
    expect(r.pressure).toBeCloseTo(144, 9);
    expect(r.inputs).toEqual({ surfaceTension: 0.072, contactAngle: 0, radius: 1e-3 });
    expect(new Set(laplaceModels.map((m) => m.id)).size).toBe(laplaceModels.length);
  });
});
