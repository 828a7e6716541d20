import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite } from '../validate';
import { integralGravityEstimate } from './integral-estimate';
import { fitLine, type LineFit } from './linear-regression';
import { checkUptakeSeries } from './series';

/**
 * Washburn slope: least-squares slope K of y² against t over a time window, where y is the
 * wicking height h (K in m²/s) or the uptake mass m (K in kg²/s). In the Washburn regime
 * (E. W. Washburn, Phys. Rev. 17 (1921) 273) h² = (γ r cosθ/(2η)) t, so K = γ r cosθ/(2η);
 * for masses m² = C ρ² γ cosθ t/η, the basis of the reference-liquid contact-angle method.
 *
 * The fit is through the origin by default (y(0) = 0); `intercept: true` adds an intercept to
 * absorb a time-zero offset or the jump when the sample touches the liquid.
 */
export interface WashburnSlopeInput {
  /** Times, s (≥ 0, strictly increasing). */
  readonly time: ArrayLike<number>;
  /** Heights (m) or masses (kg), ≥ 0. */
  readonly values: ArrayLike<number>;
  /** What `values` holds. Default 'height'. */
  readonly quantity?: 'height' | 'mass';
  /** 'auto' (default): the suggested window; 'all': every point; or explicit times, s (inclusive). */
  readonly window?: 'auto' | 'all' | { readonly start?: number; readonly end?: number };
  /** Fit with an intercept. Default false (through the origin). */
  readonly intercept?: boolean;
}

/**
 * Automatic window (documented in docs/models/fitting.md):
 * 1. Late cut (gravity): the integral estimate (a, b) of dy/dt = a/y − b over all points gives
 *    y_eq = a/b; points with y > 0.2·y_eq are dropped. There d(y²)/dt = 2a(1 − y/y_eq) has fallen
 *    by more than 20 %. No cut when b ≤ 0 (no visible slowing).
 * 2. Early cut (inertia): the local exponent n = d ln y/d ln t is 0.5 in the Washburn regime and
 *    up to 1 while inertia limits the rise (C. H. Bosanquet, Phil. Mag. 45 (1923) 525; D. Quéré,
 *    Europhys. Lett. 39 (1997) 533). It is the least-squares slope of ln y on ln t over the points
 *    within a factor √2 in time of each point (at least its two neighbours). Leading points with
 *    n > 0.6 are dropped, as are leading points at t = 0 or y = 0 (no rate information).
 * 3. At least 5 points (all points when fewer) are kept. When the gravity cut leaves fewer, the
 *    window is the first 5 points after the early cut, with a warning; when the early cut would
 *    leave fewer, it stops there, with a warning.
 */
export interface SuggestedWindow {
  readonly startIndex: number;
  /** Inclusive. */
  readonly endIndex: number;
  readonly start: number;
  readonly end: number;
  /** Points dropped at the start and at the end. */
  readonly droppedEarly: number;
  readonly droppedLate: number;
  /** Estimated equilibrium height or mass y_eq (null when no slowing is visible). */
  readonly equilibriumEstimate: number | null;
  /** Plain-language statement of the rule and what it did. */
  readonly rule: string;
}

export interface WashburnSlopeResult extends ResultBase<WashburnSlopeInput> {
  /** K, m²/s for heights or kg²/s for masses. */
  readonly slope: number;
  readonly slopeStdError: number;
  readonly slopeCI95: readonly [number, number];
  /** Intercept in y² units (0 through the origin). */
  readonly intercept: number;
  readonly interceptCI95: readonly [number, number];
  /** √K: the coefficient of y = √K·√t, m/s^½ or kg/s^½. */
  readonly sqrtSlope: number;
  readonly rSquared: number;
  /** y² − fitted y² per point of the window. */
  readonly residuals: Float64Array;
  readonly degreesOfFreedom: number;
  /** Window used by the fit. */
  readonly window: { readonly startIndex: number; readonly endIndex: number; readonly start: number; readonly end: number; readonly count: number };
  /** The automatic suggestion, always returned. */
  readonly suggestedWindow: SuggestedWindow;
  readonly unit: 'm^2/s' | 'kg^2/s';
  readonly fit: LineFit;
}

