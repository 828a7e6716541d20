import type { ValidatorFn } from '@angular/forms';
import { formatQuantity } from 'wick-core';
import type { Quantity } from './unit-input';

/**
 * The SI value must lie in [min, max] (or an open end with `exclusive`); the message uses the unit the person
 * typed in. Empty values pass (combine with `Validators.required`).
 */
export function quantityRange(min: number, max: number, exclusive: { min?: boolean; max?: boolean } = {}): ValidatorFn {
  return (control) => {
    const q = control.value as Quantity | null;
    if (!q) return null;
    const low = exclusive.min ? q.si <= min : q.si < min;
    const high = exclusive.max ? q.si >= max : q.si > max;
    if (!low && !high) return null;
    const show = (si: number) => {
      try {
        return formatQuantity(si, q.unit, 3);
      } catch {
        return String(si);
      }
    };
    const message = low
      ? `Must be ${exclusive.min ? 'more than' : 'at least'} ${show(min)}.`
      : `Must be ${exclusive.max ? 'less than' : 'at most'} ${show(max)}.`;
    return { range: { message } };
  };
}
