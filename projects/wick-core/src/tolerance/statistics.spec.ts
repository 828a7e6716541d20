import { createRng } from './prng';
import { normalCdf, normalQuantile } from './normal';
import { meanSd, percentileSelect, percentileSorted, summarize, summarizeBySelection } from './statistics';

describe('sample statistics', () => {
  it('percentiles follow Hyndman & Fan definition 7', () => {
    // Hyndman & Fan (1996) definition 7 by hand: n = 4, h = 3·0.1 = 0.3 → x₍0₎ + 0.3(x₍1₎ − x₍0₎) = 1.3.
    expect(percentileSorted([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 14);
    // Same definition by hand: sorted 1, 2, 3, 4, 7, 10; h = 5·0.5 = 2.5 → 3 + 0.5·(4 − 3) = 3.5.
    expect(summarize([10, 7, 4, 3, 2, 1]).p50).toBe(3.5);
    expect(percentileSorted([5], 0.9)).toBe(5);
  });

  it('mean and sample sd of a textbook set', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, Σ(x − 5)² = 32, sample sd √(32/7) (exact arithmetic).
    const { mean, sd } = meanSd([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(mean).toBe(5);
    expect(sd).toBeCloseTo(Math.sqrt(32 / 7), 14);
  });

  it('selection summary equals the sort-based summary (identity)', () => {
    const rng = createRng(9);
    const a = Float64Array.from({ length: 777 }, () => rng.nextNormal());
    const bySort = summarize(a);
    const bySelect = summarizeBySelection(a.slice());
    expect(bySelect.p10).toBe(bySort.p10);
    expect(bySelect.p50).toBe(bySort.p50);
    expect(bySelect.p90).toBe(bySort.p90);
    expect(bySelect.min).toBe(bySort.min);
    expect(bySelect.max).toBe(bySort.max);
    expect(bySelect.mean).toBeCloseTo(bySort.mean, 14);
    expect(bySelect.sd).toBeCloseTo(bySort.sd, 14);
  });

  it('quickselect percentiles equal the sorted-array percentiles', () => {
    // Identity: two algorithms for the same definition.
    const rng = createRng(3);
    for (const n of [1, 2, 3, 10, 101, 1000]) {
      const a = Float64Array.from({ length: n }, () => Math.round(rng.next() * 50)); // ties on purpose
      const sorted = a.slice().sort();
      for (const p of [0, 0.1, 0.5, 0.9, 1]) {
        const work = a.slice();
        expect(percentileSelect(work, 0, n, p)).toBe(percentileSorted(sorted, p));
      }
    }
  });
});

describe('standard normal distribution', () => {
  it('matches standard normal table values', () => {
    // Abramowitz & Stegun, Table 26.1 (values from memory): Φ(1) = 0.8413447461, Φ(1.96) = 0.9750021049.
    expect(normalCdf(1)).toBeCloseTo(0.8413447461, 9);
    expect(normalCdf(1.96)).toBeCloseTo(0.9750021049, 9);
    // Abramowitz & Stegun, Table 26.5 (from memory): z(0.975) = 1.959963985, z(0.90) = 1.281551566.
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963985, 8);
    expect(normalQuantile(0.9)).toBeCloseTo(1.281551566, 8);
  });

  it('quantile inverts the distribution function and is antisymmetric', () => {
    for (const p of [1e-9, 0.001, 0.1, 0.3, 0.5, 0.77, 0.999]) {
      expect(normalCdf(normalQuantile(p))).toBeCloseTo(p, 12);
      expect(normalQuantile(1 - p)).toBeCloseTo(-normalQuantile(p), 7);
    }
  });
});
