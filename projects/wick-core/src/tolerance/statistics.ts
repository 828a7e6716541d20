import { DomainError } from '../errors';

/**
 * Sample statistics used by the Monte Carlo and fitting modules.
 *
 * Percentiles use the linear interpolation of R. J. Hyndman & Y. Fan, "Sample quantiles in
 * statistical packages", Am. Stat. 50 (1996) 361, definition 7 (the most widely used default):
 * with h = (n − 1)p, Q(p) = x₍⌊h⌋₎ + (h − ⌊h⌋)(x₍⌊h⌋+1₎ − x₍⌊h⌋₎),
 * on the ascending order statistics x₍0₎ … x₍n−1₎.
 */
export interface SampleStatistics {
  /** Number of values summarised. */
  readonly n: number;
  readonly mean: number;
  /** Sample standard deviation (divisor n − 1; 0 when n = 1). */
  readonly sd: number;
  readonly min: number;
  readonly max: number;
  readonly p10: number;
  readonly p50: number;
  readonly p90: number;
}

/** Hyndman & Fan definition 7 percentile of an ASCENDING array (or its first n values). */
export function percentileSorted(sorted: ArrayLike<number>, p: number, n = sorted.length): number {
  if (n < 1) throw new DomainError('insufficient-data', 'No values to take a percentile of.');
  if (!(p >= 0 && p <= 1)) throw new DomainError('out-of-range', `Percentile level must lie in [0, 1] (got ${p}).`, 'p');
  const h = (n - 1) * p;
  const k = Math.floor(h);
  const lo = sorted[k];
  return k + 1 < n ? lo + (h - k) * (sorted[k + 1] - lo) : lo;
}

/** Mean and sample standard deviation (two-pass, divisor n − 1) of the first n values. */
export function meanSd(values: ArrayLike<number>, n = values.length, offset = 0): { mean: number; sd: number } {
  if (n < 1) throw new DomainError('insufficient-data', 'No values to average.');
  let s = 0;
  for (let i = 0; i < n; i++) s += values[offset + i];
  const mean = s / n;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    const d = values[offset + i] - mean;
    ss += d * d;
  }
  return { mean, sd: n > 1 ? Math.sqrt(ss / (n - 1)) : 0 };
}

/** Sort the first n values of `values` in place (ascending) and summarise them. */
export function summarizeInPlace(values: Float64Array, n = values.length): SampleStatistics {
  const v = values.subarray(0, n);
  v.sort();
  const { mean, sd } = meanSd(v);
  return {
    n,
    mean,
    sd,
    min: v[0],
    max: v[n - 1],
    p10: percentileSorted(v, 0.1),
    p50: percentileSorted(v, 0.5),
    p90: percentileSorted(v, 0.9),
  };
}

/**
 * Same summary as {@link summarizeInPlace} in O(n) by quickselect (reorders, does not sort, the
 * first n values). Used by the Monte Carlo loop when the sorted samples are not wanted.
 */
export function summarizeBySelection(values: Float64Array, n = values.length): SampleStatistics {
  const { mean, sd } = meanSd(values, n);
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return {
    n,
    mean,
    sd,
    min,
    max,
    p10: percentileSelect(values, 0, n, 0.1),
    p50: percentileSelect(values, 0, n, 0.5),
    p90: percentileSelect(values, 0, n, 0.9),
  };
}

/** Summary of values without changing the caller's array. */
export function summarize(values: ArrayLike<number>): SampleStatistics {
  return summarizeInPlace(Float64Array.from(values));
}

/**
 * Hyndman & Fan definition 7 percentile of a[lo … lo+n−1] WITHOUT sorting it fully: Hoare
 * quickselect (C. A. R. Hoare, "Algorithm 65: Find", Commun. ACM 4 (1961) 321) for x₍k₎, then the
 * minimum of the upper partition for x₍k+1₎. Reorders that slice in place. O(n) expected.
 */
export function percentileSelect(a: Float64Array, lo: number, n: number, p: number): number {
  const h = (n - 1) * p;
  const k = Math.floor(h);
  const xk = selectKth(a, lo, lo + n - 1, lo + k);
  if (k + 1 >= n || h === k) return xk;
  let next = Number.POSITIVE_INFINITY;
  for (let i = lo + k + 1; i < lo + n; i++) if (a[i] < next) next = a[i];
  return xk + (h - k) * (next - xk);
}

/** Put the k-th smallest of a[left … right] at index k (left ≤ k ≤ right), smaller before, larger after. */
function selectKth(a: Float64Array, left: number, right: number, k: number): number {
  while (right > left) {
    // Median-of-three pivot keeps sorted or constant input from the quadratic case.
    const mid = (left + right) >>> 1;
    const x = a[left];
    const y = a[mid];
    const z = a[right];
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = left;
    let j = right;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return a[k];
  }
  return a[k];
}
