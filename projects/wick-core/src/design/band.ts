/**
 * Monte Carlo percentile bands of a variant's curve and scalar outputs, fast enough to recompute on every
 * keystroke (1,000 samples × 1,000 curve points in a few milliseconds of statistics).
 *
 * Sampling is the tolerance family's, draw for draw: inputs sorted by name, each prepared with
 * `prepareTolerance` and drawn from `createRng(seed)` in that order, so the samples, and hence the
 * percentiles, are exactly those of `monteCarloCurve` (the spec checks equality). What differs is the
 * bookkeeping: a model that can give its curves point by point (`pointwise`) has each point's row of all
 * samples computed as the statistics need it; any other model's curves are stored point-major through a small
 * sample-major block. Points where no sample changes copy the previous statistics, and each point's samples are
 * kept in the order of the previous point and re-sorted by insertion. Wicking curves of one variant rarely
 * cross, so the re-sort is almost linear, where a fresh quickselect per point costs several passes.
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
  /**
   * The same curves point by point, when the model can give them so: the band then reads each point's values
   * of all samples straight into the statistics, with no million-value store to fill and transpose.
   */
  readonly pointwise?: PointwiseCurves<K>;
}

/** A band model's curves read one point at a time for all samples (see {@link BandModel.pointwise}). */
export interface PointwiseCurves<K extends string> {
  /** Numbers kept per sample. */
  readonly width: number;
  /**
   * Checks one parameter set as `evaluate` would (throwing the same DomainError), keeps what its curve needs in
   * `coef[at … at + width)` and writes its scalars. A set it accepts must have a finite curve at every point.
   * Returns a point from which its curve no longer changes (the number of points when that is not known): the
   * band reads no point past the last of these, since every later row repeats it.
   */
  prepare(params: Readonly<Record<K, number>>, coef: Float64Array, at: number, scalars: Float64Array): number;
  /**
   * `row[k]` = point i of the curve of prepared sample `order[k]` (k < count), exactly the value `evaluate`
   * gives. The band asks in the order it sorted the samples at the previous point, so that the row arrives
   * nearly sorted and needs no gathering.
   */
  fill(i: number, coef: Float64Array, order: Int32Array, count: number, row: Float64Array): void;
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
 * One slice of a band's Monte Carlo run: samples `from`…`to` of the same draw sequence, evaluated, with each
 * curve point's valid values sorted. Parts of one run computed on different threads merge (with
 * {@link mergeBandParts}) into exactly the percentiles a single {@link percentileBands} call gives.
 */
export interface BandPart {
  readonly samples: number;
  readonly from: number;
  readonly to: number;
  readonly points: number;
  readonly scalars: number;
  /** Samples of the slice with a valid result. */
  readonly valid: number;
  readonly failed: number;
  /** The slice's first refused sample (its index in the whole run), if any. */
  readonly firstFailure: { readonly index: number; readonly message: string } | null;
  /** Largest curve index at which a valid sample of the slice still changes; later points repeat it. */
  readonly lastChange: number;
  /** Each point's valid values in ascending order, point-major with row length `valid`, rows 0…lastChange. */
  readonly sorted: Float64Array;
  /** The valid samples' scalar outputs, sample-major (`valid` × `scalars`). */
  readonly scalarValues: Float64Array;
  /** Warnings from preparing the tolerances (the same in every part). */
  readonly warnings: readonly ModelWarning[];
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
  const run = sampleCurves(model, nominal, tolerances, samples, seed, 0, samples);
  const m = model.points;
  const n = run.valid;
  requireValid(n, samples, run.firstFailure?.message);
  const p10 = new Float64Array(m);
  const p50 = new Float64Array(m);
  const p90 = new Float64Array(m);
  // Two rows in turn: the one just sorted stays the previous point's while the next is read.
  const rows = [new Float64Array(n), new Float64Array(n)];
  sortPoints(run, (_, previous) => (previous === rows[0] ? rows[1] : rows[0]), (i, c) => {
    if (c === null) {
      // Every sample as at the previous point (a levelled-off stretch): the same percentiles.
      p10[i] = p10[i - 1];
      p50[i] = p50[i - 1];
      p90[i] = p90[i - 1];
      return;
    }
    p10[i] = percentileSorted(c, 0.1, n);
    p50[i] = percentileSorted(c, 0.5, n);
    p90[i] = percentileSorted(c, 0.9, n);
  });
  return {
    samples,
    valid: n,
    curve: { p10, p50, p90 },
    scalars: scalarPercentiles([run.scalarValues.subarray(0, n * model.scalars)], n, model.scalars),
    failures: failures(run.failed, run.firstFailure?.message),
    warnings: withFailureWarning(run.warnings, run.failed, samples, run.firstFailure?.message),
  };
}

