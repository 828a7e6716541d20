import { DomainError } from '../errors';
import { gravityHeight } from '../washburn/gravity';
import { jurinHeightForDiameter, poreSizeEquilibrium } from './equilibrium';
import { poreSizeStatistics } from './statistics';
import { poreSizeUptake } from './uptake';

const deg = Math.PI / 180;
// Water-like test liquid (round numbers; not a property claim).
const water = { surfaceTension: 0.072, contactAngle: 0, density: 1000 };

describe('pore-size bundle: equilibrium (Jurin per class)', () => {
  it('a single class reproduces the textbook capillary rise', () => {
    // Çengel & Cimbala, Fluid Mechanics, Example 2-6: D = 0.6 mm, σ = 0.073 N/m, ρ = 1000 kg/m³,
    // g = 9.81 m/s², θ = 0 → h ≈ 0.0496 m (5.0 cm).
    expect(jurinHeightForDiameter(0.6e-3, 0.073, 0, 1000, 9.81)).toBeCloseTo(0.0496, 4);
    const r = poreSizeEquilibrium({
      diameters: [0.6e-3],
      fractions: [1],
      form: 'differential',
      surfaceTension: 0.073,
      contactAngle: 0,
      density: 1000,
      gravity: 9.81,
    });
    expect(r.jurinHeights[0]).toBeCloseTo(0.0496, 4);
    // OpenStax College Physics, Example 11.12: γ = 0.0728 N/m, θ = 0, ρ = 1050 kg/m³, g = 9.80 m/s²,
    // r = 1.41e-7 m for h = 100 m (r printed to 3 digits, so h to ±0.5 %).
    expect(jurinHeightForDiameter(2 * 1.41e-7, 0.0728, 0, 1050, 9.8) / 100).toBeCloseTo(1, 2);
  });

  it('a two-class distribution gives a step profile at the two Jurin heights', () => {
    const d1 = 20e-6;
    const d2 = 100e-6;
    const r = poreSizeEquilibrium({
      diameters: [d1, d2],
      fractions: [0.3, 0.7],
      form: 'differential',
      ...water,
      heights: [0, 0.1, 0.29, 0.3, 1.4, 1.5],
    });
    // Jurin: h = 4γcosθ/(ρgD) (Jurin 1718; de Gennes et al. 2004): 1.4684 m and 0.29369 m.
    const h1 = (4 * 0.072) / (1000 * 9.80665 * d1);
    const h2 = (4 * 0.072) / (1000 * 9.80665 * d2);
    expect(r.jurinHeights[0]).toBeCloseTo(h1, 12);
    expect(r.jurinHeights[1]).toBeCloseTo(h2, 12);
    // S = 1 up to h2, 0.3 (small pores only) up to h1, 0 above.
    expect(Array.from(r.saturationAtHeights)).toEqual([1, 1, 1, 0.3, 0.3, 0]);
    expect(r.profile.stepHeights[0]).toBeCloseTo(h2, 12);
    expect(r.profile.stepHeights[1]).toBeCloseTo(h1, 12);
    expect(r.profile.saturation[0]).toBeCloseTo(1, 14);
    expect(r.profile.saturation[1]).toBeCloseTo(0.3, 14);
    expect(r.meanFilledHeight).toBeCloseTo(0.3 * h1 + 0.7 * h2, 12);
  });

  it('retention curve: Pc = 4γcosθ/D and Pc = ρ g h (Young–Laplace identity)', () => {
    const r = poreSizeEquilibrium({
      diameters: [10e-6, 30e-6, 90e-6],
      fractions: [0.2, 0.5, 1],
      form: 'cumulative-finer',
      ...water,
      contactAngle: 40 * deg,
    });
    for (let i = 0; i < 3; i++) {
      const d = [10e-6, 30e-6, 90e-6][i];
      expect(r.retention.capillaryPressure[i]).toBeCloseTo((4 * 0.072 * Math.cos(40 * deg)) / d, 6);
      expect(r.retention.capillaryPressure[i] / (1000 * 9.80665 * r.retention.head[i])).toBeCloseTo(1, 12);
    }
    // Property: saturation ascends while pressure descends.
    expect(r.retention.saturation[0]).toBeLessThan(r.retention.saturation[2]);
    expect(r.retention.capillaryPressure[0]).toBeGreaterThan(r.retention.capillaryPressure[2]);
  });

  it('refuses non-wetting liquids and zero gravity for the equilibrium', () => {
    const base = { diameters: [1e-5], fractions: [1], form: 'differential' as const, ...water };
    expect(() => poreSizeEquilibrium({ ...base, contactAngle: 100 * deg })).toThrowError(DomainError, /below 90°/);
    expect(() => poreSizeEquilibrium({ ...base, gravity: 0 })).toThrowError(DomainError);
  });

  it('warns when pores are not small against the capillary length', () => {
    const r = poreSizeEquilibrium({ diameters: [1e-3], fractions: [1], form: 'differential', ...water });
    // Capillary length √(γ/(ρg)) = 2.7 mm for water (de Gennes et al. 2004, from memory): r = 0.5 mm > 0.27 mm.
    expect(r.warnings.map((w) => w.code)).toContain('pores-not-capillary');
  });
});

