import { DomainError } from '../errors';
import { radialRadius, radialSpreading, radialTime, type RadialSpreadInput, type RadialSpreadOk } from './radial';

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

// Invented sheet: k = 2e-11 m², ε = 0.8, Pc = 3 kPa, water η = 1 mPa·s, fed spot r0 = 5 mm.
const A = (2e-11 * 3000) / (0.8 * 1e-3); // a = k Pc/(ε η) = 7.5e-5 m²/s
const R0 = 0.005;

describe('radial spreading from a fed spot', () => {
  it('satisfies R² ln(R/r0) − (R² − r0²)/2 = 2at (Marmur 1988; Danino & Marmur 1994)', () => {
    // Unlimited-reservoir radial Darcy law, derived in radial.ts (from memory for the citation).
    for (const t of [0.01, 1, 30, 600, 36000]) {
      const r = radialRadius(A, R0, t);
      const lhs = r * r * Math.log(r / R0) - (r * r - R0 * R0) / 2;
      expect(rel(lhs, 2 * A * t)).toBeLessThan(1e-12);
    }
  });

  it('starts as the planar Washburn law (R − r0)² = 2at', () => {
    // For R → r0 the ring is locally a strip: R² ln(R/r0) − (R² − r0²)/2 = (R − r0)² + O((R − r0)³/r0).
    for (const t of [1e-9, 1e-7, 1e-5]) {
      const x = radialRadius(A, R0, t) - R0;
      const planar = Math.sqrt(2 * A * t);
      expect(rel(x, planar)).toBeLessThan((2 * planar) / R0);
      expect(x).toBeLessThan(planar); // radial dilution slows the front below the planar law
    }
    expect(radialRadius(A, R0, 0)).toBe(R0);
  });

  it('approaches R²(2 ln(R/r0) − 1) = 4at − r0² at late times (same law rearranged)', () => {
    const t = 1e5;
    const r = radialRadius(A, R0, t);
    expect(rel(r * r * (2 * Math.log(r / R0) - 1), 4 * A * t - R0 * R0)).toBeLessThan(1e-12);
  });

  it('inverts: t(R(t)) = t', () => {
    for (const t of [1e-8, 1e-3, 0.5, 10, 1000, 1e6]) {
      expect(rel(radialTime(A, R0, radialRadius(A, R0, t)), t)).toBeLessThan(1e-12);
    }
    expect(radialTime(A, R0, R0)).toBe(0);
  });

  it('is increasing in time and slower than the planar front', () => {
    let previous = R0;
    for (let i = 1; i <= 1000; i++) {
      const t = Math.pow(10, -6 + (i * 10) / 1000);
      const r = radialRadius(A, R0, t);
      expect(r).toBeGreaterThan(previous);
      expect(r - R0).toBeLessThan(Math.sqrt(2 * A * t));
      previous = r;
    }
  });

  it('reports radius, ring area and liquid mass at the readings, and times to target radii', () => {
    const input: RadialSpreadInput = {
      permeability: 2e-11,
      porosity: 0.8,
      capillaryPressure: 3000,
      viscosity: 1e-3,
      sourceRadius: R0,
      thickness: 0.5e-3,
      density: 998,
      times: [10, 60],
      radii: [0.05],
    };
    const r = radialSpreading(input) as RadialSpreadOk;
    expect(r.status).toBe('ok');
    expect(rel(r.a, A)).toBeLessThan(1e-15);
    for (const p of r.atTimes) {
      expect(rel(p.radius, radialRadius(A, R0, p.time))).toBeLessThan(1e-15);
      expect(rel(p.area, Math.PI * (p.radius ** 2 - R0 ** 2))).toBeLessThan(1e-14);
      expect(rel(p.mass as number, 998 * 0.8 * 0.5e-3 * p.area)).toBeLessThan(1e-14);
      // Front speed from the differential form ε R ln(R/r0) dR/dt = k Pc/η.
      expect(rel(p.velocity * p.radius * Math.log(p.radius / R0), A)).toBeLessThan(1e-12);
    }
    // 100 mm circle (radius 50 mm), as read in horizontal spreading tests.
    expect(rel(r.toRadii[0].time, radialTime(A, R0, 0.05))).toBeLessThan(1e-15);
    const noMass = radialSpreading({ ...input, thickness: undefined }) as RadialSpreadOk;
    expect(noMass.atTimes[0].mass).toBeNull();
  });

  it('refuses target radii inside the source and returns no numbers for Pc ≤ 0', () => {
    expect(() => radialTime(A, R0, R0 / 2)).toThrowError(DomainError);
    const base = { permeability: 2e-11, porosity: 0.8, capillaryPressure: 3000, viscosity: 1e-3, sourceRadius: R0 };
    expect(() => radialSpreading({ ...base, radii: [0.001] })).toThrowError(DomainError, /radii\[0\]/);
    expect(radialSpreading({ ...base, capillaryPressure: 0 }).status).toBe('no-spontaneous-uptake');
  });
});
