import { DomainError } from '../errors';
import { convertQuantity, type ConvertQuantityResult } from './convert';
import { unitsModels } from './models';
import { DIMENSIONS, DISPLAY_UNITS, SI_UNIT } from './dimensions';
import { formatQuantity, fromSI, parseQuantity, toSI, unitDimension, unitFits, unitLabel } from './quantity';

/** Relative closeness for values of any magnitude. */
function expectRel(actual: number, expected: number, rel = 1e-12): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

function codeOf(f: () => unknown): string | undefined {
  try {
    f();
  } catch (e) {
    return e instanceof DomainError ? e.code : `not a DomainError: ${String(e)}`;
  }
  return undefined;
}

describe('units: exact definitions', () => {
  it('reads micrometres written as µm (micro sign), μm (Greek mu), um and micron', () => {
    // SI Brochure 9th ed. (2019), SI prefixes: micro = 1e-6; micron is the old name of the micrometre.
    for (const text of ['12 µm', '12 μm', '12 um', '12um', '12 micron', '12 microns']) {
      const q = parseQuantity(text);
      expect(q.dimension).toBe('length');
      expectRel(q.si, 12e-6);
    }
  });

  it('treats 1 denier as exactly 1/9 tex, and dtex as 1/10 tex', () => {
    // REFERENCES [P]: dtex = g per 10 000 m; denier = g per 9 000 m.
    expectRel(toSI(1, 'tex'), 1e-3 / 1e3, 1e-15); // 1 g/km
    expectRel(toSI(9, 'denier'), toSI(1, 'tex'), 1e-15);
    expectRel(toSI(1, 'den'), toSI(1, 'tex') / 9, 1e-15);
    expectRel(toSI(10, 'dtex'), toSI(1, 'tex'), 1e-15);
    // REFERENCES [P]: 1 den = 1.1111 dtex.
    expect(fromSI(toSI(1, 'denier'), 'dtex')).toBeCloseTo(1.1111, 4);
    // REFERENCES [P]: PP 6 den is quoted as 6.7 dtex.
    expect(fromSI(toSI(6, 'denier'), 'dtex')).toBeCloseTo(6.7, 1);
    expect(parseQuantity('1.7 dtex').dimension).toBe('linearDensity');
    expect(parseQuantity('3 denier', 'linearDensity').si).toBeCloseTo(3e-6 / 9, 20);
  });

  it('treats 1 cP as 1 mPa·s and 1 P as 0.1 Pa·s', () => {
    // BIPM SI Brochure 8th ed. (2006), Table 9: 1 P = 1 dyn s cm⁻² = 0.1 Pa s.
    expectRel(toSI(1, 'cP'), toSI(1, 'mPa s'), 1e-15);
    expectRel(toSI(1, 'P'), 0.1, 1e-15);
    expectRel(toSI(1, 'centipoise'), 1e-3, 1e-15);
    expectRel(parseQuantity('1.0 mPa s').si, 1e-3, 1e-15);
    expectRel(parseQuantity('1.0 mPa·s').si, 1e-3, 1e-15);
    expect(parseQuantity('1 cP').dimension).toBe('viscosity');
  });

  it('treats 1 cSt as 1 mm²/s', () => {
    // BIPM SI Brochure 8th ed. (2006), Table 9: 1 St = 1 cm² s⁻¹ = 1e-4 m² s⁻¹.
    expectRel(toSI(1, 'St'), 1e-4);
    expectRel(toSI(1, 'cSt'), toSI(1, 'mm^2/s'));
    expect(parseQuantity('1 cSt').dimension).toBe('kinematicViscosity');
  });

  it('derives the darcy from its definition 1 cP·cm²/(s·atm)', () => {
    // Darcy unit: 1 cP · 1 cm² / (1 s · 1 atm); atm = 101325 Pa exactly (CGPM 1954).
    const derived = (1e-3 * 1e-4) / (1 * 101325);
    expectRel(toSI(1, 'darcy'), derived, 1e-15);
    // From memory: 1 darcy ≈ 9.869233e-13 m².
    expect(toSI(1, 'darcy') / 1e-13).toBeCloseTo(9.869233, 6);
    expectRel(toSI(1, 'mD'), derived / 1000, 1e-15);
    const q = parseQuantity('2 darcy');
    expect(q.dimension).toBe('permeability');
    expectRel(q.si, 2 * derived, 1e-15);
  });

  it('reads basis weight in g/m², g/m^2 and gsm alike', () => {
    // Common practice: gsm = g/m².
    for (const text of ['45 g/m^2', '45 g/m²', '45 gsm']) {
      const q = parseQuantity(text);
      expect(q.dimension).toBe('basisWeight');
      expectRel(q.si, 0.045);
    }
  });

  it('converts temperatures with their offsets', () => {
    // SI Brochure 9th ed. (2019), definition of the Celsius temperature: t/°C = T/K − 273.15.
    expect(parseQuantity('25 degC').si).toBe(25 + 273.15);
    expect(parseQuantity('25 °C').si).toBe(25 + 273.15);
    expect(parseQuantity('25 ℃', 'temperature').si).toBe(25 + 273.15);
    // Fahrenheit scale, exact: T/K = (t/°F + 459.67) · 5/9. 32 °F = 0 °C, 212 °F = 100 °C.
    expectRel(toSI(32, 'degF'), 273.15);
    expectRel(toSI(212, 'degF'), 373.15);
    expect(fromSI(298.15, 'degC')).toBeCloseTo(25, 12);
    expect(toSI(300, 'K')).toBe(300);
  });

  it('reads percent and %RH as fractions', () => {
    for (const text of ['50 %RH', '50 % RH', '50 %', '50%']) {
      const q = parseQuantity(text);
      expect(q.dimension).toBe('fraction');
      expect(q.si).toBe(0.5);
      expect(q.unit).toBe('%');
    }
    expect(parseQuantity('0.5', 'fraction').si).toBe(0.5);
    expect(parseQuantity('12 g/g').dimension).toBe('massPerMass');
    expect(parseQuantity('12 g/g').si).toBe(12);
  });

  it('reads degrees as radians', () => {
    // Exact: 180° = π rad.
    for (const text of ['30 deg', '30°', '30 °']) {
      const q = parseQuantity(text);
      expect(q.dimension).toBe('angle');
      expectRel(q.si, Math.PI / 6, 1e-15);
    }
    expect(parseQuantity('1.2 rad', 'angle').si).toBe(1.2);
  });

  it('reads surface tension in mN/m and dyn/cm as the same quantity', () => {
    // CGS: 1 dyn/cm = 1e-5 N / 1e-2 m = 1 mN/m.
    expectRel(parseQuantity('72.8 mN/m').si, 0.0728);
    expectRel(toSI(72.8, 'dyn/cm'), 0.0728);
    expectRel(parseQuantity('72.8 mN m⁻¹').si, 0.0728);
    expect(parseQuantity('72.8 mN/m').dimension).toBe('surfaceTension');
  });

  it('reads lengths, areas and scientific notation', () => {
    expectRel(parseQuantity('0.8 mm').si, 8e-4);
    expectRel(parseQuantity('1e-11 m^2').si, 1e-11);
    expect(parseQuantity('1e-11 m^2').dimension).toBe('area');
    expect(parseQuantity('1e-11 m^2', 'permeability').dimension).toBe('permeability');
    expectRel(parseQuantity('1.2×10^-5 m').si, 1.2e-5);
    expectRel(parseQuantity('−3 mm').si, -3e-3);
  });
});

