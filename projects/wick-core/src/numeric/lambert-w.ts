import { DomainError } from '../errors';
import { requireFinite } from '../validate';

/**
 * Principal branch W₀ of the Lambert W function, the solution w ≥ −1 of w·eʷ = x for x ≥ −1/e.
 *
 * Source: R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey & D. E. Knuth, "On the Lambert W
 * function", Adv. Comput. Math. 5 (1996) 329–359 — Taylor series about 0, series about the branch point
 * with its coefficient recurrence, Halley iteration, and the asymptotic start ln x − ln ln x for large x.
 * (Equation numbers of that paper are not quoted here: from memory they are in §4–§5.)
 *
 * Near the branch point W₀ is ill-conditioned in x: W + 1 ≈ √(2(1 + e·x)). Callers that know the
 * branch-point offset q = 1 + e·x more accurately than x itself (the gravity-restrained Washburn
 * solution and radial spreading do) should call {@link lambertW0PlusOne}, which returns 1 + W₀
 * to full relative precision.
 */

/** 1/e split into a double and its rounding remainder, so x + 1/e is exact near the branch point. */
const INV_E_HI = 0.36787944117144233;
const INV_E_LO = -1.2428753672788363e-17;

/** Number of branch-point series terms μ₁…μ_N kept; at p ≤ 0.5 the first omitted term is below 1e-20. */
const BRANCH_TERMS = 40;
/** Series used alone for p = √(2q) ≤ this value. */
const BRANCH_SERIES_MAX_P = 0.5;

/**
 * Coefficients μ_k of 1 + W₀ = Σ_{k≥1} μ_k p^k, p = √(2(1 + e·x)); recurrence of Corless et al. (1996):
 * μ_k = (k−1)/(k+1)·(μ_{k−2}/2 + α_{k−2}/4) − α_k/2 − μ_{k−1}/(k+1),
 * α_k = Σ_{j=2}^{k−1} μ_j μ_{k+1−j}, μ₀ = −1, μ₁ = 1, α₀ = 2, α₁ = −1.
 */
const BRANCH_MU: Float64Array = (() => {
  const mu = new Float64Array(BRANCH_TERMS + 1);
  const alpha = new Float64Array(BRANCH_TERMS + 1);
  mu[0] = -1;
  mu[1] = 1;
  alpha[0] = 2;
  alpha[1] = -1;
  for (let k = 2; k <= BRANCH_TERMS; k++) {
    let s = 0;
    for (let j = 2; j <= k - 1; j++) s += mu[j] * mu[k + 1 - j];
    alpha[k] = s;
    mu[k] = ((k - 1) / (k + 1)) * (mu[k - 2] / 2 + alpha[k - 2] / 4) - alpha[k] / 2 - mu[k - 1] / (k + 1);
  }
  return mu;
})();

/** Taylor series of W₀ about 0 is used for |x| ≤ this value (well inside the radius 1/e). */
const TAYLOR_MAX_X = 0.14;
const TAYLOR_TERMS = 20;
/** (−n)^{n−1}/n! for n = 1 … 20. */
const TAYLOR_COEF: Float64Array = (() => {
  const c = new Float64Array(TAYLOR_TERMS + 1);
  let fact = 1;
  for (let n = 1; n <= TAYLOR_TERMS; n++) {
    fact *= n;
    c[n] = Math.pow(-n, n - 1) / fact;
  }
  return c;
})();

/** (n − 1)/n! for n = 2 … 22: Taylor coefficients of S(H) = 1 − (1 − H)·e^H. */
const S_COEF: Float64Array = (() => {
  const c = new Float64Array(23);
  let fact = 1;
  for (let n = 1; n <= 22; n++) {
    fact *= n;
    c[n] = (n - 1) / fact;
  }
  return c;
})();

/** S(H) = 1 − (1 − H)eᴴ = Σ_{n≥2} (n−1)Hⁿ/n!, summed without cancellation; 22 terms suffice for 0 ≤ H ≤ 0.9. */
function sSeries(h: number): number {
  let s = 0;
  for (let n = 22; n >= 2; n--) s = (s + S_COEF[n]) * h;
  return s * h;
}

/** Branch-point series Σ μ_k p^k (k ≥ 1) = 1 + W₀, no checks. */
function branchSeries(p: number): number {
  let s = 0;
  for (let k = BRANCH_TERMS; k >= 1; k--) s = (s + BRANCH_MU[k]) * p;
  return s;
}

/**
 * Inverse of {@link lambertW0PlusOne}: the branch-point offset q = S(H) = 1 − (1 − H)·eᴴ of H = 1 + W₀ ≥ 0,
 * evaluated without cancellation (Taylor series Σ_{n≥2} (n−1)Hⁿ/n! below H = 0.8). No input checks.
 */
export function lambertW0PlusOneInverse(h: number): number {
  if (h < 0.8) return sSeries(h);
  return 1 + (h - 1) * Math.exp(h);
}

/**
 * 1 + W₀(x) with x = (q − 1)/e, i.e. q = 1 + e·x ≥ 0 is the distance from the branch point; no input checks.
 * Relative accuracy about 1e-15 for every q ≥ 0, including q → 0 where 1 + W₀ ≈ √(2q).
 */
