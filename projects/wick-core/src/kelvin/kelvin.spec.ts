import { GAS_CONSTANT, MOLAR_MASS_WATER } from '../constants';
import { DomainError } from '../errors';
import { kelvinDroplet, kelvinMeniscus, kelvinRadius } from './kelvin';
import { kelvinModels } from './models';

const K = (celsius: number): number => celsius + 273.15;
const deg = (d: number): number => (d * Math.PI) / 180;
const codes = (r: { warnings: readonly { code: string }[] }): string[] => r.warnings.map((w) => w.code);

describe('Kelvin equation: water droplets at 25 °C', () => {
  // Adamson & Gast, Physical Chemistry of Surfaces, 6th ed., Ch. III, and Butt, Graf & Kappl,
  // Physics and Chemistry of Interfaces, Ch. 2 (table of p/p0 for water droplets at 25 °C), from memory:
  // 1 µm → 1.001, 100 nm → 1.011, 10 nm → 1.11, 1 nm → ≈ 2.9. Checked to the printed digits.
  const rows: readonly [number, number, number][] = [
    [1e-6, 1.001, 0.0005],
    [1e-7, 1.011, 0.0005],
    [1e-8, 1.11, 0.005],
    [1e-9, 2.9, 0.05],
  ];
  for (const [r, expected, tol] of rows) {
    it(`gives p/p0 ≈ ${expected} at r = ${r} m`, () => {
      const res = kelvinDroplet({ radius: r, temperature: K(25) });
      expect(Math.abs(res.ratio - expected)).toBeLessThanOrEqual(tol);
    });
  }

  it('uses water at the temperature when the liquid is not given, and says so', () => {
    const res = kelvinDroplet({ radius: 1e-6, temperature: K(25) });
    // Vm = M/ρ with M = 18.01528 g/mol (REFERENCES) and ρ ≈ 997.05 kg/m³ (Tanaka 2001 at 25 °C).
    expect(res.molarVolume).toBeCloseTo(MOLAR_MASS_WATER / 997.047, 9);
    // IAPWS R1-76(2014) table, from memory: 71.97 mN/m at 25 °C.
    expect(res.surfaceTension * 1e3).toBeCloseTo(71.97, 2);
    expect(codes(res)).toContain('water-defaults');
  });

  it('tends to 1 for large droplets and grows as they shrink (property)', () => {
    let prev = 1;
    for (let r = 1e-3; r > 2e-9; r /= 2) {
      const ratio = kelvinDroplet({ radius: r, temperature: K(25) }).ratio;
      expect(ratio).toBeGreaterThan(prev);
      prev = ratio;
    }
    expect(kelvinDroplet({ radius: 1, temperature: K(25) }).ratio - 1).toBeLessThan(1e-8);
  });
});

