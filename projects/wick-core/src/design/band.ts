/**
 * Monte Carlo percentile bands of a variant's curve and scalar outputs, fast enough to recompute on every
 * keystroke (1,000 samples × 1,000 curve points in a few milliseconds of statistics).
 *
 * Sampling is the tolerance family's, draw for draw: inputs sorted by name, each prepared with
 * `prepareTolerance` and drawn from `createRng(seed)` in that order, so the samples, and hence the
 * percentiles, are exactly those of `monteCarloCurve` (the spec checks equality). What differs is the
 * bookkeeping: curves are stored point-major through a small sample-major block, the points after the band
 * levels off copy the last statistics, and each point's samples are kept in the order of the previous point
 * and re-sorted by insertion. Wicking curves of one variant rarely cross, so
 * the re-sort is almost linear, where a fresh quickselect per point costs several passes.
 * Percentiles are Hyndman & Fan definition 7 (the tolerance family's `percentileSorted`);
 * JCGM 101:2008 §7 for the method. Samples the model refuses (DomainError) are counted and left out.
 */
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import { prepareTolerance, type PreparedTolerance, type Tolerance } from '../tolerance/distributions';
import { createRng } from '../tolerance/prng';
import { percentileSorted } from '../tolerance/statistics';

export interface BandModel<K extends string> {
  /** Curve points per sample. */
  readonly points: number;
  /** Scalar outputs per sample. */
  readonly scalars: number;
  /**
   * Fills `curve` (length `points`) and `scalars` for one parameter set; throws DomainError when the
   * parameters are outside the model's validity. Must not keep `params`.
   */
  evaluate(params: Readonly<Record<K, number>>, curve: Float64Array, scalars: Float64Array): void;
}

export interface BandResult {
  readonly samples: number;
  readonly valid: number;
  readonly curve: { readonly p10: Float64Array; readonly p50: Float64Array; readonly p90: Float64Array };
  readonly scalars: readonly { readonly p10: number; readonly p50: number; readonly p90: number }[];
  readonly failures: { readonly count: number; readonly firstMessage?: string };
  readonly warnings: readonly ModelWarning[];
}

const MAX_VALUES = 10_000_000;
/** Samples evaluated before their curves are copied into the point-major store (a cache-sized block). */
const BLOCK = 32;

/**
 * One reusable store for the sample curves: a fresh 8 MB array on every keystroke costs more in garbage
 * collection than the statistics. Never escapes this module; JavaScript runs one call at a time.
 */
let shared = new Float64Array(0);
/** Largest store kept between calls (16 MB); bigger runs get their own array. */
const KEEP = 2_000_000;
function scratch(size: number): Float64Array {
  if (size > KEEP) return new Float64Array(size);
  if (shared.length < size) shared = new Float64Array(size);
  return shared;
}

/**
 * P10/P50/P90 of every curve point and scalar over `samples` Monte Carlo draws of the toleranced inputs.
 * @throws DomainError when fewer than two samples are valid or the tolerances are malformed.
 */
