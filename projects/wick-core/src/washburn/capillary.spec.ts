import { DomainError } from '../errors';
import { capillaryCoefficients, capillaryUptake, type CapillaryUptakeInput, type CapillaryUptakeOk } from './capillary';
import { washburnModels } from './models';

function rel(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

const deg = (d: number): number => (d * Math.PI) / 180;

// Çengel & Cimbala, Fluid Mechanics, Example 2-6 inputs: water, σ = 0.073 N/m, D = 0.6 mm, ρ = 1000 kg/m³,
// g = 9.81 m/s², θ = 0. Viscosity 1.0 mPa·s (water near 20 °C, from memory).
const WATER_TUBE: CapillaryUptakeInput = {
  radius: 0.3e-3,
  surfaceTension: 0.073,
  viscosity: 1.0e-3,
  contactAngle: 0,
  density: 1000,
  gravity: 9.81,
};

function ok(input: CapillaryUptakeInput): CapillaryUptakeOk {
  const r = capillaryUptake(input);
  if (r.status !== 'ok') throw new Error(`expected uptake, got ${r.status}`);
  return r;
}

describe('capillary uptake (Lucas–Washburn with gravity)', () => {
  it('gives the Jurin height of the Çengel & Cimbala example for a vertical tube', () => {
    // Çengel & Cimbala, Example 2-6: h ≈ 0.0496 m (5.0 cm).
    const r = ok(WATER_TUBE);
    expect(Math.abs((r.jurinHeight as number) - 0.0496)).toBeLessThan(0.00005);
    // Vertical is the default tilt: the equilibrium length equals the Jurin height.
    expect(rel(r.equilibriumLength as number, r.jurinHeight as number)).toBeLessThan(1e-15);
  });

  it('reproduces the OpenStax College Physics tree example (r = 1.41e-7 m lifts sap 100 m)', () => {
    // OpenStax College Physics, Example 11.12: γ = 0.0728 N/m, θ = 0, ρ = 1050 kg/m³, g = 9.80 → r = 1.41e-7 m for
    // 100 m; the printed r is rounded to 3 digits, hence 0.5 %.
    const r = ok({ ...WATER_TUBE, radius: 1.41e-7, surfaceTension: 0.0728, density: 1050, gravity: 9.8 });
    expect(rel(r.jurinHeight as number, 100)).toBeLessThan(0.005);
  });

  it('obeys h² = (r γ cos θ/(2η))·t exactly in a horizontal tube', () => {
    // Washburn, Phys. Rev. 17 (1921) 273, horizontal capillary; θ = 60° gives cos θ = 1/2.
    const input = { ...WATER_TUBE, contactAngle: deg(60), tilt: 0, times: [0.5, 2, 10, 100] };
    const r = ok(input);
    const slope = (input.radius * input.surfaceTension * 0.5) / (2 * input.viscosity);
    expect(rel(r.washburnCoefficient, slope)).toBeLessThan(1e-15);
    expect(r.b).toBe(0);
    expect(r.equilibriumLength).toBeNull();
    for (const p of r.atTimes) expect(rel(p.height * p.height, slope * p.time)).toBeLessThan(1e-14);
  });

  it('keeps the vertical projection of the equilibrium at the Jurin height for any tilt', () => {
    // Jurin's law concerns the vertical rise: along a tube tilted by α the column is h_J / sin α long.
    for (const tiltDeg of [10, 30, 60, 90]) {
      const r = ok({ ...WATER_TUBE, tilt: deg(tiltDeg) });
      expect(rel((r.equilibriumLength as number) * Math.sin(deg(tiltDeg)), r.jurinHeight as number)).toBeLessThan(
        1e-14,
      );
    }
  });

  it('reports front speed a/h − b and vertical rise h·sin α at each reading', () => {
    // Definition of the model: dh/dt = a/h − b.
    const r = ok({ ...WATER_TUBE, tilt: deg(45), times: [0, 1, 5] });
    expect(r.atTimes[0].velocity).toBeNull();
    for (const p of r.atTimes.slice(1)) {
      expect(rel(p.velocity as number, r.a / p.height - r.b)).toBeLessThan(1e-15);
      expect(rel(p.verticalRise, p.height * Math.sin(deg(45)))).toBeLessThan(1e-15);
    }
  });

  it('reports targets beyond the Jurin height as not reached, with a warning', () => {
    const r = ok({ ...WATER_TUBE, heights: [0.01, 0.1] });
    expect(r.toHeights[0].reached).toBeTrue();
    expect(r.toHeights[0].time as number).toBeGreaterThan(0);
    expect(r.toHeights[1]).toEqual({ height: 0.1, reached: false, time: null });
    expect(r.warnings.map((w) => w.code)).toContain('not-reached');
  });

  it('flags the inertial regime when readings are not long against ρr²/(8η)', () => {
    // Bosanquet, Phil. Mag. 45 (1923) 525: τ = ρ r²/(8η) = 0.125 s for water in a 1 mm radius tube.
    const wide = ok({ ...WATER_TUBE, radius: 1e-3, times: [0.05], heights: [] });
    expect(wide.inertialTime).toBeCloseTo(0.125, 12);
    expect(wide.warnings.map((w) => w.code)).toContain('inertial-regime');
    // A 10 µm tube read after 10 s is deep in the viscous regime (τ = 12.5 µs).
    const narrow = ok({ ...WATER_TUBE, radius: 10e-6, times: [10], heights: [0.005] });
    expect(narrow.warnings.map((w) => w.code)).not.toContain('inertial-regime');
  });

  it('flags tubes too wide for a spherical meniscus', () => {
    // Rayleigh's meniscus correction r/3 (Adamson & Gast, §II-2, from memory): 0.67 mm of 7.4 mm at r = 2 mm.
    expect(ok({ ...WATER_TUBE, radius: 2e-3 }).warnings.map((w) => w.code)).toContain('wide-capillary');
    expect(ok(WATER_TUBE).warnings.map((w) => w.code)).not.toContain('wide-capillary');
  });

  it('returns no numbers for contact angles of 90° or more', () => {
    // Young–Laplace: cos θ ≤ 0 gives no capillary suction, hence no spontaneous uptake.
    for (const theta of [90, 120, 180]) {
      const r = capillaryUptake({ ...WATER_TUBE, contactAngle: deg(theta) });
      expect(r.status).toBe('no-spontaneous-uptake');
      expect('atTimes' in r).toBeFalse();
      expect(r.capillaryPressure).toBeLessThanOrEqual(0);
      expect(r.warnings[0].code).toBe('no-spontaneous-uptake');
    }
    expect(capillaryUptake({ ...WATER_TUBE, contactAngle: deg(89.9) }).status).toBe('ok');
  });

  it('echoes its inputs with defaults filled in', () => {
    const r = ok({ ...WATER_TUBE, gravity: undefined });
    expect(r.inputs.gravity).toBe(9.80665);
    expect(r.inputs.tilt).toBe(Math.PI / 2);
    expect(r.inputs.times).toEqual([10, 30, 60, 300, 600]);
    expect(r.inputs.heights).toEqual([0.01, 0.02, 0.03]);
  });

  it('refuses invalid inputs with a DomainError naming the field', () => {
    expect(() => capillaryUptake({ ...WATER_TUBE, radius: -1 })).toThrowMatching(
      (e) => e instanceof DomainError && e.field === 'radius',
    );
    expect(() => capillaryUptake({ ...WATER_TUBE, contactAngle: deg(200) })).toThrowError(DomainError);
    expect(() => capillaryUptake({ ...WATER_TUBE, tilt: deg(100) })).toThrowError(DomainError);
    expect(() => capillaryUptake({ ...WATER_TUBE, times: [1, -2] })).toThrowMatching(
      (e) => e instanceof DomainError && e.field === 'times[1]',
    );
  });

  it('gives the same coefficients in its validated and hot-path call forms', () => {
    // a = γ r cos θ/(4η), b = ρ g r² sin α/(8η) (Washburn 1921; Fries & Dreyer 2008).
    const checked = capillaryCoefficients({ ...WATER_TUBE, contactAngle: deg(30), tilt: deg(50) });
    const raw = capillaryCoefficients(0.3e-3, 0.073, 1e-3, Math.cos(deg(30)), 1000, 9.81, Math.sin(deg(50)));
    expect(rel(checked.a, (0.073 * 0.3e-3 * Math.cos(deg(30))) / 4e-3)).toBeLessThan(1e-15);
    expect(rel(checked.a, raw.a)).toBeLessThan(1e-15);
    expect(rel(checked.b, raw.b)).toBeLessThan(1e-15);
    expect(() => capillaryCoefficients({ ...WATER_TUBE, viscosity: 0 })).toThrowError(DomainError);
  });

  it('runs through its ModelSpec', () => {
    const spec = washburnModels.find((m) => m.id === 'washburn-capillary');
    expect(spec).toBeDefined();
    const r = spec!.run({ ...WATER_TUBE }) as CapillaryUptakeOk;
    expect(r.status).toBe('ok');
    expect(washburnModels.every((m) => m.family === 'washburn')).toBeTrue();
  });
});
