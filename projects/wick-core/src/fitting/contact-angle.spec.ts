import { DomainError } from '../errors';
import { REFERENCE_LIQUID_CAUTION, referenceLiquidContactAngle } from './contact-angle';

describe('contact angle by the reference-liquid (Washburn) method', () => {
  /*
   * Constructed worked example (identity of m² = C ρ² γ cosθ t/η, Washburn 1921):
   * a packed sample with material constant C = 1.0e-14 m⁵.
   * Reference n-hexane: γ = 17.9 mN/m (CRC Handbook, 20 °C), ρ = 659.4 kg/m³ (20 °C, from memory),
   * η = 0.300 mPa·s (25 °C, from memory) — plausible inputs; the check is the identity, not the data.
   *   K_ref = C ρ² γ/η = 1e-14 · 659.4² · 0.0179 / 3.00e-4 = 2.5944e-7 kg²/s.
   * Test liquid water: γ = 72.74 mN/m (IAPWS R1-76, 20 °C), ρ = 998.2067 kg/m³ (Tanaka et al. 2001,
   * 20 °C), η = 1.0016 mPa·s (ISO/TR 3666, 20 °C, from memory), true θ = 60° (cos θ = 0.5):
   *   K_test = C ρ² γ cosθ/η = 1e-14 · 998.2067² · 0.07274 · 0.5 / 1.0016e-3 = 3.6183e-7 kg²/s.
   * The method must return C = 1e-14 m⁵ and θ = 60°.
   */
  const C = 1e-14;
  const hexane = { surfaceTension: 0.0179, density: 659.4, viscosity: 0.3e-3 };
  const water = { surfaceTension: 0.07274, density: 998.2067, viscosity: 1.0016e-3 };
  const kRef = (C * hexane.density ** 2 * hexane.surfaceTension) / hexane.viscosity;
  const kTest = (C * water.density ** 2 * water.surfaceTension * 0.5) / water.viscosity;

  it('recovers C and θ = 60° from single runs of the worked example', () => {
    expect(kRef).toBeCloseTo(2.5944e-7, 10); // hand value above
    expect(kTest).toBeCloseTo(3.6183e-7, 10);
    const r = referenceLiquidContactAngle({ reference: { ...hexane, slopes: [kRef] }, test: { ...water, slopes: [kTest] } });
    expect(r.materialConstant.mean).toBeCloseTo(C, 25);
    expect(r.cosTheta.mean).toBeCloseTo(0.5, 14);
    expect((r.contactAngle * 180) / Math.PI).toBeCloseTo(60, 10);
    expect(r.warnings.map((w) => w.code)).toEqual(['single-run']);
    expect(r.caution).toBe(REFERENCE_LIQUID_CAUTION);
    expect(r.caution).toMatch(/fume hood/);
    expect(r.caution).toMatch(/safety data sheet/);
  });

  it('pools replicates: mean, sd and combined uncertainty of cos θ', () => {
    // Reference runs at K_ref·(0.98, 1, 1.02): C̄ = C, relative sd 0.02. Test runs at K_test·(0.97, 1, 1.03):
    // cos θᵢ = 0.5·(0.97, 1, 1.03) → mean 0.5, sd 0.015.
    // u = 0.5·√(0.03²/3 + 0.02²/3) = 0.5·√(4.333e-4) = 0.010408 (GUM first-order combination).
    const r = referenceLiquidContactAngle({
      reference: { ...hexane, slopes: [0.98, 1, 1.02].map((f) => f * kRef) },
      test: { ...water, slopes: [0.97, 1, 1.03].map((f) => f * kTest) },
    });
    expect(r.materialConstant.mean).toBeCloseTo(C, 25);
    expect(r.materialConstant.sd / C).toBeCloseTo(0.02, 12);
    expect(r.cosTheta.n).toBe(3);
    expect(r.cosTheta.mean).toBeCloseTo(0.5, 13);
    expect(r.cosTheta.sd).toBeCloseTo(0.015, 13);
    expect(r.cosTheta.uncertainty).toBeCloseTo(0.010408, 6);
    // θ range from cos θ̄ ± u: acos(0.510408) … acos(0.489592) = 59.31° … 60.69°.
    expect((r.contactAngleRange[0] * 180) / Math.PI).toBeCloseTo(59.31, 2);
    expect((r.contactAngleRange[1] * 180) / Math.PI).toBeCloseTo(60.69, 2);
    expect(r.warnings).toEqual([]);
  });

  it('clamps cos θ > 1 to θ = 0 with a warning', () => {
    const r = referenceLiquidContactAngle({
      reference: { ...hexane, slopes: [kRef, kRef] },
      test: { ...water, slopes: [2.2 * kTest, 2.2 * kTest] }, // cos θ = 1.1
    });
    expect(r.cosTheta.mean).toBeCloseTo(1.1, 12);
    expect(r.contactAngle).toBe(0);
    expect(r.warnings.map((w) => w.code)).toContain('cos-clamped');
  });

  it('refuses missing or non-positive slopes and liquid data', () => {
    expect(() =>
      referenceLiquidContactAngle({ reference: { ...hexane, slopes: [] }, test: { ...water, slopes: [kTest] } }),
    ).toThrowError(DomainError);
    expect(() =>
      referenceLiquidContactAngle({ reference: { ...hexane, slopes: [kRef] }, test: { ...water, slopes: [-kTest] } }),
    ).toThrowError(DomainError);
    expect(() =>
      referenceLiquidContactAngle({ reference: { ...hexane, viscosity: 0, slopes: [kRef] }, test: { ...water, slopes: [kTest] } }),
    ).toThrowError(DomainError);
  });
});