/**
 * Samples `from`…`to` (of `samples`) of the run {@link percentileBands} makes with the same arguments, for one
 * thread's share of the work. The draws before `from` are made and dropped, so every part sees the run's own
 * sequence. Never throws for too few valid samples: that is judged on the merged run.
 */
export function bandPart<K extends string>(
  model: BandModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  samples: number,
  seed: number,
  from: number,
  to: number,
): BandPart {
  if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from <= to && to <= samples)) {
    throw new RangeError(`A band part must lie within 0…${samples} (got ${from}…${to}).`);
  }
  const run = sampleCurves(model, nominal, tolerances, samples, seed, from, to);
  const n = run.valid;
  const m = model.points;
  const sorted = new Float64Array(n === 0 ? 0 : m * n);
  // Rows that repeat the previous point are filled in only when a later point changes again; trailing ones are
  // left out (the merge reads the last row for them).
  let repeats = 0;
  const lastChange = sortPoints(run, (i) => sorted.subarray(i * n, (i + 1) * n), (i, c) => {
    if (c === null) {
      repeats++;
      return;
    }
    for (let r = i - repeats; r < i; r++) sorted.copyWithin(r * n, (i - repeats - 1) * n, (i - repeats) * n);
    repeats = 0;
  });
  return {
    samples,
    from,
    to,
    points: m,
    scalars: model.scalars,
    valid: n,
    failed: run.failed,
    firstFailure: run.firstFailure,
    lastChange,
    sorted: sorted.subarray(0, n === 0 ? 0 : (lastChange + 1) * n),
    scalarValues: run.scalarValues.slice(0, n * model.scalars),
    warnings: run.warnings,
  };
}

/**
 * The band of a run from its parts, which must cover samples 0…samples in order without gaps: the same numbers
 * as {@link percentileBands} on the whole run (each percentile reads the same order statistics, found by a
 * selection over the parts' sorted values instead of one sort).
 * @throws DomainError when fewer than two samples are valid; RangeError when the parts do not fit together.
 */
export function mergeBandParts(parts: readonly BandPart[]): BandResult {
  if (parts.length === 0) throw new RangeError('No band parts to merge.');
  const { samples, points: m, scalars: q } = parts[0];
  let at = 0;
  for (const p of parts) {
    if (p.samples !== samples || p.points !== m || p.scalars !== q || p.from !== at || p.to < p.from) {
      throw new RangeError('The band parts do not belong to one run or leave a gap.');
    }
    at = p.to;
  }
  if (at !== samples) throw new RangeError(`The band parts cover ${at} of ${samples} samples.`);
  const used = parts.filter((p) => p.valid > 0);
  const n = used.reduce((s, p) => s + p.valid, 0);
  const failed = parts.reduce((s, p) => s + p.failed, 0);
  const firstMessage = parts.find((p) => p.firstFailure !== null)?.firstFailure?.message;
  requireValid(n, samples, firstMessage);
  const lastChange = used.reduce((s, p) => Math.max(s, p.lastChange), 0);
  const p10 = new Float64Array(m);
  const p50 = new Float64Array(m);
  const p90 = new Float64Array(m);
  const rows: SortedRow[] = used.map((p) => ({ data: p.sorted, start: 0, length: p.valid }));
  const lo = new Int32Array(rows.length);
  const pair = new Float64Array(2);
  for (let i = 0; i <= lastChange && i < m; i++) {
    for (let k = 0; k < used.length; k++) rows[k].start = Math.min(i, used[k].lastChange) * used[k].valid;
    if (rows.length === 2) {
      // Two parts (the usual case): both neighbouring order statistics from one binary search.
      const [a, b] = rows;
      p10[i] = percentileOfPair(a, b, pair, 0.1, n);
      p50[i] = percentileOfPair(a, b, pair, 0.5, n);
      p90[i] = percentileOfPair(a, b, pair, 0.9, n);
      continue;
    }
    const at = (rank: number) => selectRank(rows, lo, rank);
    p10[i] = percentileOfRanks(at, 0.1, n);
    p50[i] = percentileOfRanks(at, 0.5, n);
    p90[i] = percentileOfRanks(at, 0.9, n);
  }
  levelOff(p10, p50, p90, lastChange);
  return {
    samples,
    valid: n,
    curve: { p10, p50, p90 },
    scalars: scalarPercentiles(used.map((p) => p.scalarValues), n, q),
    failures: failures(failed, firstMessage),
    warnings: withFailureWarning(parts[0].warnings, failed, samples, firstMessage),
  };
}

