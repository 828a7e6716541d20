import type { ResultBase } from '../api/model-spec';
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import { prepareTolerance, type PreparedTolerance, type Tolerance } from './distributions';
import { createRng } from './prng';
import { meanSd, percentileSelect, summarizeBySelection, summarizeInPlace, type SampleStatistics } from './statistics';

/**
 * Monte Carlo propagation of input tolerances through a model (plain random sampling).
 *
 * Each sample draws every toleranced input independently from its distribution (inputs without a
 * tolerance stay at their nominal value), evaluates the model and records the output. Output
 * percentiles are Hyndman & Fan definition 7 sample percentiles; the sampling error of a
 * percentile p shrinks as √(p(1 − p)/N)/f(x_p) (f: output density), so 2,000 samples give P10/P90
 * to about ±2 % of the spread and 10,000 to about ±1 %.
 * Reference: JCGM 101:2008, *Evaluation of measurement data — Supplement 1: Propagation of
 * distributions using a Monte Carlo method* (BIPM).
 *
 * Samples for which the model throws a {@link DomainError} (an input combination outside its
 * validity, e.g. a liquid that cannot reach the asked height) are counted by error code and left
 * out; a warning reports them, because the percentiles then describe only the valid samples.
 * Any other exception is a programming error and propagates.
 *
 * Inputs are independent (no correlation). The model receives one reused input object per call:
 * it must not keep a reference to it.
 */
export interface MonteCarloOptions {
  /** Number of samples, 10 … 1,000,000. Default 2,000. */
  readonly samples?: number;
  /** Integer seed of the xoshiro128** generator; same seed → same result. Default 1. */
  readonly seed?: number;
}

export interface MonteCarloInputs<K extends string> {
  readonly nominal: Readonly<Record<K, number>>;
  readonly tolerances: Readonly<Partial<Record<K, Tolerance>>>;
  readonly samples: number;
  readonly seed: number;
}

export interface MonteCarloFailures {
  /** Samples for which the model threw a DomainError (or returned a non-finite value). */
  readonly count: number;
  /** Count per DomainError code ('non-finite-output' for a NaN/Infinity result). */
  readonly byCode: Readonly<Record<string, number>>;
  /** Message of the first failure, to show the user why. */
  readonly firstMessage?: string;
}

export interface MonteCarloResult<K extends string> extends ResultBase<MonteCarloInputs<K>> {
  /** Model output at the nominal inputs (null when the nominal point itself is invalid). */
  readonly nominalOutput: number | null;
  readonly statistics: SampleStatistics;
  readonly failures: MonteCarloFailures;
  /** Valid outputs, ascending (only with `keepSamples`). */
  readonly sortedOutputs?: Float64Array;
}

export interface MonteCarloCurveResult<K extends string> extends ResultBase<MonteCarloInputs<K>> {
  /** Curve at the nominal inputs (null when the nominal point itself is invalid). */
  readonly nominalOutput: Float64Array | null;
  /** Per-point percentile bands and moments over the valid samples. */
  readonly p10: Float64Array;
  readonly p50: Float64Array;
  readonly p90: Float64Array;
  readonly mean: Float64Array;
  readonly sd: Float64Array;
  /** Number of valid samples. */
  readonly n: number;
  readonly failures: MonteCarloFailures;
}

export type ScalarModel<K extends string> = (inputs: Readonly<Record<K, number>>) => number;
/**
 * Curve model: fills `out` when given (and returns it) to avoid allocation; without `out` it
 * returns a new array. Every call must return the same number of points.
 */
export type CurveModel<K extends string> = (inputs: Readonly<Record<K, number>>, out?: Float64Array) => ArrayLike<number>;

const MAX_SAMPLES = 1_000_000;
/** Stored curve values (samples × points): 10⁷ doubles = 80 MB. */
const MAX_CURVE_VALUES = 10_000_000;

interface Setup<K extends string> {
  readonly prepared: PreparedTolerance[];
  readonly work: Record<K, number>;
  readonly samples: number;
  readonly seed: number;
  readonly warnings: ModelWarning[];
}

