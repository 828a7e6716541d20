import { DomainError } from '../errors';
import { requireFinite, requireNonNegative, requirePositive } from '../validate';

/**
 * Reading times and target lengths shared by the uptake models.
 *
 * The defaults follow what wicking tests usually read: absorbency/wicking rate at 10, 30, 60 and 300 s
 * (ISO 9073-6 / NWSP 010.1), height after 10 min (JIS L 1907 rise method, from memory), and time to given
 * distances (AATCC TM197). They are reading points only; nothing here reproduces a test procedure.
 */

/** Default reading times, s: 10 s, 30 s, 60 s, 300 s, 10 min. */
export const DEFAULT_CHECKPOINT_TIMES: readonly number[] = [10, 30, 60, 300, 600];
/** Default target lengths, m: 10, 20, 30 mm. */
export const DEFAULT_CHECKPOINT_HEIGHTS: readonly number[] = [0.01, 0.02, 0.03];

/** Validated copy of a list of times (s, ≥ 0) or lengths (m, ≥ 0); `positive` forbids zero. */
export function readCheckpoints(
  field: string,
  values: readonly number[] | undefined,
  fallback: readonly number[],
  positive = false,
): number[] {
  if (values === undefined) return [...fallback];
  if (!Array.isArray(values)) {
    throw new DomainError('invalid-input', `${field} must be a list of numbers.`, field);
  }
  return values.map((v, i) => {
    requireFinite(`${field}[${i}]`, v);
    return positive ? requirePositive(`${field}[${i}]`, v) : requireNonNegative(`${field}[${i}]`, v);
  });
}