const MIN_WINDOW_POINTS = 5;
const GRAVITY_FRACTION = 0.2;
const INERTIAL_EXPONENT = 0.6;

/** The automatic window rule (see {@link SuggestedWindow}) on checked, increasing data. */
export function suggestWashburnWindow(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  warnings: ModelWarning[] = [],
  quantity: 'height' | 'mass' = 'height',
): SuggestedWindow {
  const n = t.length;
  // The estimate in the unit a reader of a wicking record expects: mm of height or g of mass.
  const shown = (v: number | null): string =>
    v === null ? '' : quantity === 'height' ? `${(v * 1e3).toPrecision(3)} mm` : `${(v * 1e3).toPrecision(3)} g`;
  const minPts = Math.min(MIN_WINDOW_POINTS, n);
  let end = n - 1;
  let yEq: number | null = null;
  const { a, b } = integralGravityEstimate(t, y);
  if (a > 0 && b > 0) {
    yEq = a / b;
    while (end >= 0 && y[end] > GRAVITY_FRACTION * yEq) end--;
  }
  let gravityShort = false;
  if (end + 1 < minPts) {
    gravityShort = true;
    end = minPts - 1;
  }
  // Local exponent d ln y / d ln t around point i, over points of the record within a factor √2 in time.
  const exponent = (i: number): number => {
    let lo = i;
    let hi = i;
    while (lo > 0 && t[lo - 1] >= t[i] / Math.SQRT2 && t[lo - 1] > 0 && y[lo - 1] > 0) lo--;
    while (hi < n - 1 && t[hi + 1] <= t[i] * Math.SQRT2) hi++;
    if (hi - lo < 2) {
      if (lo > 0 && t[lo - 1] > 0 && y[lo - 1] > 0) lo--;
      if (hi < n - 1) hi++;
    }
    let mx = 0;
    let my = 0;
    const m = hi - lo + 1;
    for (let k = lo; k <= hi; k++) {
      mx += Math.log(t[k]);
      my += Math.log(y[k]);
    }
    mx /= m;
    my /= m;
    let sxx = 0;
    let sxy = 0;
    for (let k = lo; k <= hi; k++) {
      const dx = Math.log(t[k]) - mx;
      sxx += dx * dx;
      sxy += dx * (Math.log(y[k]) - my);
    }
    return sxx > 0 ? sxy / sxx : 0.5;
  };
  let start = 0;
  const maxStart = end + 1 - minPts;
  while (start < maxStart && (t[start] === 0 || y[start] === 0)) start++;
  while (start < maxStart && exponent(start) > INERTIAL_EXPONENT) start++;
  if (start === maxStart && maxStart > 0 && exponent(start) > INERTIAL_EXPONENT) {
    warnings.push({
      code: 'no-washburn-regime',
      message:
        'The rise stays faster than √t over the record (local exponent above 0.6): no clear Washburn regime ' +
        'was found; check the time origin and the data.',
    });
  }
  if (gravityShort) {
    end = Math.min(n - 1, start + minPts - 1);
    warnings.push({
      code: 'window-gravity-affected',
      message:
        `Fewer than ${MIN_WINDOW_POINTS} points lie below 20 % of the estimated equilibrium ` +
        `(${shown(yEq)}): gravity slows the whole record and the Washburn slope is biased low. ` +
        'Use the gravity-restrained fit instead.',
    });
  }
  const droppedLate = n - 1 - end;
  if (yEq !== null && !gravityShort && y[end] > 0.05 * yEq) {
    const x = y[end] / yEq;
    warnings.push({
      code: 'gravity-bias',
      message:
        `The window ends at ${(100 * x).toFixed(0)} % of the estimated equilibrium, where gravity has already ` +
        `lowered d(y²)/dt by ${(100 * x).toFixed(0)} %: the Washburn slope is biased low by up to about that much. ` +
        'The gravity-restrained fit gives the unbiased capillary term.',
    });
  }
  const rule =
    `Kept points ${start + 1}–${end + 1} of ${n}: ` +
    (start > 0 ? `${start} leading point(s) rising faster than √t (local exponent > 0.6) or at zero were dropped; ` : '') +
    (droppedLate > 0
      ? `${droppedLate} late point(s) above 20 % of the estimated equilibrium (${shown(yEq)}) were dropped as gravity-affected.`
      : 'no gravity slowing was cut.');
  return {
    startIndex: start,
    endIndex: end,
    start: t[start],
    end: t[end],
    droppedEarly: start,
    droppedLate,
    equilibriumEstimate: yEq,
    rule,
  };
}

