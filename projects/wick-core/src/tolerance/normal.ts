import { erf } from 'mathjs';

import { DomainError } from '../errors';

/**
 * Standard normal distribution function Φ(x) = ½[1 + erf(x/√2)].
 * erf from mathjs (W. J. Cody's rational Chebyshev approximations, Math. Comp. 23 (1969) 631).
 * Absolute accuracy about 1e-16; relative accuracy degrades in the far lower tail (x < −8).
 */
export function normalCdf(x: number): number {
  if (x === Number.POSITIVE_INFINITY) return 1;
  if (x === Number.NEGATIVE_INFINITY) return 0;
  return 0.5 * (1 + (erf(x / Math.SQRT2) as number));
}

/** Standard normal density φ(x) = exp(−x²/2)/√(2π). */
export function normalPdf(x: number): number {
  return Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
}

/**
 * Standard normal quantile Φ⁻¹(p), 0 < p < 1, by safeguarded Newton iteration on {@link normalCdf}
 * (bracket [−40, 40], bisection when a Newton step leaves the bracket). Accurate to about 1e-12
 * in x for 1e-12 < p < 1 − 1e-12. Used for a handful of calls (tornado limits), not in sampling loops.
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    throw new DomainError('out-of-range', `A probability must lie in (0, 1) (got ${p}).`, 'p');
  }
  if (p === 0.5) return 0;
  let lo = -40;
  let hi = 40;
  let x = 0;
  for (let i = 0; i < 200; i++) {
    const f = normalCdf(x) - p;
    if (f > 0) hi = x;
    else lo = x;
    const d = normalPdf(x);
    let nx = d > 0 ? x - f / d : Number.NaN;
    if (!(nx > lo && nx < hi)) nx = 0.5 * (lo + hi);
    if (Math.abs(nx - x) <= 1e-14 * Math.max(1, Math.abs(nx))) return nx;
    x = nx;
  }
  return x;
}