function setup<K extends string>(
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  options: MonteCarloOptions,
): Setup<K> {
  const samples = options.samples ?? 2000;
  const seed = options.seed ?? 1;
  if (!Number.isInteger(samples) || samples < 10 || samples > MAX_SAMPLES) {
    throw new DomainError('out-of-range', `samples must be an integer from 10 to ${MAX_SAMPLES} (got ${samples}).`, 'samples');
  }
  const warnings: ModelWarning[] = [];
  const work = { ...nominal } as Record<K, number>;
  // Sorted names: the draw order, hence the result, does not depend on key order.
  const names = (Object.keys(tolerances) as K[]).filter((k) => tolerances[k] !== undefined).sort();
  if (names.length === 0) {
    throw new DomainError('invalid-input', 'Give a tolerance for at least one input.', 'tolerances');
  }
  const prepared = names.map((k) => prepareTolerance(k, tolerances[k] as Tolerance, nominal[k], warnings));
  return { prepared, work, samples, seed, warnings };
}

function failureWarning(f: MonteCarloFailures, total: number): ModelWarning {
  return {
    code: 'samples-outside-validity',
    message:
      `${f.count} of ${total} samples (${((100 * f.count) / total).toFixed(1)} %) fell outside the model's validity ` +
      `and were left out${f.firstMessage ? ` (first: ${f.firstMessage})` : ''}; the statistics describe the ` +
      'remaining samples only and may be biased.',
  };
}

class FailureCounter {
  count = 0;
  readonly byCode: Record<string, number> = {};
  firstMessage: string | undefined;

  add(code: string, message: string): void {
    this.count++;
    this.byCode[code] = (this.byCode[code] ?? 0) + 1;
    this.firstMessage ??= message;
  }

  result(): MonteCarloFailures {
    return this.firstMessage === undefined
      ? { count: this.count, byCode: this.byCode }
      : { count: this.count, byCode: this.byCode, firstMessage: this.firstMessage };
  }
}

/**
 * Propagate tolerances through a scalar model: P10/P50/P90, mean and sd of the output.
 *
 * @param fn model taking SI inputs and returning one SI number
 * @param nominal nominal value of every input the model needs
 * @param tolerances tolerance per input (inputs left out stay nominal)
 * @param options samples (default 2,000), seed (default 1), keepSamples
 */
export function monteCarlo<K extends string>(
  fn: ScalarModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  options: MonteCarloOptions & { readonly keepSamples?: boolean } = {},
): MonteCarloResult<K> {
  const { prepared, work, samples, seed, warnings } = setup(nominal, tolerances, options);
  const rng = createRng(seed);
  const failures = new FailureCounter();
  const nominalOutput = evaluateNominal(() => fn(nominal), warnings);

  const out = new Float64Array(samples);
  let n = 0;
  for (let s = 0; s < samples; s++) {
    for (let j = 0; j < prepared.length; j++) {
      const p = prepared[j];
      work[p.name as K] = p.sample(rng);
    }
    let y: number;
    try {
      y = fn(work);
    } catch (e) {
      if (isDomainError(e)) {
        failures.add(e.code, e.message);
        continue;
      }
      throw e;
    }
    if (!Number.isFinite(y)) {
      failures.add('non-finite-output', `the model returned ${String(y)}`);
      continue;
    }
    out[n++] = y;
  }
  const f = failures.result();
  if (n < 2) throw allFailed(f, samples);
  if (f.count > 0) warnings.push(failureWarning(f, samples));
  const statistics = options.keepSamples ? summarizeInPlace(out, n) : summarizeBySelection(out, n);
  const inputs = { nominal, tolerances, samples, seed };
  return options.keepSamples
    ? { inputs, warnings, nominalOutput, statistics, failures: f, sortedOutputs: out.slice(0, n) }
    : { inputs, warnings, nominalOutput, statistics, failures: f };
}

/**
 * Propagate tolerances through a curve model (e.g. height at each of m times): per-point
 * P10/P50/P90 bands, mean and sd. All sample curves are kept in one Float64Array (samples × m,
 * at most 10⁷ values) laid out point-major, so each point's samples are contiguous; percentiles are
 * found by quickselect without sorting. The model is called with a reused output buffer.
 */