/** A run's valid samples, read point by point. */
interface SampledRun {
  readonly points: number;
  readonly valid: number;
  readonly failed: number;
  readonly firstFailure: { readonly index: number; readonly message: string } | null;
  /** The valid samples' scalars, sample-major (`valid` × scalars; the array may be longer). */
  readonly scalarValues: Float64Array;
  readonly warnings: ModelWarning[];
  /**
   * Point i's values of the valid samples into `out`, in the order given (`out[k]` is sample `order[k]`'s).
   * Returns false, leaving `out` unspecified, when every sample has the value it had at the last point read
   * (`previous`, in the same order; null for point 0, which is always read).
   */
  rowInOrder(i: number, order: Int32Array, out: Float64Array, previous: Float64Array | null): boolean;
}

/** Draws the whole run's parameter sets in order and evaluates those of samples `from`…`to`. */
function sampleCurves<K extends string>(
  model: BandModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  samples: number,
  seed: number,
  from: number,
  to: number,
): SampledRun {
  const m = model.points;
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
  // Every sample of the run is drawn in order; those of from…to are handed to `take`, and the ones it refuses
  // (a DomainError, or a reason it returns) are counted with the run's first refusal.
  const each: EachSample<K> = (take) => {
    let failed = 0;
    let firstFailure: { index: number; message: string } | null = null;
    for (let s = 0; s < to; s++) {
      for (let j = 0; j < prepared.length; j++) work[prepared[j].name as K] = prepared[j].sample(rng);
      if (s < from) continue;
      let refused: string | null;
      try {
        refused = take(work);
      } catch (e) {
        if (!isDomainError(e)) throw e;
        refused = e.message;
      }
      if (refused !== null) {
        failed++;
        firstFailure ??= { index: s, message: refused };
      }
    }
    return { failed, firstFailure };
  };
  return model.pointwise ? pointwiseRun(model, model.pointwise, each, to - from, warnings) : storedRun(model, each, to - from, warnings);
}

/** Runs `take` on each sample of a slice; `take` returns null to keep it or why it is refused. */
type EachSample<K extends string> = (take: (params: Readonly<Record<K, number>>) => string | null) => {
  failed: number;
  firstFailure: { index: number; message: string } | null;
};

/**
 * Samples evaluated point by point: each sample's coefficients once, then every point's row computed when the
 * statistics ask for it, compared with the previous row to find the points where nothing changes.
 */
function pointwiseRun<K extends string>(
  model: BandModel<K>,
  pw: PointwiseCurves<K>,
  each: EachSample<K>,
  size: number,
  warnings: ModelWarning[],
): SampledRun {
  const q = model.scalars;
  const w = pw.width;
  const coef = new Float64Array(size * w);
  const scalarStore = new Float64Array(size * q);
  const scal = new Float64Array(q);
  let n = 0;
  // Past this point no sample's curve changes: the rows there repeat it and need not be read.
  let changesUntil = 0;
  const { failed, firstFailure } = each((params) => {
    const settled = pw.prepare(params, coef, n * w, scal);
    if (settled > changesUntil) changesUntil = settled;
    scalarStore.set(scal, n * q);
    n++;
    return null;
  });
  return {
    points: model.points,
    valid: n,
    failed,
    firstFailure,
    scalarValues: scalarStore,
    warnings,
    rowInOrder(i, order, out, previous) {
      if (i > changesUntil) return false;
      pw.fill(i, coef, order, n, out);
      if (previous === null) return true;
      for (let k = 0; k < n; k++) if (out[k] !== previous[k]) return true;
      return false;
    },
  };
}

