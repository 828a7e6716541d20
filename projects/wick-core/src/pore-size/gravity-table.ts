import { gravityCurve } from '../washburn/gravity';

/**
 * Fast evaluation of the gravity-restrained Washburn height for MANY pore classes.
 *
 * Every class obeys dh/dt = a/h − b, so in units h_eq = a/b and t* = a/b² all classes share one
 * dimensionless curve H(T) (Fries & Dreyer, J. Colloid Interface Sci. 320 (2008) 259), dH/dT = 1/H − 1.
 * It is written relative to the early Washburn law h = √(2at):
 *   h(t) = √(2at) · G(s),  s = √T = b√(t/a),  G(s) = H(s²)/(√2 s),
 * G(0) = 1 and G′(0) = −√2/3 (from the early-time expansion T = H²/2 + H³/3 + …, i.e. H = √(2T) − 2T/3 + …).
 * G is tabulated ONCE from the washburn module's exact solution, gravityCurve(1, 1, ·), at 4,097 nodes
 * uniform in s on 0 ≤ s ≤ 7 (T ≤ 49), and read by cubic Hermite interpolation with the exact slope
 * G′(s) = (s·H′(s) − H)/(√2 s²), H′(s) = 2s(1/H − 1). Interpolation error (Δs)⁴/384·max|G⁗| ≈ 1e-14;
 * the spec checks 1e-12 relative against gravityHeight over T = 1e-8 … 1e3. Beyond T = 49,
 * 1 − H ≈ e^{−1−T} < 1e-21, so h = a/b to double precision.
 * This replaces ~140 ns per point by ~10 ns, which the 100-class, 1,000-time uptake curve needs.
 */
const S_MAX = 7;
const NODES = 4096;
const DS = S_MAX / NODES;

let values: Float64Array | null = null;
/** Slopes times the node spacing, DS·G′(s), as the Hermite basis uses them. */
let slopes: Float64Array | null = null;

function table(): { g: Float64Array; d: Float64Array } {
  if (values === null || slopes === null) {
    const T = new Float64Array(NODES + 1);
    for (let k = 0; k <= NODES; k++) T[k] = (k * DS) ** 2;
    const h = gravityCurve(1, 1, T);
    const g = new Float64Array(NODES + 1);
    const d = new Float64Array(NODES + 1);
    g[0] = 1;
    d[0] = DS * (-Math.SQRT2 / 3);
    for (let k = 1; k <= NODES; k++) {
      const s = k * DS;
      const dh = 2 * s * (1 / h[k] - 1);
      g[k] = h[k] / (Math.SQRT2 * s);
      d[k] = (DS * (s * dh - h[k])) / (Math.SQRT2 * s * s);
    }
    values = g;
    slopes = d;
  }
  return { g: values, d: slopes };
}

/** Reusable square roots of the times for {@link gravityCurveInto} (no allocation per call). */
let roots = new Float64Array(0);

/**
 * One capillary-rise curve h(tᵢ) = √(2a tᵢ)·G(b tᵢ^½ / √a) written into `out` (the pore-size bundle sums it
 * over classes).
 */
export function gravityCurveInto(a: number, b: number, times: ArrayLike<number>, out: Float64Array): void {
  const n = times.length;
  if (roots.length < n) roots = new Float64Array(n);
  for (let j = 0; j < n; j++) roots[j] = Math.sqrt(times[j]);
  gravityCurveFromRoots(a, b, roots.subarray(0, n), out);
}

/**
 * {@link gravityCurveInto} from the square roots of the times, √tᵢ: the Monte Carlo band evaluates a thousand
 * curves per keystroke on one time grid, so it takes the roots once instead of a million times.
 */
export function gravityCurveFromRoots(a: number, b: number, rootTimes: ArrayLike<number>, out: Float64Array): void {
  const n = rootTimes.length;
  gravityPointCoefficients(a, b, coefficients, 0);
  const root2a = coefficients[0];
  const perRootT = coefficients[1];
  const heq = coefficients[2];
  for (let j = 0; j < n; j++) out[j] = gravityPoint(root2a, perRootT, heq, rootTimes[j]);
}

const coefficients = new Float64Array(3);