describe('pore-size bundle: uptake (gravity-restrained Washburn per class)', () => {
  const base = {
    ...water,
    viscosity: 1e-3,
    porosity: 0.8,
    thickness: 1e-3,
    form: 'differential' as const,
  };

  it('a single class reduces to the Fries & Dreyer dimensionless solution (identity)', () => {
    const r = 50e-6;
    const a = (0.072 * r) / (4 * 1e-3);
    const b = (1000 * 9.80665 * r * r) / (8 * 1e-3);
    const heq = a / b;
    const tStar = a / (b * b);
    const res = poreSizeUptake({ ...base, diameters: [2 * r], fractions: [1], times: [0.01 * tStar, tStar, 5 * tStar] });
    // Dimensionless check rows H(T) for T = 0.01, 1, 5 (Fries & Dreyer 2008 explicit form, evaluated in
    // 30-digit arithmetic: 0.134834751067, 0.841405660437, 0.997515080665).
    expect(res.meanFilledLength[0] / heq).toBeCloseTo(0.134834751067, 10);
    expect(res.meanFilledLength[1] / heq).toBeCloseTo(0.841405660437, 10);
    expect(res.meanFilledLength[2] / heq).toBeCloseTo(0.997515080665, 10);
    expect(res.classEquilibriumLength?.[0]).toBeCloseTo(heq, 12);
    // h_eq of the class is its Jurin height 2γcosθ/(ρ g r) (vertical strip).
    expect(heq).toBeCloseTo((2 * 0.072) / (1000 * 9.80665 * r), 12);
    expect(res.saturation[1]).toBe(1);
  });

  it('horizontal single class follows h² = γ r cosθ t/(2η) (Washburn 1921)', () => {
    const r = 20e-6;
    const t = [0, 1, 10, 100];
    const res = poreSizeUptake({ ...base, contactAngle: 30 * deg, tilt: 0, diameters: [2 * r], fractions: [1], times: t });
    for (let j = 0; j < t.length; j++) {
      expect(res.frontLength[j]).toBeCloseTo(Math.sqrt((0.072 * r * Math.cos(30 * deg) * t[j]) / (2 * 1e-3)), 12);
    }
    expect(res.classEquilibriumLength).toBeNull();
  });

  it('conserves mass: uptake = ρ ε δ Σ fᵢ hᵢ with hᵢ from the single-capillary solution', () => {
    const diameters = [8e-6, 15e-6, 30e-6, 60e-6, 120e-6];
    const fractions = [0.1, 0.25, 0.3, 0.25, 0.1];
    const times = [0.5, 3, 20, 100, 600, 3600];
    const res = poreSizeUptake({ ...base, contactAngle: 50 * deg, diameters, fractions, times, includeClassHeights: true });
    for (let j = 0; j < times.length; j++) {
      let sum = 0;
      for (let i = 0; i < diameters.length; i++) {
        const rr = diameters[i] / 2;
        const a = (0.072 * rr * Math.cos(50 * deg)) / (4e-3);
        const b = (1000 * 9.80665 * rr * rr) / 8e-3;
        const h = gravityHeight(a, b, times[j]);
        expect(res.classHeights?.[i * times.length + j] ?? NaN).toBeCloseTo(h, 11);
        sum += fractions[i] * h;
      }
      expect(res.massPerCrossSection[j] / (1000 * 0.8 * sum)).toBeCloseTo(1, 11);
      expect(res.massPerWidth[j] / (1000 * 0.8 * 1e-3 * sum)).toBeCloseTo(1, 11);
    }
  });

  it('approaches the equilibrium bundle at long times (consistency of both parts)', () => {
    const psd = { diameters: [10e-6, 40e-6], fractions: [0.5, 0.5] };
    const eq = poreSizeEquilibrium({ ...psd, form: 'differential', ...water });
    const up = poreSizeUptake({ ...base, ...psd, times: [1e8] });
    // t* = a/b² is 9.6e4 s for the 10 µm class; at t = 10⁸ s (T ≈ 1000, H = 1 − e^(−1001)) Σ fᵢ hᵢ → Σ fᵢ Jurin heights.
    expect(up.meanFilledLength[0] / eq.meanFilledHeight).toBeCloseTo(1, 12);
  });

  it('uptake grows with time, saturation stays in (0, 1] and starts at Σ fᵢ√(Dᵢ/D_max) (properties)', () => {
    const diameters = Array.from({ length: 30 }, (_, i) => 5e-6 * 1.12 ** i);
    const fractions = diameters.map((_, i) => Math.exp(-(((i - 15) / 6) ** 2)));
    const sum = fractions.reduce((x, y) => x + y, 0);
    const times = Array.from({ length: 200 }, (_, j) => j * 5);
    const res = poreSizeUptake({ ...base, diameters, fractions: fractions.map((f) => f / sum), times });
    let s0 = 0;
    for (let i = 0; i < 30; i++) s0 += (fractions[i] / sum) * Math.sqrt(diameters[i] / diameters[29]);
    expect(res.saturation[0]).toBeCloseTo(s0, 12);
    for (let j = 1; j < times.length; j++) {
      expect(res.massPerWidth[j]).toBeGreaterThan(res.massPerWidth[j - 1]);
      expect(res.saturation[j]).toBeGreaterThan(0);
      expect(res.saturation[j]).toBeLessThanOrEqual(1);
      expect(res.frontLength[j]).toBeGreaterThanOrEqual(res.meanFilledLength[j]);
    }
  });

  it('refuses invalid layer data', () => {
    const ok = { ...base, diameters: [1e-5], fractions: [1], times: [1] };
    expect(() => poreSizeUptake({ ...ok, porosity: 1 })).toThrowError(DomainError);
    expect(() => poreSizeUptake({ ...ok, viscosity: 0 })).toThrowError(DomainError);
    expect(() => poreSizeUptake({ ...ok, times: [-1] })).toThrowError(DomainError);
    expect(() => poreSizeUptake({ ...ok, times: [] })).toThrowError(DomainError);
    expect(() => poreSizeUptake({ ...ok, tilt: Math.PI })).toThrowError(DomainError);
  });
});

