import { DomainError } from '../errors';

/**
 * Checks shared by every fit of measured uptake curves. Each failure is a DomainError whose
 * message tells the person who uploaded the data what to fix.
 */
export interface CheckedSeries {
  readonly t: Float64Array;
  readonly y: Float64Array;
}

/**
 * @param time times, s: finite, ≥ 0, strictly increasing
 * @param values heights (m) or masses (kg): finite, ≥ 0, not all equal
 * @param minPoints smallest number of points the fit needs
 * @param what name of the measured quantity in messages ('height', 'mass' …)
 */
export function checkUptakeSeries(
  time: ArrayLike<number>,
  values: ArrayLike<number>,
  minPoints: number,
  what = 'height',
): CheckedSeries {
  if (!time || !values || time.length !== values.length) {
    throw new DomainError(
      'invalid-input',
      `Give one ${what} per time (got ${time?.length ?? 0} times and ${values?.length ?? 0} ${what}s).`,
      'values',
    );
  }
  const n = time.length;
  if (n < minPoints) {
    throw new DomainError(
      'insufficient-data',
      `This fit needs at least ${minPoints} points (got ${n}).`,
      'time',
      { needed: minPoints, got: n },
    );
  }
  const t = new Float64Array(n);
  const y = new Float64Array(n);
  let yMin = Number.POSITIVE_INFINITY;
  let yMax = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const ti = time[i];
    const yi = values[i];
    if (!Number.isFinite(ti) || !Number.isFinite(yi)) {
      throw new DomainError('not-finite', `Point ${i + 1} is not a finite number (time ${ti}, ${what} ${yi}).`, 'values', { index: i });
    }
    if (ti < 0) throw new DomainError('negative', `Time must not be negative (point ${i + 1}: ${ti} s).`, 'time', { index: i });
    if (i > 0 && !(ti > t[i - 1])) {
      throw new DomainError(
        'invalid-input',
        `Times must increase strictly: point ${i + 1} (${ti} s) does not come after point ${i} (${t[i - 1]} s).`,
        'time',
        { index: i },
      );
    }
    if (yi < 0) {
      throw new DomainError('negative', `A ${what} must not be negative (point ${i + 1}: ${yi}).`, 'values', { index: i });
    }
    t[i] = ti;
    y[i] = yi;
    if (yi < yMin) yMin = yi;
    if (yi > yMax) yMax = yi;
  }
  if (!(yMax > 0) || yMax - yMin <= 1e-9 * yMax) {
    throw new DomainError(
      'invalid-input',
      `The ${what} does not change over the record (flat curve): there is no uptake to fit.`,
      'values',
    );
  }
  return { t, y };
}