export function monteCarloCurve<K extends string>(
  fn: CurveModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  options: MonteCarloOptions & {
    /** Number of curve points; needed only when the nominal inputs are themselves invalid. */
    readonly points?: number;
  } = {},
): MonteCarloCurveResult<K> {
  const { prepared, work, samples, seed, warnings } = setup(nominal, tolerances, options);
  const rng = createRng(seed);
  const failures = new FailureCounter();
  const nominalRaw = evaluateNominal(() => Float64Array.from(fn(nominal)), warnings);
  const m = nominalRaw?.length ?? options.points;
  if (m === undefined || !Number.isInteger(m) || m < 1) {
    throw new DomainError(
      'invalid-input',
      'The nominal inputs are outside the model validity, so the curve length is unknown: give `points`.',
      'points',
    );
  }
  if (samples * m > MAX_CURVE_VALUES) {
    throw new DomainError(
      'out-of-range',
      `samples × points = ${samples * m} exceeds ${MAX_CURVE_VALUES}; use fewer samples or curve points.`,
      'samples',
    );
  }
  const store = new Float64Array(samples * m);
  const buffer = new Float64Array(m);
  let n = 0;
  for (let s = 0; s < samples; s++) {
    for (let j = 0; j < prepared.length; j++) {
      const p = prepared[j];
      work[p.name as K] = p.sample(rng);
    }
    let y: ArrayLike<number>;
    try {
      y = fn(work, buffer);
    } catch (e) {
      if (isDomainError(e)) {
        failures.add(e.code, e.message);
        continue;
      }
      throw e;
    }
    if (y.length !== m) {
      throw new Error(`Curve model returned ${y.length} points instead of ${m}.`);
    }
    let finite = true;
    for (let i = 0; i < m; i++) {
      if (!Number.isFinite(y[i])) {
        finite = false;
        break;
      }
    }
    if (!finite) {
      failures.add('non-finite-output', 'the model returned a non-finite value');
      continue;
    }
    for (let i = 0; i < m; i++) store[i * samples + n] = y[i];
    n++;
  }
  const f = failures.result();
  if (n < 2) throw allFailed(f, samples);
  if (f.count > 0) warnings.push(failureWarning(f, samples));

  const p10 = new Float64Array(m);
  const p50 = new Float64Array(m);
  const p90 = new Float64Array(m);
  const mean = new Float64Array(m);
  const sd = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const off = i * samples;
    const ms = meanSd(store, n, off);
    mean[i] = ms.mean;
    sd[i] = ms.sd;
    p10[i] = percentileSelect(store, off, n, 0.1);
    p50[i] = percentileSelect(store, off, n, 0.5);
    p90[i] = percentileSelect(store, off, n, 0.9);
  }
  return {
    inputs: { nominal, tolerances, samples, seed },
    warnings,
    nominalOutput: nominalRaw,
    p10,
    p50,
    p90,
    mean,
    sd,
    n,
    failures: f,
  };
}

function evaluateNominal<T extends number | Float64Array>(run: () => T, warnings: ModelWarning[]): T | null {
  try {
    const y = run();
    const finite = typeof y === 'number' ? Number.isFinite(y) : y.every((v) => Number.isFinite(v));
    if (!finite) {
      warnings.push({ code: 'nominal-outside-validity', message: 'The model gives a non-finite value at the nominal inputs.' });
      return null;
    }
    return y;
  } catch (e) {
    if (!isDomainError(e)) throw e;
    warnings.push({
      code: 'nominal-outside-validity',
      message: `The model refuses the nominal inputs: ${e.message}`,
    });
    return null;
  }
}

function allFailed(f: MonteCarloFailures, total: number): DomainError {
  return new DomainError(
    'insufficient-data',
    `Only ${total - f.count} of ${total} samples gave a valid result` +
      (f.firstMessage ? ` (first problem: ${f.firstMessage})` : '') +
      '; narrow the tolerances or move the nominal point.',
    'tolerances',
    { failures: f },
  );
}
