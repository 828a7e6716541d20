import { DomainError } from '../errors';
import { capillaryUptake, type CapillaryUptakeOk } from './capillary';
import { porousCoefficients, porousStripUptake, type PorousStripInput, type PorousStripOk } from './porous-strip';

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}
const deg = (d: number): number => (d * Math.PI) / 180;

// An invented nonwoven strip: k = 5e-11 m², ε = 0.85, Pc = 2 kPa, water (η = 1 mPa·s, ρ = 998 kg/m³),
// 25 mm wide, 1 mm thick.
const STRIP: PorousStripInput = {
  permeability: 5e-11,
  porosity: 0.85,
  capillaryPressure: 2000,
  viscosity: 1e-3,
  density: 998,
  width: 0.025,
  thickness: 0.001,
};

function ok(input: PorousStripInput): PorousStripOk {
  const r = porousStripUptake(input);
  if (r.status !== 'ok') throw new Error(`expected uptake, got ${r.status}`);
  return r;
}

describe('porous strip wicking (Darcy sharp front)', () => {
  it('is exactly the capillary model for k = r²/8, ε = 1, Pc = 2γ cos θ/r', () => {
    // A straight tube is a porous medium with Poiseuille permeability r²/8 (Hagen–Poiseuille), ε = 1 and the
    // Young–Laplace pressure 2γ cos θ/r: Darcy's a, b must equal Washburn's γ r cos θ/(4η), ρ g r²/(8η).
    const r = 0.2e-3;
    const gamma = 0.072;
    const theta = deg(30);
    const times = [0.1, 1, 10, 100];
    const heights = [0.005, 0.02, 0.2];
    const tube = capillaryUptake({
      radius: r,
      surfaceTension: gamma,
      viscosity: 1e-3,
      contactAngle: theta,
      density: 998,
      tilt: deg(40),
      times,
      heights,
    }) as CapillaryUptakeOk;
    const strip = porousStripUptake({
      permeability: (r * r) / 8,
      porosity: 1,
      capillaryPressure: (2 * gamma * Math.cos(theta)) / r,
      viscosity: 1e-3,
      density: 998,
      width: 1,
      thickness: 1,
      tilt: deg(40),
      times,
      heights,
    }) as PorousStripOk;
    expect(rel(strip.a, tube.a)).toBeLessThan(1e-14);
    expect(rel(strip.b, tube.b)).toBeLessThan(1e-14);
    strip.atTimes.forEach((p, i) => expect(rel(p.height, tube.atTimes[i].height)).toBeLessThan(1e-14));
    strip.toHeights.forEach((p, i) => {
      expect(p.reached).toBe(tube.toHeights[i].reached);
      if (p.time !== null) expect(rel(p.time, tube.toHeights[i].time as number)).toBeLessThan(1e-13);
    });
  });

  it('rises to the equilibrium height Pc/(ρ g) when vertical', () => {
    // Static balance of capillary suction and hydrostatic head (porous-media form of Jurin's law).
    const r = ok(STRIP);
    expect(r.orientation).toBe('vertical');
    expect(rel(r.equilibriumHeight as number, 2000 / (998 * 9.80665))).toBeLessThan(1e-15);
    expect(rel(r.equilibriumLength as number, r.equilibriumHeight as number)).toBeLessThan(1e-15);
    const inclined = ok({ ...STRIP, tilt: deg(20) });
    expect(inclined.orientation).toBe('inclined');
    expect(rel((inclined.equilibriumLength as number) * Math.sin(deg(20)), r.equilibriumHeight as number)).toBeLessThan(
      1e-14,
    );
  });

  it('follows h² = 2 k Pc t/(ε η) and m ∝ √t when horizontal', () => {
    // Darcy/Washburn for a horizontal strip: ε dh/dt = k Pc/(η h) ⇒ h² = 2 k Pc t/(ε η).
    const r = ok({ ...STRIP, tilt: 0, times: [1, 4, 100] });
    expect(r.orientation).toBe('horizontal');
    expect(r.equilibriumLength).toBeNull();
    const d = (2 * STRIP.permeability * STRIP.capillaryPressure) / (STRIP.porosity * STRIP.viscosity);
    for (const p of r.atTimes) {
      expect(rel(p.height * p.height, d * p.time)).toBeLessThan(1e-14);
      expect(rel(p.mass, r.massCoefficient * Math.sqrt(p.time))).toBeLessThan(1e-14);
    }
  });

  it('holds m = ρ ε S w δ h and dm/dt = ρ ε S w δ·dh/dt (mass balance)', () => {
    const r = ok({ ...STRIP, saturation: 0.8, times: [10, 60] });
    const perLength = 998 * 0.85 * 0.8 * 0.025 * 0.001;
    expect(rel(r.massPerLength, perLength)).toBeLessThan(1e-15);
    for (const p of r.atTimes) {
      expect(rel(p.mass, perLength * p.height)).toBeLessThan(1e-15);
      // Check the rate against a numerical derivative of the mass curve.
      const dt = p.time * 1e-5;
      const before = ok({ ...STRIP, saturation: 0.8, times: [p.time - dt] }).atTimes[0].mass;
      const after = ok({ ...STRIP, saturation: 0.8, times: [p.time + dt] }).atTimes[0].mass;
      expect(rel(p.massRate, (after - before) / (2 * dt))).toBeLessThan(1e-6);
    }
    expect(r.warnings.map((w) => w.code)).toContain('partial-saturation');
  });

  it('reads the usual checkpoints and reports unreached heights as such', () => {
    // Default reading points: 10, 30, 60, 300 s and 10 min; 10, 20, 30 mm.
    const tall = ok({ ...STRIP, capillaryPressure: 250 }); // h_eq = 25.5 mm
    expect(tall.atTimes.map((p) => p.time)).toEqual([10, 30, 60, 300, 600]);
    expect(tall.toHeights.map((p) => p.reached)).toEqual([true, true, false]);
    expect(tall.toHeights[2].time).toBeNull();
    expect(tall.warnings.map((w) => w.code)).toContain('not-reached');
  });

  it('rises monotonically and never above equilibrium', () => {
    const times: number[] = [];
    for (let i = 1; i <= 200; i++) times.push(i * 30);
    const r = ok({ ...STRIP, times });
    for (let i = 1; i < r.atTimes.length; i++) {
      expect(r.atTimes[i].height).toBeGreaterThan(r.atTimes[i - 1].height);
      expect(r.atTimes[i].height).toBeLessThan(r.equilibriumLength as number);
    }
  });

  it('returns no numbers when Pc ≤ 0', () => {
    const r = porousStripUptake({ ...STRIP, capillaryPressure: -50 });
    expect(r.status).toBe('no-spontaneous-uptake');
    expect('atTimes' in r).toBeFalse();
  });

  it('gives the same coefficients in its validated and hot-path call forms', () => {
    // a = k Pc/(ε S η), b = k ρ g sin α/(ε S η) (Darcy, Green & Ampt form).
    const checked = porousCoefficients({ ...STRIP, saturation: 0.9, tilt: deg(30) });
    const raw = porousCoefficients(5e-11, 0.85, 0.9, 1e-3, 2000, 998, 9.80665, Math.sin(deg(30)));
    expect(rel(checked.a, (5e-11 * 2000) / (0.85 * 0.9 * 1e-3))).toBeLessThan(1e-15);
    expect(rel(checked.a, raw.a)).toBeLessThan(1e-15);
    expect(rel(checked.b, raw.b)).toBeLessThan(1e-15);
    expect(() => porousCoefficients({ ...STRIP, permeability: -1 })).toThrowError(DomainError);
  });

  it('refuses invalid inputs', () => {
    expect(() => porousStripUptake({ ...STRIP, porosity: 0 })).toThrowError(DomainError);
    expect(() => porousStripUptake({ ...STRIP, porosity: 1.2 })).toThrowError(DomainError);
    expect(() => porousStripUptake({ ...STRIP, saturation: 0 })).toThrowError(DomainError);
    expect(() => porousStripUptake({ ...STRIP, times: [0] })).toThrowError(DomainError);
    expect(() => porousStripUptake({ ...STRIP, width: Number.NaN })).toThrowError(DomainError);
  });
});
