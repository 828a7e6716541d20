import { DomainError } from '../errors';
import { BUILT_IN_LIQUIDS, FLAMMABLE_CAUTION } from './built-in';
import { checkTable, interpolateTable } from './interpolate';
import { liquidAt, type UserLiquidDefinition } from './liquid-at';
import { liquidsModels } from './models';
import { iapwsSurfaceTension, tanakaDensity } from './water';

const K = (celsius: number): number => celsius + 273.15;
const codes = (r: { warnings: readonly { code: string }[] }): string[] => r.warnings.map((w) => w.code);

describe('built-in test liquids', () => {
  it('carry the handbook surface tensions at 20 °C', () => {
    // CRC Handbook of Chemistry and Physics (REFERENCES [P]): n-hexane 17.9, n-heptane 20.14,
    // n-decane 23.8, diiodomethane 50.8, ethylene glycol 48.0 mN/m; ethanol 22.39 mN/m (Adamson & Gast).
    const expected: Record<string, number> = {
      'n-hexane': 17.9,
      'n-heptane': 20.14,
      'n-decane': 23.8,
      ethanol: 22.39,
      diiodomethane: 50.8,
      'ethylene-glycol': 48.0,
    };
    for (const [id, mNm] of Object.entries(expected)) {
      expect(liquidAt(id, K(20)).surfaceTension * 1e3).withContext(id).toBeCloseTo(mNm, 6);
    }
  });

  it('give water from the IAPWS/Tanaka formulas with their sources', () => {
    // IAPWS R1-76(2014) table, from memory: 71.97 mN/m at 25 °C.
    const w = liquidAt('water', K(25));
    expect(w.surfaceTension * 1e3).toBeCloseTo(71.97, 2);
    expect(w.sources.surfaceTension).toContain('IAPWS R1-76');
    expect(w.sources.density).toContain('Tanaka');
    expect(w.warnings).toEqual([]);
    expect(w.flammable).toBeFalse();
  });

  it('make 0.9 % saline slightly above water in surface tension, density and viscosity', () => {
    // REFERENCES [M]: saline ≈ water + 0.25 mN/m, ≈1.0046 g/cm³ and ≈1.02 mPa·s at 20 °C.
    const s = liquidAt('saline-0.9', K(20));
    const w = liquidAt('water', K(20));
    expect((s.surfaceTension - w.surfaceTension) * 1e3).toBeCloseTo(0.25, 9);
    expect(s.density).toBeCloseTo(1004.6, 6);
    expect(s.viscosity * 1e3).toBeCloseTo(1.02, 6);
    // Ratios to water stay fixed at other temperatures (by construction of the scaling).
    const s37 = liquidAt('saline-0.9', K(37));
    const w37 = liquidAt('water', K(37));
    expect(s37.density / w37.density).toBeCloseTo(1004.6 / tanakaDensity(K(20)), 12);
    expect(s37.viscosity / w37.viscosity).toBeCloseTo(s.viscosity / w.viscosity, 12);
  });

  it('give simulated urine its specified 70 mN/m with a measure-each-batch remark', () => {
    // REFERENCES [M]: simulated urine, 9 g/L NaCl, surface tension specified 70 ± 2 mN/m.
    const u = liquidAt('simulated-urine', K(23));
    expect(u.surfaceTension).toBeCloseTo(0.07, 12);
    expect(codes(u)).toContain('specified-surface-tension');
    expect(u.surfaceTension).toBeLessThan(iapwsSurfaceTension(K(23)));
  });

  it('flag the flammable reference solvents and add the caution', () => {
    // Common practice: alkanes and ethanol are flammable liquids; glycols, glycerol and water are not.
    const flammable = BUILT_IN_LIQUIDS.filter((l) => l.flammable).map((l) => l.id).sort();
    expect(flammable).toEqual(['ethanol', 'n-decane', 'n-heptane', 'n-hexane']);
    const h = liquidAt('n-hexane', K(20));
    expect(h.flammable).toBeTrue();
    expect(h.warnings.some((w) => w.code === 'flammable' && w.message === FLAMMABLE_CAUTION)).toBeTrue();
    expect(FLAMMABLE_CAUTION).toMatch(/confirm them with standard tests/);
    expect(codes(liquidAt('glycerol', K(20)))).not.toContain('flammable');
  });

  it('have a source for every value and plausible magnitudes', () => {
    for (const l of BUILT_IN_LIQUIDS) {
      const mid = (l.validRange.min + l.validRange.max) / 2;
      const p = liquidAt(l.id, mid);
      for (const key of ['surfaceTension', 'viscosity', 'density'] as const) {
        expect(p.sources[key].length).withContext(`${l.id} ${key}`).toBeGreaterThan(5);
      }
      // Common practice: liquids at room temperature lie in these bands.
      expect(p.surfaceTension).toBeGreaterThan(0.01);
      expect(p.surfaceTension).toBeLessThan(0.08);
      expect(p.density).toBeGreaterThan(500);
      expect(p.density).toBeLessThan(4000);
      expect(p.viscosity).toBeGreaterThan(1e-4);
      expect(p.viscosity).toBeLessThan(2);
      expect(l.validRange.min).toBeLessThan(l.validRange.max);
    }
  });

  it('warns when a handbook value is used far from its temperature', () => {
    expect(codes(liquidAt('n-decane', K(22)))).not.toContain('handbook-temperature');
    const hot = liquidAt('n-decane', K(40));
    expect(codes(hot)).toContain('handbook-temperature');
    expect(codes(hot)).toContain('outside-range');
  });

  it('refuses an unknown liquid id', () => {
    expect(() => liquidAt('unobtainium', K(20))).toThrowMatching(
      (e) => e instanceof DomainError && e.code === 'unknown-liquid',
    );
  });
});

