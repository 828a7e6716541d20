import { DomainError } from '../errors';
import { requireFinite, requirePositive } from '../validate';

/** One row of a user's property table: temperature in K, value in the property's SI unit. */
export interface TablePoint {
  readonly temperature: number;
  readonly value: number;
}

export interface TableLookup {
  readonly value: number;
  /** Set when T lay outside the table and the end value was used. */
  readonly clampedTo?: 'min' | 'max';
  readonly range: { readonly min: number; readonly max: number };
}

function isSorted(points: readonly TablePoint[]): boolean {
  for (let i = 1; i < points.length; i++) {
    if (!(points[i].temperature > points[i - 1].temperature)) return false;
  }
  return true;
}

/**
 * Checks a property table (finite positive temperatures, positive values, no repeated temperature)
 * and returns it sorted by temperature (the same array when already sorted).
 *
 * @throws DomainError 'insufficient-data' for an empty table, 'invalid-input' for a repeated temperature.
 */
export function checkTable(field: string, points: readonly TablePoint[]): readonly TablePoint[] {
  if (!Array.isArray(points) || points.length === 0) {
    throw new DomainError('insufficient-data', `${field} needs at least one (temperature, value) row.`, field);
  }
  for (const p of points) {
    requirePositive(`${field} temperature`, p.temperature);
    requirePositive(`${field} value`, p.value);
  }
  const sorted = isSorted(points) ? points : [...points].sort((a, b) => a.temperature - b.temperature);
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i].temperature === sorted[i - 1].temperature) {
      throw new DomainError(
        'invalid-input',
        `${field} lists temperature ${sorted[i].temperature} K twice.`,
        field,
      );
    }
  }
  return sorted;
}

/**
 * Piecewise-linear interpolation in temperature over a table sorted by {@link checkTable};
 * outside the table the end value is used (clamped) and `clampedTo` says which end.
 *
 * y = y_i + (y_{i+1} − y_i)(T − T_i)/(T_{i+1} − T_i) for T_i ≤ T ≤ T_{i+1}.
 */
export function interpolateTable(sorted: readonly TablePoint[], temperatureK: number): TableLookup {
  requireFinite('temperature', temperatureK);
  const n = sorted.length;
  const range = { min: sorted[0].temperature, max: sorted[n - 1].temperature };
  if (temperatureK < range.min) return { value: sorted[0].value, clampedTo: 'min', range };
  if (temperatureK > range.max) return { value: sorted[n - 1].value, clampedTo: 'max', range };
  // Binary search for the interval (tables are short, but this keeps it O(log n)).
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid].temperature <= temperatureK) lo = mid;
    else hi = mid;
  }
  const a = sorted[lo];
  const b = sorted[hi];
  if (n === 1 || b.temperature === a.temperature) return { value: a.value, range };
  const f = (temperatureK - a.temperature) / (b.temperature - a.temperature);
  return { value: a.value + (b.value - a.value) * f, range };
}
