/**
 * Fast evaluation of the two uptake curves for the Monte Carlo bands, where the same curve is evaluated a
 * million times per keystroke. Both are one universal curve scaled per sample, so they are tabulated ONCE from
 * the washburn family's exact solutions and read by cubic Hermite interpolation with exact slopes:
 *
 * - Gravity-restrained rise, h = (a/b)·H(T), T = t·b²/a: the pore-size family's table (gravityCurveFromRoots)
 *   covers T ≤ 49; beyond T = 40 the exact solution H = 1 + W₀(−e^{−1−T}) equals 1 to double precision
 *   (|W₀(x)| ≤ 2|x| for |x| < 0.1 and e^{−41} < 1e-17), so h = a/b there exactly as the exact function returns it.
 * - Radial spreading, R = r0·F(q), q = 4at/r0²: F is tabulated on ln q ∈ [ln 1e-8, ln 1e9] at 8,192 nodes from
 *   radialRadiusUnchecked(¼, 1, q), with dF/d ln q = q/(4 F ln F) (from dR/dt = a/(R ln(R/r0)), Marmur 1988).
 *   Hermite error (Δ⁴/384)·max|F⁗| ≈ 1e-13·F (the spec checks 1e-11 against the exact function); outside the
 *   table the exact function is called.
 */
import { gravityCurveFromRoots, gravityRowCoefficients } from '../pore-size/gravity-table';
import { radialRadiusUnchecked } from '../washburn/radial';

/** Beyond this dimensionless time H(T) = 1 in double precision. */
const T_SATURATED = 40;

/**
 * h(tᵢ) for dh/dt = a/h − b into `out` (a > 0, b ≥ 0, times ≥ 0 and ASCENDING, unchecked); `rootTimes` holds
 * √tᵢ, computed once for all the curves of one time grid.
 */
export function gravityCurveFast(a: number, b: number, times: Float64Array, rootTimes: Float64Array, out: Float64Array): void {
  const n = times.length;
  // Times ascend (curveTimes): past t = 40 t* the curve is flat at a/b, so only the rising part is evaluated.
  let rising = n;
  if (b > 0) {
    rising = saturatedFrom(times, (T_SATURATED * a) / (b * b));
    const heq = a / b;
    for (let i = rising; i < n; i++) out[i] = heq;
  }
  if (rising > 0) gravityCurveFromRoots(a, b, rootTimes.subarray(0, rising), out.subarray(0, rising));
}

/**
 * The first of the ascending `times` past the saturation time `tSat`, from which the curve is flat at h_eq
 * (times.length when none is).
 */
export function saturatedFrom(times: ArrayLike<number>, tSat: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (times[mid] > tSat) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * The pore-size family's row coefficients of one curve (see gravityRowInto) with the saturation time of
 * {@link gravityCurveFast}, so that a row read point by point equals gravityCurveFast bit for bit. The cap
 * (coef[at + 4]) stays +∞ for the caller to set.
 */
export function gravityCurveCoefficients(a: number, b: number, coef: Float64Array, at: number): void {
  gravityRowCoefficients(a, b, coef, at);
  coef[at + 3] = b > 0 ? (T_SATURATED * a) / (b * b) : Number.POSITIVE_INFINITY;
}

const LN_Q_MIN = Math.log(1e-8);
const LN_Q_MAX = Math.log(1e9);
const NODES = 8192;
const DL = (LN_Q_MAX - LN_Q_MIN) / NODES;

let radialF: Float64Array | null = null;
let radialD: Float64Array | null = null;

function radialTable(): { f: Float64Array; d: Float64Array } {
  if (radialF === null || radialD === null) {
    const f = new Float64Array(NODES + 1);
    const d = new Float64Array(NODES + 1);
    for (let k = 0; k <= NODES; k++) {
      const q = Math.exp(LN_Q_MIN + k * DL);
      // a = ¼, r0 = 1, t = q gives q = 4at/r0²: the exact family solution F(q).
      f[k] = radialRadiusUnchecked(0.25, 1, q);
      d[k] = q / (4 * f[k] * Math.log(f[k]));
    }
    radialF = f;
    radialD = d;
  }
  return { f: radialF, d: radialD };
}

/** R(tᵢ) for radial spreading from a fed spot of radius r0 (a > 0, r0 > 0, times ≥ 0, unchecked). */
export function radialCurveFast(a: number, r0: number, times: Float64Array, out: Float64Array): void {
  const { f, d } = radialTable();
  const scale = (4 * a) / (r0 * r0);
  for (let i = 0; i < times.length; i++) {
    const q = times[i] * scale;
    const lq = q > 0 ? Math.log(q) : Number.NEGATIVE_INFINITY;
    if (!(lq >= LN_Q_MIN && lq < LN_Q_MAX)) {
      out[i] = radialRadiusUnchecked(a, r0, times[i]);
      continue;
    }
    const u = (lq - LN_Q_MIN) / DL;
    const k = Math.min(Math.floor(u), NODES - 1);
    const x = u - k;
    const x2 = x * x;
    const x3 = x2 * x;
    out[i] =
      r0 *
      ((2 * x3 - 3 * x2 + 1) * f[k] + (x3 - 2 * x2 + x) * DL * d[k] + (-2 * x3 + 3 * x2) * f[k + 1] + (x3 - x2) * DL * d[k + 1]);
  }
}
