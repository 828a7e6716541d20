import { DomainError } from '../errors';
import {
  iapwsSurfaceTension,
  iapwsViscosity,
  tanakaDensity,
  WATER_CRITICAL_TEMPERATURE,
  waterProperties,
} from './water';

const K = (celsius: number): number => celsius + 273.15;

describe('water surface tension (IAPWS R1-76(2014))', () => {
  // Each row: °C, mN/m as printed (2 decimals), and where the number comes from.
  const rows: readonly [number, number, string][] = [
    [0.01, 75.65, 'IAPWS R1-76(2014) table, from memory (REFERENCES: agrees with the formula)'],
    [10, 74.22, 'NBS/NRC Steam Tables (1984)'],
    [20, 72.74, 'IAPWS R1-76(2014) table, from memory'],
    [25, 71.97, 'IAPWS R1-76(2014) table, from memory'],
    [30, 71.19, 'IAPWS R1-76(2014) table, from memory'],
    [40, 69.6, 'NBS/NRC Steam Tables (1984)'],
    [50, 67.94, 'IAPWS R1-76(2014) table, from memory'],
    [100, 58.91, 'IAPWS R1-76(2014) table, from memory'],
    [200, 37.68, 'NBS/NRC Steam Tables (1984)'],
  ];

  for (const [c, mNm, source] of rows) {
    // The 1984 tables follow the 1976 release on IPTS-68 (Tc = 647.15 K), which moves σ at 200 °C
    // by 0.009 mN/m; allow one unit in the last printed digit for them, half a unit for IAPWS 2014.
    const tolerance = source.startsWith('NBS') ? 0.01 : 0.005;
    it(`gives ${mNm} mN/m at ${c} °C to the printed 2 decimals (${source})`, () => {
      const sigma = iapwsSurfaceTension(K(c)) * 1e3;
      expect(Math.abs(sigma - mNm)).toBeLessThanOrEqual(tolerance + 1e-9);
    });
  }

  it('falls monotonically with temperature and vanishes at the critical point (property)', () => {
    let prev = Infinity;
    for (let T = 273.16; T < WATER_CRITICAL_TEMPERATURE; T += 3.7) {
      const s = iapwsSurfaceTension(T);
      expect(s).toBeLessThan(prev);
      expect(s).toBeGreaterThan(0);
      prev = s;
    }
    // σ ∝ τ^1.256 → 0 as τ → 0 (IAPWS R1-76 Eq. 1).
    expect(iapwsSurfaceTension(WATER_CRITICAL_TEMPERATURE - 1e-6)).toBeLessThan(1e-9);
  });

  it('refuses temperatures at or above the critical point', () => {
    expect(() => iapwsSurfaceTension(WATER_CRITICAL_TEMPERATURE)).toThrowError(DomainError);
    expect(() => iapwsSurfaceTension(700)).toThrowError(DomainError);
    expect(() => iapwsSurfaceTension(Number.NaN)).toThrowError(DomainError);
  });
});

describe('water viscosity (IAPWS R12-08, μ̄2 = 1)', () => {
  // IAPWS R12-08, Table 4: computer-program verification points, μ in µPa·s printed to 6 decimals.
  const points: readonly [number, number, number][] = [
    [298.15, 998, 889.7351],
    [298.15, 1200, 1437.649467],
    [373.15, 1000, 307.883622],
    [433.15, 1, 14.538324],
    [433.15, 1000, 217.685358],
    [873.15, 1, 32.619287],
    [873.15, 100, 35.802262],
  ];
  for (const [T, rho, muMicro] of points) {
    it(`reproduces the verification value at T = ${T} K, ρ = ${rho} kg/m³ to every printed digit`, () => {
      // IAPWS R12-08 Table 4: the row listed above.
      const mu = iapwsViscosity(T, rho) * 1e6;
      expect(Number(mu.toFixed(6))).toBe(muMicro);
    });
  }

  it('gives 1.0016 mPa·s at 20 °C and 1 atm', () => {
    // ISO/TR 3666:1998, from memory: 1.0016 mPa·s at 20 °C, 0.101325 MPa.
    const mu = iapwsViscosity(K(20), tanakaDensity(K(20))) * 1e3;
    expect(Math.abs(mu - 1.0016)).toBeLessThan(0.00005);
  });

  it('falls with temperature for liquid water at 1 atm (property)', () => {
    let prev = Infinity;
    for (let c = 0; c <= 100; c += 2.5) {
      const mu = waterProperties({ temperature: K(c) }).viscosity;
      expect(mu).toBeLessThan(prev);
      prev = mu;
    }
  });

  it('refuses non-positive temperature or density', () => {
    expect(() => iapwsViscosity(0, 998)).toThrowError(DomainError);
    expect(() => iapwsViscosity(300, -1)).toThrowError(DomainError);
  });
});

