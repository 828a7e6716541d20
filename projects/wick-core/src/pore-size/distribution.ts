import { DomainError, type ModelWarning } from '../errors';
import { requirePositive } from '../validate';

/**
 * Pore-size distributions (PSD) as a set of diameter classes with pore-VOLUME fractions.
 *
 * Three input forms, all over the same strictly increasing class diameters D₁ < D₂ < … < Dₙ:
 * - 'differential': fᵢ = volume fraction of pore space in class i.
 * - 'cumulative-finer': Fᵢ = fraction of pore volume in pores with D ≤ Dᵢ ("percent finer"),
 *   non-decreasing, Fₙ = 1. fᵢ = Fᵢ − Fᵢ₋₁ with F₀ = 0 (Dᵢ is the class's representative diameter,
 *   so F₁ is the share of the smallest class).
 * - 'cumulative-coarser': Gᵢ = fraction of pore volume in pores with D ≥ Dᵢ ("percent coarser",
 *   the usual form of intrusion/porometry read-outs), non-increasing, G₁ = 1. fᵢ = Gᵢ − Gᵢ₊₁ with Gₙ₊₁ = 0.
 *
 * Normalisation policy (documented in docs/models/pore-size.md): the total (Σfᵢ, Fₙ or G₁) is
 * rescaled to 1 silently when within 1e-6 of 1, rescaled WITH a warning when within 5 %, and
 * refused with a DomainError beyond that (typically percentages entered as fractions).
 * Negative fractions and non-monotone cumulative values (beyond 1e-9 rounding) are refused.
 */
export type DistributionForm = 'differential' | 'cumulative-finer' | 'cumulative-coarser';

export interface PoreSizeDistributionInput {
  /** Class diameters, m, strictly increasing. */
  readonly diameters: ArrayLike<number>;
  /** Volume fractions in the given form, dimensionless. */
  readonly fractions: ArrayLike<number>;
  readonly form: DistributionForm;
}

/** A checked distribution: differential fractions summing to exactly 1. */
export interface PoreSizeDistribution {
  /** Class diameters, m, strictly increasing. */
  readonly diameters: Float64Array;
  /** Differential volume fractions, each ≥ 0, Σ = 1. */
  readonly fractions: Float64Array;
  /** Cumulative fraction finer Fᵢ = Σ_{j≤i} fⱼ (last = 1). */
  readonly cumulativeFiner: Float64Array;
}

/** Totals within this of 1 are rescaled without comment (rounding in a table). */
const SILENT_TOLERANCE = 1e-6;
/** Totals within this of 1 are rescaled with a warning; beyond, the input is refused. */
const WARN_TOLERANCE = 0.05;
/** Cumulative values may step back by this much (rounding) before being called non-monotone. */
const MONOTONE_SLACK = 1e-9;

/** Differential fractions → cumulative in the chosen convention (no normalisation). */
export function differentialToCumulative(
  fractions: ArrayLike<number>,
  convention: 'finer' | 'coarser',
): Float64Array {
  const n = fractions.length;
  const out = new Float64Array(n);
  let s = 0;
  if (convention === 'finer') {
    for (let i = 0; i < n; i++) out[i] = s += fractions[i];
  } else {
    for (let i = n - 1; i >= 0; i--) out[i] = s += fractions[i];
  }
  return out;
}

/**
 * Cumulative fractions in the chosen convention → differential (no normalisation).
 * Throws DomainError when the cumulative values are not monotone in the convention's sense.
 */