describe('units: round trips and identities', () => {
  it('gives 1 for one SI unit of every dimension', () => {
    for (const d of DIMENSIONS) {
      expect(toSI(1, SI_UNIT[d], d)).withContext(d).toBeCloseTo(1, 14);
    }
  });

  it('offers display units that fit their dimension and convert back and forth', () => {
    for (const d of DIMENSIONS) {
      for (const unit of DISPLAY_UNITS[d]) {
        expect(unitFits(unit, d)).withContext(`${d} ${unit}`).toBeTrue();
        for (const x of [-40, 0.3, 1, 7.25, 1234.5]) {
          const back = fromSI(toSI(x, unit, d), unit);
          expect(Math.abs(back - x)).withContext(`${d} ${unit} ${x}`).toBeLessThan(1e-12 * Math.max(1, Math.abs(x)));
        }
      }
    }
  });

  it('is linear for units without an offset and affine for °C', () => {
    for (const unit of ['um', 'dtex', 'cP', 'gsm', 'darcy', 'mN/m']) {
      expectRel(toSI(6, unit), 2 * toSI(3, unit));
      expect(toSI(0, unit)).toBe(0);
    }
    // Differences of Celsius temperatures equal differences in kelvin (SI Brochure, Celsius temperature).
    expect(toSI(40, 'degC') - toSI(10, 'degC')).toBeCloseTo(30, 12);
  });

  it('is strictly increasing in the typed value (property)', () => {
    for (const unit of ['degC', 'degF', 'um', '%']) {
      let prev = -Infinity;
      for (let x = -100; x <= 100; x += 7.3) {
        const si = toSI(x, unit);
        expect(si).toBeGreaterThan(prev);
        prev = si;
      }
    }
  });

  it('names the dimension of a unit on its own', () => {
    expect(unitDimension('um')).toBe('length');
    expect(unitDimension('darcy')).toBe('permeability');
    expect(unitDimension('dtex')).toBe('linearDensity');
    expect(unitDimension('%')).toBe('fraction');
    expect(unitDimension('g/mol')).toBe('molarMass');
  });
});