describe('water density (Tanaka et al. 2001)', () => {
  it('gives the CIPM values at 4 °C and 20 °C', () => {
    // REFERENCES [C] from Tanaka et al., Metrologia 38 (2001) 301, Eq. 1: 999.9749 and 998.2067 kg/m³.
    expect(tanakaDensity(K(4))).toBeCloseTo(999.9749, 4);
    expect(tanakaDensity(K(20))).toBeCloseTo(998.2067, 4);
  });

  it('peaks at 3.983035 °C with the value a5 = 999.97495 kg/m³', () => {
    // Identity of Tanaka Eq. 1: the bracket is 1 at t = −a1, and ρ falls on either side.
    const tMax = K(3.983035);
    expect(tanakaDensity(tMax)).toBeCloseTo(999.97495, 9);
    expect(tanakaDensity(tMax - 0.5)).toBeLessThan(tanakaDensity(tMax));
    expect(tanakaDensity(tMax + 0.5)).toBeLessThan(tanakaDensity(tMax));
  });

  it('agrees with Kell (1975) within 0.005 kg/m³ from 0 to 40 °C', () => {
    // Kell, J. Chem. Eng. Data 20 (1975) 97, Eq. 16, coefficients from memory (t in °C, IPTS-68).
    const kell = (t: number): number =>
      (999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5) /
      (1 + 16.87985e-3 * t);
    for (let t = 0; t <= 40; t += 2) {
      expect(Math.abs(tanakaDensity(K(t)) - kell(t))).withContext(`${t} °C`).toBeLessThan(0.005);
    }
  });
});

describe('waterProperties', () => {
  it('combines the three formulas and reports no warning at 25 °C', () => {
    const r = waterProperties({ temperature: K(25) });
    expect(r.warnings).toEqual([]);
    expect(r.surfaceTension).toBe(iapwsSurfaceTension(K(25)));
    expect(r.density).toBe(tanakaDensity(K(25)));
    expect(r.viscosity).toBe(iapwsViscosity(K(25), r.density));
    expect(r.inputs.temperature).toBe(K(25));
  });

  it('uses a density the caller gives', () => {
    // IAPWS R12-08 Table 4: 889.735100 µPa·s at 298.15 K, 998 kg/m³.
    const r = waterProperties({ temperature: 298.15, density: 998 });
    expect(r.viscosity * 1e6).toBeCloseTo(889.7351, 5);
    expect(r.density).toBe(998);
  });

  it('warns outside the validity ranges instead of returning silent values', () => {
    const warm = waterProperties({ temperature: K(60) });
    expect(warm.warnings.map((w) => w.code)).toContain('density-extrapolated');
    const cold = waterProperties({ temperature: K(-10) });
    expect(cold.warnings.map((w) => w.code)).toContain('supercooled');
    const hot = waterProperties({ temperature: K(120) });
    expect(hot.warnings.map((w) => w.code)).toContain('above-boiling');
    expect(() => waterProperties({ temperature: K(200) })).toThrowError(DomainError);
    expect(() => waterProperties({ temperature: K(-40) })).toThrowError(DomainError);
  });
});