/** Samples evaluated curve by curve into a point-major store (any model). */
function storedRun<K extends string>(model: BandModel<K>, each: EachSample<K>, stride: number, warnings: ModelWarning[]): SampledRun {
  const m = model.points;
  const q = model.scalars;
  // Point-major store (each point's samples contiguous, as the statistics read them), filled through a
  // small sample-major block so that neither the writes nor the reads stride across megabytes.
  const store = scratch(stride * m);
  const block = new Float64Array(BLOCK * m);
  const views = Array.from({ length: BLOCK }, (_, k) => block.subarray(k * m, (k + 1) * m));
  const scalarStore = new Float64Array(stride * q);
  const scal = new Float64Array(q);
  let n = 0;
  let inBlock = 0;
  // Largest index at which any valid curve still changes: beyond it every point's samples equal the previous
  // point's (a levelled-off band), so those points need no statistics of their own.
  let lastChange = 0;
  const flush = () => {
    for (let i = 0; i < m; i++) {
      const row = i * stride + n;
      for (let k = 0; k < inBlock; k++) store[row + k] = block[k * m + i];
    }
    n += inBlock;
    inBlock = 0;
  };
  const { failed, firstFailure } = each((params) => {
    const curve = views[inBlock];
    model.evaluate(params, curve, scal);
    // One backward pass: the sum (NaN or ±Infinity anywhere makes it non-finite, one test instead of one per
    // point) and the last index at which this curve still changes.
    let sum = curve[0];
    let last = 0;
    for (let i = m - 1; i > 0; i--) {
      const v = curve[i];
      sum += v;
      if (last === 0 && v !== curve[i - 1]) last = i;
    }
    if (!Number.isFinite(sum)) return 'the model returned a non-finite value';
    if (last > lastChange) lastChange = last;
    scalarStore.set(scal, (n + inBlock) * q);
    if (++inBlock === BLOCK) flush();
    return null;
  });
  flush();
  return {
    points: m,
    valid: n,
    failed,
    firstFailure,
    scalarValues: scalarStore,
    warnings,
    rowInOrder(i, order, out) {
      if (i > lastChange) return false;
      const offset = i * stride;
      for (let k = 0; k < n; k++) out[k] = store[offset + order[k]];
      return true;
    },
  };
}

/**
 * Hands each point's valid values to `visit`, sorted ascending in `rowFor(i, previous)` (its first `valid`
 * entries): the point's row of a part's output, so that nothing is copied afterwards, or a reused buffer other
 * than `previous` (the last row sorted); `visit` gets null for a point where every sample repeats the previous
 * point. Returns the last point with a change. Each point is read in the order the samples had at the previous
 * point and re-sorted by insertion: wicking curves of one variant rarely cross, so that is almost linear where a
 * fresh sort per point costs several passes.
 */
function sortPoints(
  run: SampledRun,
  rowFor: (i: number, previous: Float64Array | null) => Float64Array,
  visit: (i: number, col: Float64Array | null) => void,
): number {
  const n = run.valid;
  if (n === 0) return 0;
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) perm[k] = k;
  let lastChange = 0;
  let previous: Float64Array | null = null;
  for (let i = 0; i < run.points; i++) {
    const col = rowFor(i, previous);
    if (!run.rowInOrder(i, perm, col, previous)) {
      visit(i, null);
      continue;
    }
    lastChange = i;
    if (!insertionSortWith(col, perm, n, SHIFT_BUDGET * n)) {
      // Curves crossing en masse: sort this point from scratch instead (the insertion moved values and
      // samples together, so col[k] is still sample perm[k]'s value).
      const at = Array.from({ length: n }, (_, k) => k).sort((x, y) => col[x] - col[y]);
      const samples = Int32Array.from(at, (k) => perm[k]);
      col.set(Float64Array.from(at, (k) => col[k]));
      perm.set(samples);
    }
    previous = col;
    visit(i, col);
  }
  return lastChange;
}

/** Points after the last change repeat the last computed percentiles (a levelled-off band; no sorting). */
function levelOff(p10: Float64Array, p50: Float64Array, p90: Float64Array, lastChange: number): void {
  for (let i = lastChange + 1; i < p10.length; i++) {
    p10[i] = p10[i - 1];
    p50[i] = p50[i - 1];
    p90[i] = p90[i - 1];
  }
}

function requireValid(n: number, samples: number, firstMessage: string | undefined): void {
  if (n < 2) {
    throw new DomainError(
      'insufficient-data',
      `Only ${n} of ${samples} samples gave a valid result${firstMessage ? ` (first problem: ${firstMessage})` : ''}; ` +
        'narrow the tolerances or move the nominal point.',
      'tolerances',
    );
  }
}

function failures(count: number, firstMessage: string | undefined): BandResult['failures'] {
  return firstMessage === undefined ? { count } : { count, firstMessage };
}

function withFailureWarning(prepared: readonly ModelWarning[], failed: number, samples: number, firstMessage: string | undefined): ModelWarning[] {
  const warnings = [...prepared];
  if (failed > 0) {
    warnings.push({
      code: 'samples-outside-validity',
      message:
        `${failed} of ${samples} samples (${((100 * failed) / samples).toFixed(1)} %) fell outside the model's validity ` +
        `and were left out${firstMessage ? ` (first: ${firstMessage})` : ''}; the bands describe the remaining samples only.`,
    });
  }
  return warnings;
}

