import { STANDARD_GRAVITY } from '../constants';
import { DomainError } from '../errors';
import { tubeMeniscus } from '../laplace/young-laplace';
import { AIR_DENSITY, jurinHeight, surfaceTensionFromRise } from './jurin';
import { jurinModels } from './models';

const deg = (d: number): number => (d * Math.PI) / 180;
const codes = (r: { warnings: readonly { code: string }[] }): string[] => r.warnings.map((w) => w.code);

describe('Jurin height: worked examples', () => {
  it('Çengel & Cimbala Ex. 2-6: water in a 0.6 mm tube rises about 5.0 cm', () => {
    // Çengel & Cimbala, Fluid Mechanics, Ex. 2-6: D = 0.6 mm, σ = 0.073 N/m, ρ = 1000 kg/m³,
    // g = 9.81 m/s², θ = 0 → h = 0.0496 m (the book neglects the air, hence displacedDensity 0).
    const r = jurinHeight({
      surfaceTension: 0.073,
      contactAngle: 0,
      radius: 0.3e-3,
      liquidDensity: 1000,
      displacedDensity: 0,
      gravity: 9.81,
    });
    expect(r.height).toBeCloseTo(0.0496, 4);
    expect(r.status).toBe('rise');
  });

  it('OpenStax College Physics Ex. 11.12: a 100 m sap column needs r = 1.41e-7 m', () => {
    // OpenStax College Physics, Ex. 11.12: γ = 0.0728 N/m, θ = 0, ρ = 1050 kg/m³, g = 9.80 m/s²,
    // h = 100 m → r = 1.41 × 10⁻⁷ m. Jurin's law makes h·r constant, so r = (h·r at any r)/100 m.
    const input = { surfaceTension: 0.0728, contactAngle: 0, liquidDensity: 1050, displacedDensity: 0, gravity: 9.8 };
    const probe = 1e-6;
    const hr = jurinHeight({ ...input, radius: probe }).height * probe;
    expect(Number((hr / 100).toPrecision(3))).toBe(1.41e-7);
    expect(Math.abs(jurinHeight({ ...input, radius: 1.41e-7 }).height - 100)).toBeLessThan(0.5);
  });

  it('Atkins: water rising 7.36 cm in a 0.20 mm capillary at 25 °C has γ ≈ 72 mN/m', () => {
    // Atkins, Physical Chemistry (from memory): h = 7.36 cm, r = 0.20 mm, ρ = 997.05 kg/m³ (25 °C),
    // g = 9.81 m/s² → γ = ½ρghr ≈ 72 mN/m.
    const r = surfaceTensionFromRise({ height: 0.0736, radius: 0.2e-3, liquidDensity: 997.05, displacedDensity: 0, gravity: 9.81 });
    expect(r.surfaceTension * 1e3).toBeCloseTo(72, 0);
    // Adamson & Gast Ch. II (from memory): the corrected value adds ½ρgr·r/3.
    expect(r.correctedSurfaceTension - r.surfaceTension).toBeCloseTo(0.5 * 997.05 * 9.81 * 0.2e-3 * (0.2e-3 / 3), 15);
    // IAPWS R1-76(2014), 25 °C: 71.97 mN/m — the textbook measurement agrees within 0.2 %.
    expect(Math.abs(r.surfaceTension - 0.07197) / 0.07197).toBeLessThan(0.002);
  });
});

