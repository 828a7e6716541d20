import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requirePositive } from '../validate';

/**
 * Replicate runs: mean, sample standard deviation, coefficient of variation, and outlier flags by
 * the modified z-score of B. Iglewicz & D. C. Hoaglin, *How to Detect and Handle Outliers*, ASQC
 * Basic References in Quality Control vol. 16, 1993:
 *   Mᵢ = 0.6745 (xᵢ − x̃) / MAD,  MAD = median |xᵢ − x̃|,
 * flagged when |Mᵢ| > 3.5 (their recommended cut-off). 0.6745 = z₀.₇₅ makes MAD a consistent
 * estimate of σ for normal data. Median-based, so one wild run cannot hide itself by inflating the
 * spread, unlike a z-score on mean and sd. Needs n ≥ 3; undefined when MAD = 0 (more than half of
 * the values identical), in which case nothing is flagged and a warning says so.
 */
export interface ReplicateInput {
  /** One fitted value per run (any unit). */
  readonly values: readonly number[];
  /** Optional run labels, same length, echoed in warnings. */
  readonly labels?: readonly string[];
  /** Modified z-score cut-off. Default 3.5. */
  readonly threshold?: number;
}

export interface SpreadSummary {
  readonly n: number;
  readonly mean: number;
  /** Sample sd (divisor n − 1); 0 for one value. */
  readonly sd: number;
  /** sd/|mean|; null when the mean is 0. */
  readonly cv: number | null;
}

export interface ReplicateResult extends ResultBase<ReplicateInput>, SpreadSummary {
  readonly median: number;
  readonly mad: number;
  /** Modified z-score per run (null when MAD = 0 or n < 3). */
  readonly modifiedZ: readonly (number | null)[];
  /** Indices of the runs flagged as outliers. */
  readonly outliers: readonly number[];
  /** Statistics of the runs not flagged. */
  readonly withoutOutliers: SpreadSummary;
}

export function spread(values: ArrayLike<number>): SpreadSummary {
  const n = values.length;
  if (n < 1) throw new DomainError('insufficient-data', 'No values to summarise.', 'values');
  let s = 0;
  for (let i = 0; i < n; i++) s += values[i];
  const mean = s / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  const sd = n > 1 ? Math.sqrt(ss / (n - 1)) : 0;
  return { n, mean, sd, cv: mean !== 0 ? sd / Math.abs(mean) : null };
}

function median(sorted: readonly number[]): number {
  const n = sorted.length;
  const m = n >> 1;
  return n % 2 ? sorted[m] : 0.5 * (sorted[m - 1] + sorted[m]);
}

export function replicateStatistics(input: ReplicateInput): ReplicateResult {
  const values = input.values;
  if (!Array.isArray(values) || values.length < 1) {
    throw new DomainError('insufficient-data', 'Give at least one replicate value.', 'values');
  }
  values.forEach((v, i) => requireFinite(`values[${i}]`, v));
  if (input.labels && input.labels.length !== values.length) {
    throw new DomainError('invalid-input', 'Give one label per replicate value.', 'labels');
  }
  const threshold = requirePositive('threshold', input.threshold ?? 3.5);
  const warnings: ModelWarning[] = [];
  const n = values.length;
  const sorted = [...values].sort((a, b) => a - b);
  const med = median(sorted);
  const mad = median(values.map((v) => Math.abs(v - med)).sort((a, b) => a - b));
  let modifiedZ: (number | null)[] = values.map(() => null);
  const outliers: number[] = [];
  if (n < 3) {
    warnings.push({ code: 'too-few-replicates', message: `Outliers need at least 3 runs to be judged (got ${n}).` });
  } else if (!(mad > 0)) {
    warnings.push({
      code: 'outlier-test-undefined',
      message: 'More than half of the runs give the same value (MAD = 0): the modified z-score is undefined and no run is flagged.',
    });
  } else {
    modifiedZ = values.map((v) => (0.6745 * (v - med)) / mad);
    modifiedZ.forEach((z, i) => {
      if (z !== null && Math.abs(z) > threshold) outliers.push(i);
    });
    for (const i of outliers) {
      const name = input.labels?.[i] ?? `run ${i + 1}`;
      warnings.push({
        code: 'outlier-run',
        message: `${name} (${values[i]}) is an outlier: modified z-score ${(modifiedZ[i] as number).toFixed(1)} (|M| > ${threshold}).`,
      });
    }
  }
  const kept = values.filter((_, i) => !outliers.includes(i));
  return {
    inputs: input,
    warnings,
    ...spread(values),
    median: med,
    mad,
    modifiedZ,
    outliers,
    withoutOutliers: spread(kept),
  };
}
