import { DomainError } from '../errors';
import { tornado } from './sensitivity';

describe('one-at-a-time sensitivity (tornado)', () => {
  type K = 'a' | 'b' | 'c';
  // y = 5a + 2b² − c: swings are known in closed form.
  const f = (v: Readonly<Record<K, number>>): number => 5 * v.a + 2 * v.b * v.b - v.c;
  const nominal = { a: 1, b: 2, c: 3 };

  it('ranks inputs by swing with exact P10/P90 ends of uniform tolerances', () => {
    const r = tornado(f, nominal, {
      a: { kind: 'uniform', min: 0.5, max: 1.5 }, // P10 0.6, P90 1.4 → swing 5·0.8 = 4
      b: { kind: 'uniform', min: 1, max: 3 }, //     P10 1.2, P90 2.8 → swing 2(2.8² − 1.2²) = 12.8
      c: { kind: 'uniform', min: 0, max: 6 }, //     P10 0.6, P90 5.4 → swing 4.8
    });
    // Uniform quantile F⁻¹(p) = min + p(max − min) (exact).
    expect(r.bars.map((b) => b.name)).toEqual(['b', 'c', 'a']);
    expect(r.bars[0].inputLow).toBeCloseTo(1.2, 14);
    expect(r.bars[0].inputHigh).toBeCloseTo(2.8, 14);
    expect(r.bars[0].swing).toBeCloseTo(12.8, 12);
    expect(r.bars[1].swing).toBeCloseTo(4.8, 12);
    expect(r.bars[2].swing).toBeCloseTo(4, 12);
    expect(r.bars[1].outputHigh).toBeCloseTo(5 + 8 - 5.4, 12); // c at its high end lowers y
    expect(r.baseOutput).toBe(10);
  });

  it('uses mean ∓ 1.2816 sd for a normal tolerance', () => {
    const r = tornado(f, nominal, { a: { kind: 'normal', sd: 0.1 } });
    // Standard normal table: z₀.₉ = 1.2816 (more digits 1.2815516).
    expect(r.bars[0].inputLow).toBeCloseTo(1 - 0.12815516, 7);
    expect(r.bars[0].swing).toBeCloseTo(5 * 2 * 0.12815516, 6);
  });

  it('triangular ends follow the inverse distribution function', () => {
    const r = tornado(f, nominal, { c: { kind: 'triangular', min: 2, max: 6 } }, { level: 0.1 });
    // Mode defaults to the nominal 3: F_c = 0.25; P10 = 2 + √(0.1·4·1), P90 = 6 − √(0.1·4·3) (Evans, Hastings & Peacock).
    expect(r.bars[0].inputLow).toBeCloseTo(2 + Math.sqrt(0.4), 12);
    expect(r.bars[0].inputHigh).toBeCloseTo(6 - Math.sqrt(1.2), 12);
  });

  it('marks an end outside model validity instead of failing', () => {
    const g = (v: Readonly<Record<K, number>>): number => {
      if (v.a < 0.7) throw new DomainError('out-of-range', 'a too small');
      return f(v);
    };
    const r = tornado(g, nominal, { a: { kind: 'uniform', min: 0.5, max: 1.5 }, b: { kind: 'uniform', min: 1, max: 3 } });
    // a's low end (0.6) is invalid: its bar is ranked first although b's swing (12.8) is larger.
    expect(r.bars.map((b) => b.name)).toEqual(['a', 'b']);
    expect(r.bars[0].outputLow).toBeNull();
    expect(r.bars[0].outsideValidity).toBeTrue();
    expect(r.bars[1].outsideValidity).toBeFalse();
    expect(r.bars[0].swing).toBeCloseTo(5 * 0.4, 12);
    expect(r.warnings[0].code).toBe('tornado-end-outside-validity');
  });
});