describe('Kelvin equation: pore menisci and the Kelvin radius', () => {
  const liquid = { surfaceTension: 0.072, molarVolume: 1.8e-5, temperature: 298.15 };

  it('a wetting meniscus lowers p/p0 by exactly the factor a droplet raises it', () => {
    // Identity: ln(p/p0) changes sign with the curvature (concave vs convex, θ = 0).
    for (const r of [3e-9, 2e-8, 5e-7]) {
      const drop = kelvinDroplet({ ...liquid, radius: r });
      const men = kelvinMeniscus({ ...liquid, radius: r, contactAngle: 0 });
      expect(men.lnRatio).toBeCloseTo(-drop.lnRatio, 14);
      expect(men.ratio * drop.ratio).toBeCloseTo(1, 14);
    }
  });

  it('a meniscus with contact angle θ acts as a concave cap of radius r/cos θ', () => {
    // Identity: −2γVm cosθ/(rRT) = −2γVm/((r/cosθ)RT).
    const r = 1e-8;
    const theta = deg(50);
    const men = kelvinMeniscus({ ...liquid, radius: r, contactAngle: theta });
    const drop = kelvinDroplet({ ...liquid, radius: r / Math.cos(theta) });
    expect(men.lnRatio).toBeCloseTo(-drop.lnRatio, 14);
  });

  it('gives back the pore radius from the RH its meniscus sets (consistency identity)', () => {
    for (const r of [2e-9, 1.5e-8, 4e-7]) {
      for (const theta of [0, deg(30), deg(70)]) {
        const rh = kelvinMeniscus({ ...liquid, radius: r, contactAngle: theta }).ratio;
        const back = kelvinRadius({ ...liquid, relativeHumidity: rh, contactAngle: theta });
        expect(back.status).toBe('condensation');
        expect(Math.abs(back.kelvinRadius! - r) / r).toBeLessThan(1e-10);
      }
    }
  });

  it('matches the characteristic length γVm/RT ≈ 0.54 nm of water at 20 °C', () => {
    // Israelachvili, Intermolecular and Surface Forces, from memory: for water γVm/RT = 0.54 nm at 20 °C.
    // At RH = 1/e and θ = 0 the pore radius is 2γVm/RT, twice the mean radius of curvature.
    const r = kelvinRadius({ relativeHumidity: Math.exp(-1), contactAngle: 0, temperature: K(20) });
    expect(r.kelvinRadius! / 2).toBeGreaterThan(0.535e-9);
    expect(r.kelvinRadius! / 2).toBeLessThan(0.545e-9);
  });

  it('grows with relative humidity and shrinks with contact angle (property)', () => {
    let prev = 0;
    for (let rh = 0.05; rh < 0.995; rh += 0.05) {
      const rK = kelvinRadius({ ...liquid, relativeHumidity: rh, contactAngle: deg(20) }).kelvinRadius!;
      expect(rK).toBeGreaterThan(prev);
      prev = rK;
    }
    const wet = kelvinRadius({ ...liquid, relativeHumidity: 0.8, contactAngle: 0 }).kelvinRadius!;
    const lessWet = kelvinRadius({ ...liquid, relativeHumidity: 0.8, contactAngle: deg(60) }).kelvinRadius!;
    // cos 60° = 1/2.
    expect(lessWet).toBeCloseTo(wet / 2, 20);
  });

  it('computes the textbook number for RH 50 % by hand', () => {
    // r_K = 2γVm/(RT ln 2) for θ = 0 (Adamson & Gast Ch. XVII form), evaluated directly.
    const expected = (2 * 0.072 * 1.8e-5) / (GAS_CONSTANT * 298.15 * Math.log(2));
    const r = kelvinRadius({ ...liquid, relativeHumidity: 0.5, contactAngle: 0 });
    expect(r.kelvinRadius!).toBeCloseTo(expected, 22);
    expect(r.kelvinRadius! * 1e9).toBeCloseTo(1.51, 2);
  });

  it('reports no condensation for θ ≥ 90° instead of a radius', () => {
    for (const theta of [Math.PI / 2, deg(120)]) {
      const r = kelvinRadius({ ...liquid, relativeHumidity: 0.9, contactAngle: theta });
      expect(r.status).toBe('no-condensation');
      expect(r.kelvinRadius).toBeNull();
      expect(codes(r)).toContain('no-condensation');
    }
    // A non-wetting meniscus is convex: p/p0 > 1.
    expect(kelvinMeniscus({ ...liquid, radius: 1e-8, contactAngle: deg(120) }).ratio).toBeGreaterThan(1);
  });

  it('refuses RH outside (0, 1) and non-physical inputs', () => {
    for (const rh of [0, 1, 1.2, -0.1]) {
      expect(() => kelvinRadius({ ...liquid, relativeHumidity: rh, contactAngle: 0 })).toThrowError(DomainError);
    }
    expect(() => kelvinDroplet({ ...liquid, radius: 0 })).toThrowError(DomainError);
    expect(() => kelvinDroplet({ ...liquid, radius: 1e-8, temperature: -3 })).toThrowError(DomainError);
    expect(() => kelvinMeniscus({ ...liquid, radius: 1e-8, contactAngle: 4 })).toThrowError(DomainError);
  });

  it('warns at the nanometre scale and uses given properties without water defaults', () => {
    const r = kelvinDroplet({ ...liquid, radius: 2e-9 });
    expect(codes(r)).toEqual(['nanoscale']);
    expect(codes(kelvinDroplet({ ...liquid, radius: 2e-6 }))).toEqual([]);
    // Vm from M/ρ when both are given.
    const viaDensity = kelvinDroplet({ surfaceTension: 0.0224, molarMass: 0.04607, density: 789.3, temperature: K(20), radius: 1e-8 });
    expect(viaDensity.molarVolume).toBeCloseTo(0.04607 / 789.3, 15);
  });

  it('runs through the model registry', () => {
    const m = kelvinModels.find((x) => x.id === 'kelvin-radius')!;
    const r = m.run({ ...liquid, relativeHumidity: 0.5, contactAngle: 0 }) as { kelvinRadius: number };
    expect(r.kelvinRadius * 1e9).toBeCloseTo(1.51, 2);
  });
});