describe('pore-size statistics', () => {
  it('single class: every figure is its diameter', () => {
    const s = poreSizeStatistics({ diameters: [25e-6], fractions: [1], form: 'differential' });
    expect(s.meanDiameter).toBe(25e-6);
    expect(s.medianDiameter).toBe(25e-6);
    expect(s.modeDiameter).toBe(25e-6);
    expect(s.geometricMeanDiameter).toBeCloseTo(25e-6, 18);
  });

  it('two classes: volume-weighted mean and log-interpolated median by hand', () => {
    const s = poreSizeStatistics({ diameters: [10e-6, 40e-6], fractions: [0.25, 0.75], form: 'differential' });
    // Mean 0.25·10 + 0.75·40 = 32.5 µm; F = 0.25, 1 → D50 = exp(ln 10 + ⅓ ln 4) = 10·4^⅓ = 15.874 µm.
    expect(s.meanDiameter).toBeCloseTo(32.5e-6, 18);
    expect(s.medianDiameter).toBeCloseTo(10e-6 * 4 ** (1 / 3), 18);
    expect(s.modeDiameter).toBe(40e-6);
    // Geometric mean 10^0.25 · 40^0.75 µm.
    expect(s.geometricMeanDiameter).toBeCloseTo(10e-6 ** 0.25 * 40e-6 ** 0.75, 18);
  });
});
