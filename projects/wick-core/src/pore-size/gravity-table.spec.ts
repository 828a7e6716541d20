import { gravityHeight } from '../washburn/gravity';
import { accumulateGravityCurve } from './gravity-table';

describe('tabulated gravity-restrained Washburn curve', () => {
  it('matches the exact solution to 1e-12 relative over T = 1e-8 … 1e3 (identity)', () => {
    const n = 5000;
    const T = Float64Array.from({ length: n }, (_, i) => 10 ** (-8 + (11 * i) / (n - 1)));
    const sum = new Float64Array(n);
    const max = new Float64Array(n);
    accumulateGravityCurve(1, 1, T, 1, sum, max);
    let worst = 0;
    for (let i = 0; i < n; i++) worst = Math.max(worst, Math.abs(sum[i] / gravityHeight(1, 1, T[i]) - 1));
    expect(worst).toBeLessThan(1e-12);
  });

  it('scales to any (a, b) through h = (a/b)·H(t b²/a), and b = 0 gives √(2at)', () => {
    const a = 3.7e-4;
    const b = 2.2e-3;
    const t = [0, 0.01, 1, 60, 600, 1e5];
    const sum = new Float64Array(t.length);
    const max = new Float64Array(t.length);
    const cls = new Float64Array(t.length);
    accumulateGravityCurve(a, b, t, 0.5, sum, max, cls);
    for (let j = 0; j < t.length; j++) {
      const h = gravityHeight(a, b, t[j]);
      expect(cls[j]).toBeCloseTo(h, 14);
      expect(sum[j]).toBeCloseTo(0.5 * h, 14);
      expect(max[j]).toBe(cls[j]);
    }
    const flat = new Float64Array(t.length);
    accumulateGravityCurve(a, 0, t, 1, flat, new Float64Array(t.length));
    // Washburn (1921), horizontal: h = √(2at).
    expect(flat[0]).toBe(0);
    for (let j = 1; j < t.length; j++) expect(flat[j] / Math.sqrt(2 * a * t[j])).toBeCloseTo(1, 14);
  });
});