describe('units: formatting', () => {
  it('writes µ for micro, °C, ° and superscript powers', () => {
    expect(formatQuantity(12e-6, 'um')).toBe('12 µm');
    expect(formatQuantity(12e-6, 'µm')).toBe('12 µm');
    expect(formatQuantity(298.15, 'degC')).toBe('25 °C');
    expect(formatQuantity(Math.PI / 6, 'deg')).toBe('30°');
    expect(formatQuantity(0.045, 'g/m^2')).toBe('45 g/m²');
    expect(formatQuantity(1e-3, 'mPa s')).toBe('1 mPa·s');
    expect(formatQuantity(0.5, '%')).toBe('50 %');
    expect(formatQuantity(1 / 3, 'm', 3)).toBe('0.333 m');
    expect(unitLabel('kg/(m^2 s)')).toBe('kg/(m²·s)');
    expect(unitLabel('uL')).toBe('µL');
  });
});

describe('units: errors', () => {
  it('refuses a unit of the wrong kind and names the expected one in words', () => {
    expect(() => parseQuantity('12 mm', 'temperature')).toThrowMatching(
      (e) => e instanceof DomainError && e.code === 'wrong-dimension' && /expected a temperature, e\.g\. 25 °C/.test(e.message),
    );
    expect(() => parseQuantity('3 kg', 'length')).toThrowMatching(
      (e) => e instanceof DomainError && e.code === 'wrong-dimension' && /expected a length, e\.g\. 12 µm/.test(e.message),
    );
    expect(codeOf(() => toSI(1, 'mN/m', 'viscosity'))).toBe('wrong-dimension');
    expect(codeOf(() => parseQuantity('12', 'length'))).toBe('wrong-dimension');
  });

  it('says which unit it does not know', () => {
    expect(codeOf(() => parseQuantity('12 foo'))).toBe('unknown-unit');
    expect(codeOf(() => toSI(1, 'furlongs per fortnight'))).toBe('unknown-unit');
    expect(() => parseQuantity('12 foo')).toThrowError(DomainError, /foo/);
  });

  it('refuses garbage and non-finite numbers', () => {
    for (const bad of ['abc', '', 'mm 12', '12 m 3', '1..2 mm']) {
      expect(codeOf(() => parseQuantity(bad))).withContext(bad).toMatch(/unparsable|unknown-unit/);
    }
    expect(codeOf(() => parseQuantity('abc'))).toBe('unparsable');
    expect(codeOf(() => toSI(Number.NaN, 'm'))).toBe('not-finite');
    expect(codeOf(() => parseQuantity('1e400 m'))).toBe('not-finite');
  });
});

describe('units: convert-quantity model', () => {
  it('converts denier to dtex through the model registry entry', () => {
    const model = unitsModels.find((m) => m.id === 'convert-quantity');
    expect(model).toBeDefined();
    const r = model!.run({ quantity: '3 denier', to: 'dtex' }) as ConvertQuantityResult;
    // REFERENCES [P]: 1 den = 1/9 tex = 10/9 dtex.
    expect(r.value).toBeCloseTo(30 / 9, 12);
    expect(r.dimension).toBe('linearDensity');
    expect(r.siUnit).toBe('kg/m');
    expect(r.warnings).toEqual([]);
    expect(r.inputs.quantity).toBe('3 denier');
  });

  it('refuses a target unit of another kind', () => {
    expect(codeOf(() => convertQuantity({ quantity: '3 denier', to: 'mm' }))).toBe('wrong-dimension');
  });
});
