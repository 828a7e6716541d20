import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requirePositive } from '../validate';
import { normalCdf, normalQuantile } from './normal';
import type { Rng } from './prng';

/**
 * Normal tolerance N(mean, sd²), optionally truncated to the OPEN interval (lower, upper) so that a
 * physical input stays valid (porosity: lower 0, upper 1; a radius or viscosity: lower 0).
 * `mean` defaults to the input's nominal value. Truncation is done by rejection, so the sampled
 * values follow the normal density restricted to the interval, renormalised (mean and sd of the
 * samples then differ from `mean` and `sd` when the bounds cut into the distribution).
 */
export interface NormalTolerance {
  readonly kind: 'normal';
  readonly mean?: number;
  readonly sd: number;
  readonly lower?: number;
  readonly upper?: number;
}

/** Uniform tolerance on [min, max]. */
export interface UniformTolerance {
  readonly kind: 'uniform';
  readonly min: number;
  readonly max: number;
}

/** Triangular tolerance on [min, max] with its peak at `mode` (defaults to the nominal value). */
export interface TriangularTolerance {
  readonly kind: 'triangular';
  readonly min: number;
  readonly mode?: number;
  readonly max: number;
}

export type Tolerance = NormalTolerance | UniformTolerance | TriangularTolerance;

/** A tolerance checked and made ready for sampling. */
export interface PreparedTolerance {
  readonly name: string;
  readonly tolerance: Tolerance;
  /** Draw one value. */
  sample(rng: Rng): number;
  /** Inverse distribution function F⁻¹(p), 0 < p < 1 (0 and 1 allowed for bounded kinds). */
  quantile(p: number): number;
}

/** Below this share of the normal distribution left inside the bounds the tolerance is refused. */
const MIN_ACCEPTANCE = 1e-3;
/** Below this share a warning says truncation changes the distribution noticeably. */
const WARN_ACCEPTANCE = 0.99;

/**
 * Check one tolerance and return a sampler.
 *
 * Uniform: x = min + u(max − min).
 * Triangular, by inversion of its distribution function (Evans, Hastings & Peacock,
 * *Statistical Distributions*, 3rd ed., Wiley 2000, triangular distribution), with F_c = (c − a)/(b − a):
 *   x = a + √(u (b − a)(c − a))            for u < F_c,
 *   x = b − √((1 − u)(b − a)(b − c))        otherwise.
 * Normal: Marsaglia polar deviates, rejected outside the open (lower, upper).
 */
export function prepareTolerance(
  name: string,
  tolerance: Tolerance,
  nominal: number | undefined,
  warnings: ModelWarning[],
): PreparedTolerance {
  const field = `tolerances.${name}`;
  switch (tolerance.kind) {
    case 'uniform': {
      const a = requireFinite(`${field}.min`, tolerance.min);
      const b = requireFinite(`${field}.max`, tolerance.max);
      if (!(b > a)) {
        throw new DomainError('invalid-input', `${field}: max must exceed min (got ${a} … ${b}).`, field);
      }
      const w = b - a;
      return {
        name,
        tolerance,
        sample: (rng) => a + w * rng.next(),
        quantile: (p) => a + w * checkP(p, true),
      };
    }
    case 'triangular': {
      const a = requireFinite(`${field}.min`, tolerance.min);
      const b = requireFinite(`${field}.max`, tolerance.max);
      const c = requireFinite(`${field}.mode`, tolerance.mode ?? requireNominal(name, nominal));
      if (!(b > a)) {
        throw new DomainError('invalid-input', `${field}: max must exceed min (got ${a} … ${b}).`, field);
      }
      if (c < a || c > b) {
        throw new DomainError('out-of-range', `${field}: mode ${c} must lie in [${a}, ${b}].`, field);
      }
      const fc = (c - a) / (b - a);
      const inv = (u: number): number =>
        u < fc ? a + Math.sqrt(u * (b - a) * (c - a)) : b - Math.sqrt((1 - u) * (b - a) * (b - c));
      return { name, tolerance, sample: (rng) => inv(rng.next()), quantile: (p) => inv(checkP(p, true)) };
    }
    case 'normal': {
      const mean = requireFinite(`${field}.mean`, tolerance.mean ?? requireNominal(name, nominal));
      const sd = requirePositive(`${field}.sd`, tolerance.sd);
      const lower = tolerance.lower ?? Number.NEGATIVE_INFINITY;
      const upper = tolerance.upper ?? Number.POSITIVE_INFINITY;
      if (Number.isNaN(lower) || Number.isNaN(upper) || !(upper > lower)) {
        throw new DomainError('invalid-input', `${field}: upper bound must exceed lower bound.`, field);
      }
      const pLo = normalCdf((lower - mean) / sd);
      const pHi = normalCdf((upper - mean) / sd);
      const kept = pHi - pLo;
      if (!(kept >= MIN_ACCEPTANCE)) {
        throw new DomainError(
          'out-of-range',
          `${field}: the bounds (${lower}, ${upper}) keep almost none of N(${mean}, ${sd}²); ` +
            'check the mean, the standard deviation and the bounds.',
          field,
        );
      }
      if (kept < WARN_ACCEPTANCE) {
        warnings.push({
          code: 'tolerance-truncated',
          message:
            `${name}: the bounds cut off ${((1 - kept) * 100).toFixed(1)} % of the normal tolerance; ` +
            'sampled values follow the truncated distribution, whose mean and sd differ from those given.',
        });
      }
      const truncated = lower > Number.NEGATIVE_INFINITY || upper < Number.POSITIVE_INFINITY;
      return {
        name,
        tolerance,
        sample: truncated
          ? (rng) => {
              // Expected tries 1/kept ≤ 1000; the loop ends with probability one.
              for (;;) {
                const x = mean + sd * rng.nextNormal();
                if (x > lower && x < upper) return x;
              }
            }
          : (rng) => mean + sd * rng.nextNormal(),
        quantile: (p) => {
          const q = pLo + checkP(p, false) * kept;
          const x = mean + sd * normalQuantile(Math.min(Math.max(q, 1e-300), 1 - 1e-16));
          return Math.min(Math.max(x, lower), upper);
        },
      };
    }
    default:
      throw new DomainError(
        'invalid-input',
        `${field}: unknown tolerance kind "${String((tolerance as { kind?: unknown }).kind)}" ` +
          '(use normal, uniform or triangular).',
        field,
      );
  }
}

function requireNominal(name: string, nominal: number | undefined): number {
  if (nominal === undefined) {
    throw new DomainError(
      'invalid-input',
      `No nominal value for "${name}": give one, or give the tolerance's mean/mode explicitly.`,
      name,
    );
  }
  return nominal;
}

function checkP(p: number, closed: boolean): number {
  const ok = closed ? p >= 0 && p <= 1 : p > 0 && p < 1;
  if (!ok) {
    throw new DomainError('out-of-range', `A probability must lie in ${closed ? '[0, 1]' : '(0, 1)'} (got ${p}).`, 'p');
  }
  return p;
}
