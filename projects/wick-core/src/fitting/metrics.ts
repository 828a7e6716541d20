import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireNonNegative } from '../validate';
import { checkUptakeSeries } from './series';

/**
 * Agreement between a predicted and a measured uptake curve.
 *
 * The prediction is interpolated linearly at the measured times (measured points outside the
 * predicted time range are left out, with a warning). Metrics over the n compared points, with
 * eᵢ = predicted − measured:
 *   RMSE = √(Σeᵢ²/n), mean bias = Σeᵢ/n, max deviation = eᵢ of largest |eᵢ| (signed, with its time).
 * Time-to-height: for each target height H, the first time each curve reaches H, by linear
 * interpolation between the bracketing samples; error = t_pred − t_meas (s) and relative to t_meas.
 * Null when a curve never reaches H within its record.
 */
export interface Series {
  /** s, ≥ 0, strictly increasing. */
  readonly time: ArrayLike<number>;
  /** m (or kg), ≥ 0. */
  readonly values: ArrayLike<number>;
}

export interface PredictionErrorInput {
  readonly measured: Series;
  readonly predicted: Series;
  /** Target heights for time-to-height errors, m. Optional. */
  readonly heights?: readonly number[];
}

export interface TimeToHeightError {
  readonly height: number;
  readonly measured: number | null;
  readonly predicted: number | null;
  /** t_pred − t_meas, s. */
  readonly error: number | null;
  /** (t_pred − t_meas)/t_meas. */
  readonly relativeError: number | null;
}

export interface PredictionErrorResult extends ResultBase<PredictionErrorInput> {
  /** Number of measured points compared. */
  readonly n: number;
  readonly rmse: number;
  readonly meanBias: number;
  readonly maxDeviation: { readonly value: number; readonly time: number };
  /** RMSE / max measured value. */
  readonly normalizedRmse: number;
  readonly timeToHeight: readonly TimeToHeightError[];
}

/** First time a sampled curve reaches `level` (linear interpolation), null if never. */
export function firstCrossingTime(t: ArrayLike<number>, y: ArrayLike<number>, level: number): number | null {
  if (y.length === 0) return null;
  if (y[0] >= level) return t[0];
  for (let i = 1; i < y.length; i++) {
    if (y[i] >= level) {
      const f = (level - y[i - 1]) / (y[i] - y[i - 1]);
      return t[i - 1] + f * (t[i] - t[i - 1]);
    }
  }
  return null;
}

export function predictionError(input: PredictionErrorInput): PredictionErrorResult {
  const meas = checkUptakeSeries(input.measured?.time, input.measured?.values, 3, 'measured value');
  const pred = checkUptakeSeries(input.predicted?.time, input.predicted?.values, 2, 'predicted value');
  const warnings: ModelWarning[] = [];
  const p0 = pred.t[0];
  const p1 = pred.t[pred.t.length - 1];
  let n = 0;
  let s2 = 0;
  let s1 = 0;
  let maxAbs = -1;
  let maxVal = 0;
  let maxTime = 0;
  let yMax = 0;
  let outside = 0;
  let k = 0;
  for (let i = 0; i < meas.t.length; i++) {
    const ti = meas.t[i];
    yMax = Math.max(yMax, meas.y[i]);
    if (ti < p0 || ti > p1) {
      outside++;
      continue;
    }
    while (k < pred.t.length - 2 && pred.t[k + 1] < ti) k++;
    const f = (ti - pred.t[k]) / (pred.t[k + 1] - pred.t[k]);
    const yp = pred.y[k] + f * (pred.y[k + 1] - pred.y[k]);
    const e = yp - meas.y[i];
    n++;
    s1 += e;
    s2 += e * e;
    if (Math.abs(e) > maxAbs) {
      maxAbs = Math.abs(e);
      maxVal = e;
      maxTime = ti;
    }
  }
  if (n < 3) {
    throw new DomainError(
      'insufficient-data',
      `Only ${n} measured point(s) fall within the predicted time range (${p0}–${p1} s); at least 3 are needed.`,
      'predicted',
    );
  }
  if (outside > 0) {
    warnings.push({
      code: 'outside-prediction',
      message: `${outside} measured point(s) lie outside the predicted time range and were not compared.`,
    });
  }
  const timeToHeight = (input.heights ?? []).map((h, j): TimeToHeightError => {
    requireNonNegative(`heights[${j}]`, h);
    const tm = firstCrossingTime(meas.t, meas.y, h);
    const tp = firstCrossingTime(pred.t, pred.y, h);
    if (tm === null || tp === null) {
      warnings.push({
        code: 'height-not-reached',
        message: `Height ${+(h * 1e3).toPrecision(3)} mm is not reached by the ${tm === null ? 'measured' : 'predicted'} curve within its record.`,
      });
    }
    const error = tm !== null && tp !== null ? tp - tm : null;
    return {
      height: h,
      measured: tm,
      predicted: tp,
      error,
      relativeError: error !== null && tm !== null && tm > 0 ? error / tm : null,
    };
  });
  const rmse = Math.sqrt(s2 / n);
  return {
    inputs: input,
    warnings,
    n,
    rmse,
    meanBias: s1 / n,
    maxDeviation: { value: maxVal, time: maxTime },
    normalizedRmse: rmse / yMax,
    timeToHeight,
  };
}