/** Least-squares Washburn slope of y² vs t with its 95 % confidence interval. */
export function fitWashburnSlope(input: WashburnSlopeInput): WashburnSlopeResult {
  const quantity = input.quantity ?? 'height';
  if (quantity !== 'height' && quantity !== 'mass') {
    throw new DomainError('invalid-input', `quantity must be "height" or "mass" (got "${String(quantity)}").`, 'quantity');
  }
  const withIntercept = input.intercept ?? false;
  // Three points leave at least one residual degree of freedom with either model.
  const minPts = 3;
  const { t, y } = checkUptakeSeries(input.time, input.values, minPts, quantity);
  const warnings: ModelWarning[] = [];
  const suggested = suggestWashburnWindow(t, y, [], quantity);
  const choice = input.window ?? 'auto';
  let i0: number;
  let i1: number;
  if (choice === 'auto') {
    const w = suggestWashburnWindow(t, y, warnings, quantity);
    i0 = w.startIndex;
    i1 = w.endIndex;
  } else if (choice === 'all') {
    i0 = 0;
    i1 = t.length - 1;
  } else {
    const lo = choice.start === undefined ? Number.NEGATIVE_INFINITY : requireFinite('window.start', choice.start);
    const hi = choice.end === undefined ? Number.POSITIVE_INFINITY : requireFinite('window.end', choice.end);
    if (!(hi > lo)) throw new DomainError('invalid-input', 'The window end must come after its start.', 'window');
    i0 = 0;
    while (i0 < t.length && t[i0] < lo) i0++;
    i1 = t.length - 1;
    while (i1 >= 0 && t[i1] > hi) i1--;
  }
  const count = i1 - i0 + 1;
  if (count < minPts) {
    throw new DomainError(
      'insufficient-data',
      `The chosen window holds ${Math.max(count, 0)} point(s); the fit needs at least ${minPts}.`,
      'window',
    );
  }
  const tw = t.subarray(i0, i1 + 1);
  const Y = new Float64Array(count);
  for (let i = 0; i < count; i++) Y[i] = y[i0 + i] * y[i0 + i];
  const fit = fitLine(tw, Y, { intercept: withIntercept });
  if (!(fit.slope > 0)) {
    throw new DomainError(
      'invalid-input',
      `The ${quantity}² does not grow with time in the chosen window (slope ${fit.slope.toPrecision(3)}): no uptake to fit.`,
      'values',
    );
  }
  if (fit.rSquared < 0.98) {
    warnings.push({
      code: 'poor-linearity',
      message: `${quantity}² is not proportional to time in this window (R² = ${fit.rSquared.toFixed(3)}): check the window, or the data for gravity, swelling or a wetting delay.`,
    });
  }
  return {
    inputs: input,
    warnings,
    slope: fit.slope,
    slopeStdError: fit.slopeStdError,
    slopeCI95: fit.slopeCI95,
    intercept: fit.intercept,
    interceptCI95: fit.interceptCI95,
    sqrtSlope: Math.sqrt(fit.slope),
    rSquared: fit.rSquared,
    residuals: fit.residuals,
    degreesOfFreedom: fit.degreesOfFreedom,
    window: { startIndex: i0, endIndex: i1, start: t[i0], end: t[i1], count },
    suggestedWindow: suggested,
    unit: quantity === 'height' ? 'm^2/s' : 'kg^2/s',
    fit,
  };
}