export function percentileBands<K extends string>(
  model: BandModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  samples: number,
  seed: number,
): BandResult {
  const m = model.points;
  const q = model.scalars;
  if (samples * m > MAX_VALUES) {
    throw new DomainError('out-of-range', `samples × curve points must not exceed ${MAX_VALUES}.`, 'samples');
  }
  const warnings: ModelWarning[] = [];
  const names = (Object.keys(tolerances) as K[]).filter((k) => tolerances[k] !== undefined).sort();
  if (names.length === 0) throw new DomainError('invalid-input', 'Give a tolerance for at least one input.', 'tolerances');
  const prepared: PreparedTolerance[] = names.map((k) =>
    prepareTolerance(k, tolerances[k] as Tolerance, nominal[k], warnings),
  );
  const rng = createRng(seed);
  const work = { ...nominal } as Record<K, number>;
  // Point-major store (each point's samples contiguous, as the statistics read them), filled through a
  // small sample-major block so that neither the writes nor the reads stride across megabytes.
  const store = scratch(samples * m);
  const block = new Float64Array(BLOCK * m);
  const views = Array.from({ length: BLOCK }, (_, k) => block.subarray(k * m, (k + 1) * m));
  const scalarStore = new Float64Array(samples * q);
  const scal = new Float64Array(q);
  let n = 0;
  let inBlock = 0;
  let failed = 0;
  let firstMessage: string | undefined;
  // Largest index at which any valid curve still changes: beyond it every point's samples equal the previous
  // point's (a levelled-off band), so those points need no statistics of their own.
  let lastChange = 0;
  const flush = () => {
    for (let i = 0; i < m; i++) {
      const row = i * samples + n;
      for (let k = 0; k < inBlock; k++) store[row + k] = block[k * m + i];
    }
    n += inBlock;
    inBlock = 0;
  };
  for (let s = 0; s < samples; s++) {
    for (let j = 0; j < prepared.length; j++) work[prepared[j].name as K] = prepared[j].sample(rng);
    const curve = views[inBlock];
    try {
      model.evaluate(work, curve, scal);
    } catch (e) {
      if (!isDomainError(e)) throw e;
      failed++;
      firstMessage ??= e.message;
      continue;
    }
    // One backward pass: the sum (NaN or ±Infinity anywhere makes it non-finite, one test instead of one per
    // point) and the last index at which this curve still changes.
    let sum = curve[0];
    let last = 0;
    for (let i = m - 1; i > 0; i--) {
      const v = curve[i];
      sum += v;
      if (last === 0 && v !== curve[i - 1]) last = i;
    }
    if (!Number.isFinite(sum)) {
      failed++;
      firstMessage ??= 'the model returned a non-finite value';
      continue;
    }
    if (last > lastChange) lastChange = last;
    scalarStore.set(scal, (n + inBlock) * q);
    if (++inBlock === BLOCK) flush();
  }
  flush();
  if (n < 2) {
    throw new DomainError(
      'insufficient-data',
      `Only ${n} of ${samples} samples gave a valid result${firstMessage ? ` (first problem: ${firstMessage})` : ''}; ` +
        'narrow the tolerances or move the nominal point.',
      'tolerances',
    );
  }
  if (failed > 0) {
    warnings.push({
      code: 'samples-outside-validity',
      message:
        `${failed} of ${samples} samples (${((100 * failed) / samples).toFixed(1)} %) fell outside the model's validity ` +
        `and were left out${firstMessage ? ` (first: ${firstMessage})` : ''}; the bands describe the remaining samples only.`,
    });
  }

  const p10 = new Float64Array(m);
  const p50 = new Float64Array(m);
  const p90 = new Float64Array(m);
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) perm[k] = k;
  const col = new Float64Array(n);
  for (let i = 0; i < m; i++) {
    const row = i * samples;
    if (i > lastChange) {
      // Every sample unchanged since the last point (a levelled-off curve): same percentiles, no sorting.
      p10[i] = p10[i - 1];
      p50[i] = p50[i - 1];
      p90[i] = p90[i - 1];
      continue;
    }
    for (let k = 0; k < n; k++) col[k] = store[row + perm[k]];
    if (!insertionSortWith(col, perm, n, SHIFT_BUDGET * n)) {
      // Curves crossing en masse: sort this point from scratch instead.
      const order = Array.from(perm).sort((x, y) => store[row + x] - store[row + y]);
      for (let k = 0; k < n; k++) {
        perm[k] = order[k];
        col[k] = store[row + order[k]];
      }
    }
    p10[i] = percentileSorted(col, 0.1, n);
    p50[i] = percentileSorted(col, 0.5, n);
    p90[i] = percentileSorted(col, 0.9, n);
  }
  const scalars: { p10: number; p50: number; p90: number }[] = [];
  const sc = new Float64Array(n);
  for (let j = 0; j < q; j++) {
    for (let k = 0; k < n; k++) sc[k] = scalarStore[k * q + j];
    sc.sort();
    scalars.push({ p10: percentileSorted(sc, 0.1, n), p50: percentileSorted(sc, 0.5, n), p90: percentileSorted(sc, 0.9, n) });
  }
  return {
    samples,
    valid: n,
    curve: { p10, p50, p90 },
    scalars,
    failures: firstMessage === undefined ? { count: failed } : { count: failed, firstMessage },
    warnings,
  };
}

/** Element moves allowed per sample before a point is sorted from scratch. */
const SHIFT_BUDGET = 64;

/**
 * Sorts `a[0…n)` ascending in place by insertion, applying the same moves to `tag`; near-linear on nearly
 * sorted input. Gives up (returns false, arrays in an unspecified order) after `budget` element moves.
 */
function insertionSortWith(a: Float64Array, tag: Int32Array, n: number, budget: number): boolean {
  let moves = 0;
  for (let i = 1; i < n; i++) {
    const v = a[i];
    if (!(v < a[i - 1])) continue;
    const t = tag[i];
    let j = i - 1;
    while (j >= 0 && a[j] > v) {
      a[j + 1] = a[j];
      tag[j + 1] = tag[j];
      j--;
    }
    a[j + 1] = v;
    tag[j + 1] = t;
    moves += i - 1 - j;
    if (moves > budget) return false;
  }
  return true;
}
