import type { ResultBase } from '../api/model-spec';
import { DomainError } from '../errors';
import { studentTQuantile } from './student-t';

/**
 * Ordinary least squares straight line, through the origin (y = b x) or with an intercept
 * (y = a + b x), with the textbook standard errors (N. R. Draper & H. Smith, *Applied Regression
 * Analysis*, 3rd ed., Wiley 1998, simple linear regression and the line through the origin):
 *   with intercept:  b = Sxy/Sxx, a = ȳ − b x̄, s² = SSE/(n − 2), se(b) = s/√Sxx, se(a) = s √(1/n + x̄²/Sxx);
 *   through origin:  b = Σxy/Σx², s² = SSE/(n − 1), se(b) = s/√Σx².
 * 95 % intervals: estimate ± t_{0.975, ν} · se with ν the residual degrees of freedom.
 * R² = 1 − SSE/Σ(y − ȳ)² for both models (T. O. Kvålseth, "Cautionary note about R²", Am. Stat. 39
 * (1985) 279, recommends this form also without intercept); the uncentred 1 − SSE/Σy², which
 * NIST StRD certifies for no-intercept models, is given as `rSquaredUncentered`.
 * Checked against the NIST StRD linear datasets Norris and NoInt1 (see the spec).
 */
export interface LineFitInputs {
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  readonly intercept: boolean;
}

export interface LineFit extends ResultBase<LineFitInputs> {
  readonly slope: number;
  readonly intercept: number;
  readonly slopeStdError: number;
  /** 0 when fitted through the origin. */
  readonly interceptStdError: number;
  readonly slopeCI95: readonly [number, number];
  /** [0, 0] when fitted through the origin. */
  readonly interceptCI95: readonly [number, number];
  readonly throughOrigin: boolean;
  readonly n: number;
  readonly degreesOfFreedom: number;
  readonly sumSquaredResiduals: number;
  /** s = √(SSE/ν). */
  readonly residualStdDev: number;
  readonly rSquared: number;
  readonly rSquaredUncentered: number;
  /** y − ŷ per point. */
  readonly residuals: Float64Array;
}

export function fitLine(x: ArrayLike<number>, y: ArrayLike<number>, options: { readonly intercept?: boolean } = {}): LineFit {
  const withIntercept = options.intercept ?? true;
  const n = x.length;
  const p = withIntercept ? 2 : 1;
  if (n !== y.length) throw new DomainError('invalid-input', 'x and y must have the same length.', 'y');
  if (n < p + 1) {
    throw new DomainError('insufficient-data', `A straight-line fit needs at least ${p + 1} points (got ${n}).`, 'x');
  }
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  let sx2 = 0;
  let sxy0 = 0;
  let sy2 = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
    sx2 += x[i] * x[i];
    sxy0 += x[i] * y[i];
    sy2 += y[i] * y[i];
  }
  const denom = withIntercept ? sxx : sx2;
  if (!(denom > 0)) {
    throw new DomainError('invalid-input', 'All x values are equal (or zero): the slope is undetermined.', 'x');
  }
  const slope = withIntercept ? sxy / sxx : sxy0 / sx2;
  const intercept = withIntercept ? my - slope * mx : 0;
  const residuals = new Float64Array(n);
  let sse = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i] - (intercept + slope * x[i]);
    residuals[i] = r;
    sse += r * r;
  }
  const dof = n - p;
  const s2 = sse / dof;
  const slopeStdError = Math.sqrt(s2 / denom);
  const interceptStdError = withIntercept ? Math.sqrt(s2 * (1 / n + (mx * mx) / sxx)) : 0;
  const tq = studentTQuantile(0.975, dof);
  return {
    inputs: { x, y, intercept: withIntercept },
    warnings: [],
    slope,
    intercept,
    slopeStdError,
    interceptStdError,
    slopeCI95: [slope - tq * slopeStdError, slope + tq * slopeStdError],
    interceptCI95: withIntercept ? [intercept - tq * interceptStdError, intercept + tq * interceptStdError] : [0, 0],
    throughOrigin: !withIntercept,
    n,
    degreesOfFreedom: dof,
    sumSquaredResiduals: sse,
    residualStdDev: Math.sqrt(s2),
    rSquared: syy > 0 ? 1 - sse / syy : 1,
    rSquaredUncentered: sy2 > 0 ? 1 - sse / sy2 : 1,
    residuals,
  };
}
