import { gravityHeightUnchecked } from '../washburn/gravity';
import { radialRadiusUnchecked } from '../washburn/radial';
import { gravityCurveFast, radialCurveFast } from './curve-tables';

/** Ascending times from 0 to `end`, denser early, with a few awkward ones mixed in. */
function times(end: number): Float64Array {
  const t = Array.from({ length: 300 }, (_, i) => end * (i / 299) ** 3);
  return Float64Array.from([...t, 1e-12, 3.3e-7, end * 0.5000001]).sort();
}

describe('curve tables for the Monte Carlo bands', () => {
  it('the gravity curve equals the washburn family’s exact solution to 1e-11, saturated part included', () => {
    for (const [a, b] of [[1e-4, 1e-3], [5e-3, 0.1], [1e-6, 1e-7], [2e-3, 0]]) {
      const t = times(b > 0 ? (50 * a) / (b * b) : 100);
      const out = new Float64Array(t.length);
      gravityCurveFast(a, b, t, t.map(Math.sqrt), out);
      for (let i = 0; i < t.length; i++) {
        // Exactness against the family's closed form (Fries & Dreyer 2008), which is the reference here.
        const exact = gravityHeightUnchecked(a, b, t[i]);
        expect(Math.abs(out[i] - exact)).toBeLessThanOrEqual(1e-11 * Math.max(exact, 1e-300));
      }
    }
  });

  it('the radial curve equals the washburn family’s exact solution to 1e-11 from 1e-10 to 1e10 in q', () => {
    for (const [a, r0] of [[1e-3, 0.01], [1e-6, 0.002], [4e-2, 0.05]]) {
      const t = Float64Array.from({ length: 400 }, (_, i) => ((r0 * r0) / (4 * a)) * 10 ** (-10 + (20 * i) / 399));
      const out = new Float64Array(t.length);
      radialCurveFast(a, r0, t, out);
      for (let i = 0; i < t.length; i++) {
        const exact = radialRadiusUnchecked(a, r0, t[i]);
        expect(Math.abs(out[i] - exact)).toBeLessThanOrEqual(1e-11 * exact);
      }
      // Property: the spot itself at t = 0, growth in time.
      const zero = new Float64Array(1);
      radialCurveFast(a, r0, Float64Array.of(0), zero);
      expect(zero[0]).toBe(r0);
    }
  });
});
