import type { ResultBase } from '../api/model-spec';
import type { ModelWarning } from '../errors';
import { type Dimension, SI_UNIT } from './dimensions';
import { formatQuantity, fromSI, parseQuantity } from './quantity';

export interface ConvertQuantityInput {
  /** The quantity as typed, e.g. '1.7 dtex'. */
  readonly quantity: string;
  /** Target unit; the SI unit of the quantity's dimension when omitted. */
  readonly to?: string;
  /** Dimension the quantity must have (refused otherwise). */
  readonly expected?: Dimension;
}

export interface ConvertQuantityResult extends ResultBase<ConvertQuantityInput> {
  readonly dimension: Dimension;
  /** Value in the SI unit `siUnit`. */
  readonly si: number;
  readonly siUnit: string;
  /** Value in `unit` (the target). */
  readonly value: number;
  readonly unit: string;
  /** `value` with its unit, 4 significant digits. */
  readonly formatted: string;
}

/**
 * Converts a typed quantity to another unit of the same dimension:
 * value_to = (si / scale_to) − offset_to with si = (value + offset_from) · scale_from
 * (offsets only for °C and °F). Exact up to floating-point rounding; unit definitions in units/math.ts.
 */
export function convertQuantity(input: ConvertQuantityInput): ConvertQuantityResult {
  const parsed = parseQuantity(input.quantity, input.expected);
  const unit = input.to ?? SI_UNIT[parsed.dimension];
  // The target must hold the same dimension as the quantity.
  parseQuantity(`1 ${unit}`, parsed.dimension);
  const warnings: ModelWarning[] = [];
  return {
    inputs: input,
    warnings,
    dimension: parsed.dimension,
    si: parsed.si,
    siUnit: SI_UNIT[parsed.dimension],
    value: fromSI(parsed.si, unit),
    unit,
    formatted: formatQuantity(parsed.si, unit),
  };
}