export function cumulativeToDifferential(
  cumulative: ArrayLike<number>,
  convention: 'finer' | 'coarser',
): Float64Array {
  const n = cumulative.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const c = cumulative[i];
    if (!Number.isFinite(c) || c < -MONOTONE_SLACK) {
      throw new DomainError('negative', `Cumulative fraction ${i + 1} must be a number ≥ 0 (got ${c}).`, 'fractions', { index: i });
    }
    const next = convention === 'finer' ? (i > 0 ? cumulative[i - 1] : 0) : i + 1 < n ? cumulative[i + 1] : 0;
    const d = c - next;
    if (d < -MONOTONE_SLACK) {
      throw new DomainError(
        'invalid-input',
        convention === 'finer'
          ? `Cumulative "fraction finer" must not decrease with diameter: value ${i + 1} (${c}) is below value ${i} (${next}).`
          : `Cumulative "fraction coarser" must not increase with diameter: value ${i + 1} (${c}) is below value ${i + 2} (${next}).`,
        'fractions',
        { index: i },
      );
    }
    out[i] = Math.max(d, 0);
  }
  return out;
}

/** Check, convert and normalise a distribution; warnings are appended to `warnings`. */
export function preparePoreSizeDistribution(
  input: PoreSizeDistributionInput,
  warnings: ModelWarning[],
): PoreSizeDistribution {
  const { diameters: d, fractions: v, form } = input;
  if (!d || !v || d.length !== v.length) {
    throw new DomainError(
      'invalid-input',
      `Give one fraction per diameter class (got ${d?.length ?? 0} diameters and ${v?.length ?? 0} fractions).`,
      'fractions',
    );
  }
  const n = d.length;
  if (n < 1) throw new DomainError('insufficient-data', 'Give at least one pore-diameter class.', 'diameters');
  const diameters = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    diameters[i] = requirePositive(`diameters[${i}]`, d[i]);
    if (i > 0 && !(diameters[i] > diameters[i - 1])) {
      throw new DomainError(
        'invalid-input',
        `Pore diameters must be strictly increasing: class ${i + 1} (${diameters[i]} m) does not exceed class ${i} (${diameters[i - 1]} m).`,
        'diameters',
        { index: i },
      );
    }
  }
  let raw: Float64Array;
  let total: number;
  switch (form) {
    case 'differential': {
      raw = new Float64Array(n);
      total = 0;
      for (let i = 0; i < n; i++) {
        const f = v[i];
        if (!Number.isFinite(f)) throw new DomainError('not-finite', `Fraction ${i + 1} must be a finite number.`, 'fractions');
        if (f < 0) {
          throw new DomainError('negative', `Volume fraction ${i + 1} must not be negative (got ${f}).`, 'fractions', { index: i });
        }
        raw[i] = f;
        total += f;
      }
      break;
    }
    case 'cumulative-finer':
      raw = cumulativeToDifferential(v, 'finer');
      total = v[n - 1];
      break;
    case 'cumulative-coarser':
      raw = cumulativeToDifferential(v, 'coarser');
      total = v[0];
      break;
    default:
      throw new DomainError(
        'invalid-input',
        `Unknown distribution form "${String(form)}" (use differential, cumulative-finer or cumulative-coarser).`,
        'form',
      );
  }
  if (!(total > 0)) throw new DomainError('not-positive', 'The pore-volume fractions add up to zero.', 'fractions');
  const off = Math.abs(total - 1);
  if (off > WARN_TOLERANCE) {
    throw new DomainError(
      'out-of-range',
      `The pore-volume fractions total ${total.toPrecision(4)}, not 1 (more than 5 % off). ` +
        'Enter fractions (0–1), not percentages, covering the whole pore volume.',
      'fractions',
      { total },
    );
  }
  if (off > SILENT_TOLERANCE) {
    warnings.push({
      code: 'psd-normalised',
      message: `The pore-volume fractions total ${total.toPrecision(4)}; they were rescaled to 1.`,
    });
  }
  let s = 0;
  for (let i = 0; i < n; i++) s += raw[i];
  const fractions = new Float64Array(n);
  for (let i = 0; i < n; i++) fractions[i] = raw[i] / s;
  const cumulativeFiner = differentialToCumulative(fractions, 'finer');
  cumulativeFiner[n - 1] = 1;
  return { diameters, fractions, cumulativeFiner };
}