/**
 * The three numbers {@link gravityPoint} needs for dh/dt = a/h − b, written at `coef[at]`: √(2a), b/(√a·Δs)
 * (so that u = s/Δs is one product) and h_eq = a/b (+∞ without gravity). Builds the table on first use.
 */
export function gravityPointCoefficients(a: number, b: number, coef: Float64Array, at: number): void {
  table();
  coef[at] = Math.sqrt(2 * a);
  coef[at + 1] = b / Math.sqrt(a) / DS;
  coef[at + 2] = b > 0 ? a / b : Number.POSITIVE_INFINITY;
}

/**
 * Numbers per curve for {@link gravityRowInto}: those of {@link gravityPointCoefficients}, then a time after
 * which the curve is taken as h_eq and a cap on its height (both +∞ until the caller sets them).
 */
export const GRAVITY_ROW_WIDTH = 5;

export function gravityRowCoefficients(a: number, b: number, coef: Float64Array, at: number): void {
  gravityPointCoefficients(a, b, coef, at);
  coef[at + 3] = Number.POSITIVE_INFINITY;
  coef[at + 4] = Number.POSITIVE_INFINITY;
}

/** One curve of {@link gravityRowInto} at time t (√t = rootT). */
export function gravityRowValue(coef: Float64Array, at: number, t: number, rootT: number): number {
  const h = t > coef[at + 3] ? coef[at + 2] : gravityPoint(coef[at], coef[at + 1], coef[at + 2], rootT);
  return Math.min(h, coef[at + 4]);
}

/**
 * `count` curves at ONE time t (√t = rootT) into `row`, from their {@link gravityRowCoefficients}, taken in the
 * order given: `row[k]` is the curve whose coefficients start at `order[k] · GRAVITY_ROW_WIDTH`. The Monte Carlo
 * band reads a point of all its samples at a time, in the order it sorted them at the previous point. The loop
 * stays in this module with the kernel it calls, so that it compiles to one tight loop under any module loader.
 */
export function gravityRowInto(coef: Float64Array, order: Int32Array, count: number, t: number, rootT: number, row: Float64Array): void {
  for (let k = 0; k < count; k++) {
    const at = order[k] * GRAVITY_ROW_WIDTH;
    const h = t > coef[at + 3] ? coef[at + 2] : gravityPoint(coef[at], coef[at + 1], coef[at + 2], rootT);
    row[k] = Math.min(h, coef[at + 4]);
  }
}

/** h at √t = `rootT` from {@link gravityPointCoefficients} (the table must exist: coefficients build it). */
export function gravityPoint(root2a: number, perRootT: number, heq: number, rootT: number): number {
  const u = perRootT * rootT;
  if (u >= NODES) return heq;
  const g = values as Float64Array;
  const d = slopes as Float64Array;
  const k = Math.floor(u);
  const x = u - k;
  const x2 = x * x;
  const x3 = x2 * x;
  const g0 = g[k];
  // Cubic Hermite: h00·g0 + h01·g1 = g0 + (3x² − 2x³)(g1 − g0), slopes already scaled by Δs.
  return root2a * rootT * (g0 + x2 * (3 - 2 * x) * (g[k + 1] - g0) + (x3 - 2 * x2 + x) * d[k] + (x3 - x2) * d[k + 1]);
}

/** Reusable row for {@link accumulateGravityCurve} when the caller wants no class curve (no allocation per call). */
let row = new Float64Array(0);

/**
 * h(t) for dh/dt = a/h − b at each time (as {@link gravityCurveInto}), ADDED with weight w into `sum` and
 * folded into `max` (running maximum); optionally written to `classOut`. a > 0, b ≥ 0, times ≥ 0 — the
 * caller checks.
 */
export function accumulateGravityCurve(
  a: number,
  b: number,
  times: ArrayLike<number>,
  w: number,
  sum: Float64Array,
  max: Float64Array,
  classOut?: Float64Array,
): void {
  const n = times.length;
  let out = classOut;
  if (!out) {
    if (row.length < n) row = new Float64Array(n);
    out = row;
  }
  gravityCurveInto(a, b, times, out);
  for (let j = 0; j < n; j++) {
    const v = out[j];
    sum[j] += w * v;
    if (v > max[j]) max[j] = v;
  }
}
