import { DomainError } from './errors';

/**
 * Input guards used at the top of every public model function. Each throws a
 * {@link DomainError} naming the field, so a user sees which value to correct.
 */

export function requireFinite(field: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new DomainError('not-finite', `${field} must be a finite number (got ${String(value)}).`, field);
  }
  return value;
}

export function requirePositive(field: string, value: number): number {
  requireFinite(field, value);
  if (value <= 0) {
    throw new DomainError('not-positive', `${field} must be greater than zero (got ${value}).`, field);
  }
  return value;
}

export function requireNonNegative(field: string, value: number): number {
  requireFinite(field, value);
  if (value < 0) {
    throw new DomainError('negative', `${field} must not be negative (got ${value}).`, field);
  }
  return value;
}

/** Closed interval [min, max] unless `open` says which ends are excluded. */
export function requireInRange(
  field: string,
  value: number,
  min: number,
  max: number,
  open: { min?: boolean; max?: boolean } = {},
): number {
  requireFinite(field, value);
  const belowMin = open.min ? value <= min : value < min;
  const aboveMax = open.max ? value >= max : value > max;
  if (belowMin || aboveMax) {
    const lo = open.min ? '(' : '[';
    const hi = open.max ? ')' : ']';
    throw new DomainError(
      'out-of-range',
      `${field} must lie in ${lo}${min}, ${max}${hi} (got ${value}).`,
      field,
      { min, max },
    );
  }
  return value;
}

/** Porosity and volume fractions: strictly between 0 and 1. */
export function requireFraction(field: string, value: number): number {
  return requireInRange(field, value, 0, 1, { min: true, max: true });
}

/** Contact angle in radians, 0 ≤ θ ≤ π. Messages quote degrees, the unit users type. */
export function requireContactAngle(field: string, thetaRad: number): number {
  requireFinite(field, thetaRad);
  if (thetaRad < 0 || thetaRad > Math.PI + 1e-12) {
    const deg = (thetaRad * 180) / Math.PI;
    throw new DomainError(
      'out-of-range',
      `${field} must lie between 0° and 180° (got ${deg.toFixed(2)}°).`,
      field,
    );
  }
  return thetaRad;
}