export function lambertW0PlusOneUnchecked(q: number): number {
  if (q === 0) return 0;
  const p = Math.sqrt(2 * q);
  if (p <= BRANCH_SERIES_MAX_P) return branchSeries(p);
  if (q < 0.64) {
    // Solve S(H) = q for H = 1 + W (Halley): well conditioned in q, unlike W·eᵂ = x near the branch point.
    // The series start is good to ≲ 1e-6 up to p = √1.28, so one or two steps reach full precision.
    let h = branchSeries(p);
    for (let i = 0; i < 6; i++) {
      const eh = Math.exp(h);
      const f = sSeries(h) - q;
      const d1 = h * eh;
      const d2 = (1 + h) * eh;
      const step = f / d1 / (1 - (f * d2) / (2 * d1 * d1));
      h -= step;
      // Halley converges cubically: after a step of relative size ≤ 1e-6 the error is ≲ 1e-17.
      if (Math.abs(step) <= 1e-6 * h) break;
    }
    return h;
  }
  // x = (q − 1)/e ≥ −0.133: q − 1 is exact for q ≥ 0.5, and 1 + W ≥ 0.84 loses no digits.
  return 1 + lambertW0Unchecked((q - 1) / Math.E);
}

/**
 * 1 + W₀((q − 1)/e) for a branch-point offset q = 1 + e·x ≥ 0.
 *
 * Use when q is known directly (e.g. q = 1 − e^{−T} = −expm1(−T)): it avoids forming x = (q − 1)/e, which
 * rounds away the information near the branch point. Result ≥ 0, ≈ √(2q) for small q.
 *
 * Source: Corless et al., Adv. Comput. Math. 5 (1996) 329 (branch-point series and Halley iteration).
 * @param q dimensionless, q ≥ 0.
 */
export function lambertW0PlusOne(q: number): number {
  requireFinite('q', q);
  if (q < 0) {
    throw new DomainError('out-of-range', `The branch-point offset q must not be negative (got ${q}).`, 'q');
  }
  return lambertW0PlusOneUnchecked(q);
}

/** Principal-branch W₀(x) without input checks; x must be finite and ≥ −1/e (up to rounding). */
export function lambertW0Unchecked(x: number): number {
  if (x === 0) return x;
  if (x < -0.18) {
    const q = Math.E * (x + INV_E_HI + INV_E_LO);
    if (q <= 0) return -1;
    if (q < 0.5) return lambertW0PlusOneUnchecked(q) - 1;
  }
  const ax = Math.abs(x);
  if (ax <= TAYLOR_MAX_X) {
    // Taylor series W = Σ (−n)^{n−1} xⁿ/n! (radius 1/e; Corless et al. 1996), 20 terms: exact to
    // rounding for |x| ≤ 0.05; above, its error (≲ 1e-11) is removed by one Halley step (cubic convergence).
    let w = 0;
    for (let n = TAYLOR_TERMS; n >= 1; n--) w = (w + TAYLOR_COEF[n]) * x;
    if (ax > 0.05) {
      const ew = Math.exp(w);
      const f = w * ew - x;
      const wp1 = w + 1;
      w -= f / (ew * wp1 - ((w + 2) * f) / (2 * wp1));
    }
    return w;
  }
  if (x < 3) {
    // Halley on w·eʷ − x (Corless et al. 1996) from Winitzki's start (S. Winitzki, LNCS 2667 (2003) 780, from memory).
    const l = Math.log1p(x);
    let w = l * (1 - Math.log1p(l) / (2 + l));
    for (let i = 0; i < 12; i++) {
      const ew = Math.exp(w);
      const f = w * ew - x;
      const wp1 = w + 1;
      const step = f / (ew * wp1 - ((w + 2) * f) / (2 * wp1));
      w -= step;
      if (Math.abs(step) <= 1e-6 * Math.abs(w)) break;
    }
    return w;
  }
  // Large x: Halley on g(w) = w + ln w − ln x, which never overflows; start ln x − ln ln x + ln ln x / ln x.
  const l1 = Math.log(x);
  const l2 = Math.log(l1);
  let w = l1 - l2 + l2 / l1;
  for (let i = 0; i < 12; i++) {
    const g = w + Math.log(w) - l1;
    const g1 = 1 + 1 / w;
    const g2 = -1 / (w * w);
    const step = g / g1 / (1 - (g * g2) / (2 * g1 * g1));
    w -= step;
    if (Math.abs(step) <= 1e-6 * w) break;
  }
  return w;
}

/**
 * Principal branch of the Lambert W function: W₀(x) is the w ≥ −1 with w·eʷ = x.
 *
 * Domain x ∈ [−1/e, ∞). The double nearest −1/e lies a hair below the true branch point and is read as it
 * (returns −1); anything further below throws. Relative accuracy ≈ 1e-15 away from the branch point; near it
 * the function itself amplifies the rounding of x (dW/dx → ∞), see {@link lambertW0PlusOne}.
 *
 * Source: Corless, Gonnet, Hare, Jeffrey & Knuth, Adv. Comput. Math. 5 (1996) 329–359.
 * @param x dimensionless, x ≥ −1/e.
 * @throws DomainError 'out-of-range' below −1/e, 'not-finite' for NaN/±∞.
 */
export function lambertW0(x: number): number {
  requireFinite('x', x);
  if (x < -INV_E_HI) {
    const q = Math.E * (x + INV_E_HI + INV_E_LO);
    // Accept a few ulps below −1/e: the nearest double to −1/e is itself below it.
    if (q < -8 * Number.EPSILON) {
      throw new DomainError(
        'out-of-range',
        `The principal Lambert W branch is defined for x ≥ −1/e ≈ −0.3678794 (got ${x}).`,
        'x',
        { min: -1 / Math.E },
      );
    }
  }
  return lambertW0Unchecked(x);
}