describe('user liquids', () => {
  const oil: UserLiquidDefinition = {
    name: 'Test oil',
    surfaceTension: 0.031,
    viscosity: [
      { temperature: K(40), value: 0.02 },
      { temperature: K(20), value: 0.05 },
    ],
    density: [{ temperature: K(20), value: 870 }],
    sources: { surfaceTension: 'lab, pendant drop' },
  };

  it('interpolates tables linearly and keeps constants', () => {
    // Linear interpolation: half-way between 0.05 and 0.02 Pa·s is 0.035 Pa·s.
    const p = liquidAt(oil, K(30));
    expect(p.viscosity).toBeCloseTo(0.035, 12);
    expect(p.surfaceTension).toBe(0.031);
    expect(p.sources.surfaceTension).toBe('lab, pendant drop');
    expect(p.sources.viscosity).toBe('user input');
    expect(p.id).toBe('user');
  });

  it('clamps outside the table with a warning', () => {
    const p = liquidAt(oil, K(60));
    expect(p.viscosity).toBe(0.02);
    expect(codes(p)).toContain('table-clamped');
    // The single-row density table is clamped everywhere except at its own temperature.
    expect(codes(liquidAt({ ...oil, viscosity: 0.03 }, K(20)))).toEqual([]);
  });

  it('refuses empty tables, repeated temperatures and non-positive values', () => {
    expect(() => liquidAt({ ...oil, density: [] }, K(20))).toThrowError(DomainError);
    expect(() =>
      liquidAt(
        {
          ...oil,
          density: [
            { temperature: K(20), value: 870 },
            { temperature: K(20), value: 871 },
          ],
        },
        K(20),
      ),
    ).toThrowError(DomainError);
    expect(() => liquidAt({ ...oil, surfaceTension: -1 }, K(20))).toThrowError(DomainError);
    expect(() => liquidAt({ ...oil, name: '' }, K(20))).toThrowError(DomainError);
  });

  it('adds the caution to a flammable user liquid', () => {
    expect(codes(liquidAt({ ...oil, flammable: true }, K(20)))).toContain('flammable');
  });
});

describe('table interpolation (properties)', () => {
  it('reproduces the table rows, stays between neighbours and is monotonic on monotonic data', () => {
    const table = checkTable('x', [
      { temperature: 300, value: 3 },
      { temperature: 280, value: 1 },
      { temperature: 290, value: 2.5 },
    ]);
    for (const row of table) expect(interpolateTable(table, row.temperature).value).toBe(row.value);
    let prev = -Infinity;
    for (let T = 275; T <= 305; T += 0.5) {
      const v = interpolateTable(table, T).value;
      expect(v).toBeGreaterThanOrEqual(prev);
      expect(v).toBeGreaterThanOrEqual(1);
      expect(v).toBeLessThanOrEqual(3);
      prev = v;
    }
  });
});

describe('liquids models', () => {
  it('run with SI inputs', () => {
    const model = liquidsModels.find((m) => m.id === 'liquid-properties');
    const r = model!.run({ liquid: 'ethanol', temperature: K(20) }) as ReturnType<typeof liquidAt>;
    // Adamson & Gast (REFERENCES [P]): ethanol 22.39 mN/m at 20 °C.
    expect(r.surfaceTension * 1e3).toBeCloseTo(22.39, 6);
    const w = liquidsModels.find((m) => m.id === 'water-properties')!.run({ temperature: 298.15, density: 998 }) as {
      viscosity: number;
    };
    // IAPWS R12-08 Table 4: 889.735100 µPa·s.
    expect(w.viscosity * 1e6).toBeCloseTo(889.7351, 5);
  });
});
