import { DomainError } from '../errors';
import { lambertW0PlusOneInverse, lambertW0PlusOneUnchecked, lambertW0Unchecked } from '../numeric/lambert-w';
import { requireFinite, requireNonNegative, requirePositive } from '../validate';

/**
 * Closed-form solution of the gravity-restrained Lucas–Washburn equation
 *
 *   dh/dt = a/h − b,  h(0) = 0,
 *
 * a (m²/s) the capillary drive, b (m/s) the gravity drag along the flow direction. For a round capillary
 * a = γ r cos θ/(4η) and b = ρ g r² sin α/(8η); for a porous layer a = k Pc/(ε η), b = k ρ g sin α/(ε η).
 *
 * With h_eq = a/b (equilibrium length), t* = a/b², H = h/h_eq and T = t/t*:
 *   T = −H − ln(1 − H)              (implicit solution, Washburn 1921),
 *   H = 1 + W₀(−exp(−1 − T))        (explicit, Fries & Dreyer 2008).
 *
 * Near T → 0 the argument sits at the Lambert-W branch point, where W₀ loses about half its digits; the
 * code evaluates H = 1 + W₀ from the branch-point offset q = 1 − e^{−T} = −expm1(−T) instead, which keeps
 * full relative precision (H ≈ √(2T), i.e. h ≈ √(2at), the horizontal Washburn law). For T ≥ 1 it uses
 * W₀ at x = −e^{−1−T} directly, which is well conditioned there and tends to h_eq as T → ∞.
 *
 * Sources: E. W. Washburn, Phys. Rev. 17 (1921) 273–283; N. Fries & M. Dreyer, J. Colloid Interface Sci.
 * 320 (2008) 259–263; Lambert W: Corless et al., Adv. Comput. Math. 5 (1996) 329.
 * Validity: viscous (Poiseuille/Darcy) regime, fully developed flow behind a sharp front, constant contact
 * angle; inertia and entrance losses neglected (see the capillary model's inertial-time warning).
 */

/** Below this T the computed T underflows or is meaningless: h = √(2at) to double precision. */
const T_NEGLIGIBLE = 1e-200;

/** h(t) without checks; a > 0, b ≥ 0, t ≥ 0 finite. */
export function gravityHeightUnchecked(a: number, b: number, t: number): number {
  if (t === 0) return 0;
  if (b === 0) return Math.sqrt(2 * a * t);
  const tt = ((t * b) / a) * b;
  if (tt < T_NEGLIGIBLE) return Math.sqrt(2 * a * t);
  if (tt < 1) {
    const hh = lambertW0PlusOneUnchecked(-Math.expm1(-tt));
    // h = (a/b)·H written as √(2at)·H/√(2T): no overflow of a/b when b is tiny.
    return Math.sqrt(2 * a * t) * (hh / Math.sqrt(2 * tt));
  }
  return (a / b) * (1 + lambertW0Unchecked(-Math.exp(-1 - tt)));
}

/** Dimensionless time T(H) = −H − ln(1 − H) for 0 ≤ H < 1, without cancellation at small H. */
export function gravityDimensionlessTime(hh: number): number {
  if (hh < 0.8) return -Math.log1p(-lambertW0PlusOneInverse(hh));
  return -hh - Math.log1p(-hh);
}

function checkCoefficients(a: number, b: number): void {
  requirePositive('a', a);
  requireNonNegative('b', b);
}

function finiteResult(value: number, what: string): number {
  if (!Number.isFinite(value)) {
    throw new DomainError('out-of-range', `The ${what} is too large to represent; check the units of the inputs.`);
  }
  return value;
}

/**
 * Length wetted at time t for dh/dt = a/h − b, h(0) = 0 (Fries & Dreyer 2008 explicit solution).
 *
 * h = (a/b)·[1 + W₀(−exp(−1 − t b²/a))]; b = 0 gives √(2at) (Washburn 1921, horizontal).
 * Relative accuracy about 1e-15 for all t, including t → 0 (→ √(2at)) and t → ∞ (→ h_eq = a/b).
 *
 * @param a capillary drive, m²/s (> 0).
 * @param b gravity drag, m/s (≥ 0).
 * @param t time, s (≥ 0).
 * @returns h, m.
 */
export function gravityHeight(a: number, b: number, t: number): number {
  checkCoefficients(a, b);
  requireNonNegative('t', t);
  return finiteResult(gravityHeightUnchecked(a, b, t), 'wetted length');
}

/** t(h) without checks; returns null when h ≥ a/b. */
export function gravityTimeUnchecked(a: number, b: number, h: number): number | null {
  if (h === 0) return 0;
  const washburn = (h * h) / (2 * a);
  if (b === 0) return washburn;
  const hh = (h * b) / a;
  if (hh >= 1) return null;
  // t = (a/b²)·T(H) written as h²/(2a)·2T/H², which stays finite for tiny b.
  if (hh < 1e-8) return washburn * (1 + hh * ((2 / 3) + hh / 2));
  return washburn * ((2 * gravityDimensionlessTime(hh)) / (hh * hh));
}

/**
 * Time to wet a length h for dh/dt = a/h − b, h(0) = 0 (Washburn 1921 implicit solution):
 *
 * t = (a/b²)·[−H − ln(1 − H)], H = h b/a; b = 0 gives t = h²/(2a).
 *
 * @param a capillary drive, m²/s (> 0).
 * @param b gravity drag, m/s (≥ 0).
 * @param h wetted length, m (≥ 0).
 * @returns t in s, or null when h ≥ h_eq = a/b (never reached).
 */
export function gravityTime(a: number, b: number, h: number): number | null {
  checkCoefficients(a, b);
  requireNonNegative('h', h);
  const t = gravityTimeUnchecked(a, b, h);
  return t === null ? null : finiteResult(t, 'time');
}

/**
 * Front velocity dh/dt = a/h − b at length h > 0, m/s (Washburn 1921). No checks.
 */
export function gravityRateUnchecked(a: number, b: number, h: number): number {
  return a / h - b;
}

/**
 * h(t) at many times, written into a Float64Array without per-point allocation.
 *
 * Same equation and accuracy as {@link gravityHeight}.
 * @param a capillary drive, m²/s (> 0).
 * @param b gravity drag, m/s (≥ 0).
 * @param times times, s (each finite and ≥ 0).
 * @param out optional output of length ≥ times.length (reused by hot loops).
 * @returns `out` (or a new array) holding h in m.
 */
export function gravityCurve(
  a: number,
  b: number,
  times: ArrayLike<number>,
  out?: Float64Array,
): Float64Array {
  checkCoefficients(a, b);
  const n = times.length;
  if (out !== undefined && out.length < n) {
    throw new DomainError(
      'invalid-input',
      `The output array holds ${out.length} values but ${n} times were given.`,
      'out',
    );
  }
  const h = out ?? new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = times[i];
    if (!(t >= 0) || t === Number.POSITIVE_INFINITY) {
      requireFinite(`times[${i}]`, t);
      requireNonNegative(`times[${i}]`, t);
    }
    const v = gravityHeightUnchecked(a, b, t);
    if (!Number.isFinite(v)) finiteResult(v, 'wetted length');
    h[i] = v;
  }
  return h;
}