describe('Jurin height: identities and properties', () => {
  const water = { surfaceTension: 0.0728, liquidDensity: 998.2, displacedDensity: 0 };

  it('balances the Laplace pressure of the meniscus with the hydrostatic head', () => {
    // Identity: Δρ g h = 2γ cos θ / r (Young–Laplace tube meniscus).
    for (const theta of [0, deg(35), deg(80)]) {
      const r = 1e-4;
      const h = jurinHeight({ ...water, contactAngle: theta, radius: r }).height;
      const p = tubeMeniscus({ surfaceTension: water.surfaceTension, contactAngle: theta, radius: r }).pressure;
      expect(water.liquidDensity * STANDARD_GRAVITY * h).toBeCloseTo(p, 9);
    }
  });

  it('keeps h·r constant (Jurin’s law) and scales with cos θ', () => {
    const base = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4 });
    for (const r of [2e-5, 3e-4, 1e-3]) {
      expect(jurinHeight({ ...water, contactAngle: 0, radius: r }).height * r).toBeCloseTo(base.height * 1e-4, 14);
    }
    // cos 60° = 1/2.
    expect(jurinHeight({ ...water, contactAngle: deg(60), radius: 1e-4 }).height).toBeCloseTo(base.height / 2, 12);
  });

  it('uses Δρ = ρ_liquid − ρ_air by default', () => {
    const withAir = jurinHeight({ surfaceTension: 0.0728, contactAngle: 0, radius: 1e-4, liquidDensity: 998.2 });
    const vacuum = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4 });
    expect(withAir.densityDifference).toBe(998.2 - AIR_DENSITY);
    expect(withAir.height / vacuum.height).toBeCloseTo(998.2 / (998.2 - 1.2), 12);
  });

  it('subtracts r/3 for the hemispherical meniscus, and the inverse gives back γ both ways', () => {
    for (const r of [5e-5, 2e-4, 5e-4]) {
      const f = jurinHeight({ ...water, contactAngle: 0, radius: r });
      expect(f.correctedHeight!).toBeCloseTo(f.height - r / 3, 15);
      // Round trip: the uncorrected height gives γ uncorrected; the corrected height, γ corrected.
      const inv1 = surfaceTensionFromRise({ ...water, height: f.height, radius: r });
      const inv2 = surfaceTensionFromRise({ ...water, height: f.correctedHeight!, radius: r });
      expect(inv1.surfaceTension).toBeCloseTo(water.surfaceTension, 14);
      expect(inv2.correctedSurfaceTension).toBeCloseTo(water.surfaceTension, 14);
    }
  });

  it('keeps the vertical height in a tilted tube and stretches the column to h/sin α', () => {
    const vertical = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4 });
    const tilted = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, tilt: deg(30) });
    expect(tilted.height).toBe(vertical.height);
    // sin 30° = 1/2.
    expect(tilted.lengthAlongTube!).toBeCloseTo(2 * vertical.height, 12);
    expect(tilted.correctedLengthAlongTube!).toBeCloseTo(2 * vertical.correctedHeight!, 12);
    expect(vertical.lengthAlongTube).toBe(vertical.height);
    // The length grows without bound as α → 0 (property).
    let prev = 0;
    for (const a of [60, 30, 10, 3, 1]) {
      const len = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, tilt: deg(a) }).lengthAlongTube!;
      expect(len).toBeGreaterThan(prev);
      prev = len;
    }
  });

  it('gives a depression, not a rise, above 90° (θ ↔ 180° − θ flips the sign)', () => {
    const up = jurinHeight({ ...water, contactAngle: deg(40), radius: 1e-4 });
    const down = jurinHeight({ ...water, contactAngle: deg(140), radius: 1e-4 });
    expect(down.height).toBeCloseTo(-up.height, 12);
    expect(down.status).toBe('depression');
    expect(down.correctedHeight).toBeNull();
    expect(codes(down)).toContain('no-rise');
    const flat = jurinHeight({ ...water, contactAngle: Math.PI / 2, radius: 1e-4 });
    expect(flat.height).toBe(0);
    expect(flat.status).toBe('none');
  });
});

describe('Jurin height: warnings and errors', () => {
  const water = { surfaceTension: 0.0728, liquidDensity: 998.2 };

  it('warns for nearly horizontal and horizontal tubes', () => {
    expect(codes(jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, tilt: deg(2) }))).toContain('shallow-tilt');
    const horizontal = jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, tilt: 0 });
    expect(horizontal.lengthAlongTube).toBeNull();
    expect(codes(horizontal)).toContain('horizontal-tube');
  });

  it('warns when the tube is wide compared with the rise', () => {
    expect(codes(jurinHeight({ ...water, contactAngle: 0, radius: 3e-3 }))).toContain('wide-tube');
    expect(codes(jurinHeight({ ...water, contactAngle: 0, radius: 3e-4 }))).toEqual([]);
  });

  it('refuses invalid inputs', () => {
    expect(() => jurinHeight({ ...water, contactAngle: 0, radius: 0 })).toThrowError(DomainError);
    expect(() => jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, displacedDensity: 1200 })).toThrowError(DomainError);
    expect(() => jurinHeight({ ...water, contactAngle: 0, radius: 1e-4, tilt: deg(120) })).toThrowError(DomainError);
    expect(() => surfaceTensionFromRise({ height: 0.05, radius: 1e-4, liquidDensity: 998, contactAngle: deg(95) })).toThrowError(
      DomainError,
      /below 90°/,
    );
    expect(() => surfaceTensionFromRise({ height: -0.01, radius: 1e-4, liquidDensity: 998 })).toThrowError(DomainError);
  });

  it('runs through the model registry with SI inputs', () => {
    const m = jurinModels.find((x) => x.id === 'jurin-height')!;
    const r = m.run({ surfaceTension: 0.073, contactAngle: 0, radius: 0.3e-3, liquidDensity: 1000, displacedDensity: 0, gravity: 9.81 }) as {
      height: number;
    };
    // Çengel & Cimbala Ex. 2-6: 0.0496 m.
    expect(r.height).toBeCloseTo(0.0496, 4);
  });
});