/** Percentiles of each scalar over the valid samples of all parts (sample-major blocks). */
function scalarPercentiles(blocks: readonly Float64Array[], n: number, q: number): BandResult['scalars'] {
  const out: { p10: number; p50: number; p90: number }[] = [];
  const sc = new Float64Array(n);
  for (let j = 0; j < q; j++) {
    let k = 0;
    for (const b of blocks) for (let r = j; r < b.length; r += q) sc[k++] = b[r];
    sc.sort();
    out.push({ p10: percentileSorted(sc, 0.1, n), p50: percentileSorted(sc, 0.5, n), p90: percentileSorted(sc, 0.9, n) });
  }
  return out;
}

/**
 * Hyndman & Fan definition 7, the arithmetic of `percentileSorted`, over values read by rank (0-based) from a
 * sorted sequence of n values that is never built.
 */
function percentileOfRanks(at: (rank: number) => number, p: number, n: number): number {
  const h = (n - 1) * p;
  const k = Math.floor(h);
  const lo = at(k);
  return k + 1 < n ? lo + (h - k) * (at(k + 1) - lo) : lo;
}

/** {@link percentileOfRanks} over the union of two sorted rows, reading both order statistics at once. */
function percentileOfPair(a: SortedRow, b: SortedRow, pair: Float64Array, p: number, n: number): number {
  const h = (n - 1) * p;
  const k = Math.floor(h);
  neighbourRanks(a, b, k, pair);
  const lo = pair[0];
  return k + 1 < n ? lo + (h - k) * (pair[1] - lo) : lo;
}

/**
 * The values of ranks k and k + 1 (0-based; the second is +∞ past the end) in the union of two sorted rows:
 * binary search for how many of the k + 1 smallest come from `a` (the classic median-of-two-arrays split).
 */
function neighbourRanks(a: SortedRow, b: SortedRow, k: number, out: Float64Array): void {
  const A = a.data;
  const B = b.data;
  const sa = a.start;
  const sb = b.start;
  const take = k + 1;
  let low = Math.max(0, take - b.length);
  let high = Math.min(take, a.length);
  // Find i (taken from a) with a[i−1] ≤ b[take−i] and b[take−i−1] ≤ a[i].
  while (low < high) {
    const i = (low + high) >> 1;
    if (A[sa + i] < B[sb + take - i - 1]) low = i + 1;
    else high = i;
  }
  const i = low;
  const j = take - i;
  const lastA = i > 0 ? A[sa + i - 1] : Number.NEGATIVE_INFINITY;
  const lastB = j > 0 ? B[sb + j - 1] : Number.NEGATIVE_INFINITY;
  out[0] = lastA > lastB ? lastA : lastB;
  const nextA = i < a.length ? A[sa + i] : Number.POSITIVE_INFINITY;
  const nextB = j < b.length ? B[sb + j] : Number.POSITIVE_INFINITY;
  out[1] = nextA < nextB ? nextA : nextB;
}

interface SortedRow {
  readonly data: Float64Array;
  start: number;
  readonly length: number;
}

/**
 * The value of the given rank (0-based) in the union of ascending rows, without merging them: repeatedly drop
 * the leading run of the row whose probe is smallest. With probes at most ⌊(k+1)/rows⌋ deep, everything
 * dropped ranks below the target (the classic two-array selection, for any number of rows); O(rows · log n).
 */
function selectRank(rows: readonly SortedRow[], lo: Int32Array, rank: number): number {
  lo.fill(0);
  let k = rank + 1;
  for (;;) {
    let live = 0;
    let only = -1;
    for (let r = 0; r < rows.length; r++) {
      if (lo[r] < rows[r].length) {
        live++;
        only = r;
      }
    }
    if (live === 1) return rows[only].data[rows[only].start + lo[only] + k - 1];
    const step = Math.max(1, Math.floor(k / live));
    let best = -1;
    let bestValue = Number.POSITIVE_INFINITY;
    let bestTake = 0;
    for (let r = 0; r < rows.length; r++) {
      const left = rows[r].length - lo[r];
      if (left <= 0) continue;
      const take = Math.min(step, left);
      const v = rows[r].data[rows[r].start + lo[r] + take - 1];
      if (best < 0 || v < bestValue) {
        best = r;
        bestValue = v;
        bestTake = take;
      }
    }
    if (k === 1 || bestTake === k) return bestValue;
    lo[best] += bestTake;
    k -= bestTake;
  }
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
