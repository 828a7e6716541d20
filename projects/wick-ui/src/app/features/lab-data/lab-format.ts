import { type CurveMeasurement, formatQuantity, RUN_ORIENTATION_LABELS, type RunOrientation } from 'wick-core';

/** Display units of the lab-data screens (SI inside; these only at the edge). */
export const LAB_UNITS = {
  height: { value: 'mm', slope: 'mm^2/s', a: 'mm^2/s', b: 'mm/s' },
  mass: { value: 'g', slope: 'g^2/s', a: 'g^2/s', b: 'g/s' },
} as const satisfies Record<CurveMeasurement, Record<string, string>>;

/** The display unit of an SI unit string the server uses for fitted figures. */
export function displayUnit(siUnit: string): string {
  const map: Record<string, string> = {
    m: 'mm',
    kg: 'g',
    'm^2/s': 'mm^2/s',
    'kg^2/s': 'g^2/s',
    'm/s': 'mm/s',
    'kg/s': 'g/s',
    'm^2': 'um^2',
    Pa: 'Pa',
  };
  return map[siUnit] ?? siUnit;
}

/** An SI value in `unit`, or "—". */
export function show(si: number | null | undefined, unit: string, digits = 3): string {
  return si === null || si === undefined || !Number.isFinite(si) ? '—' : formatQuantity(si, unit, digits);
}

/** A value with its 95 % interval: "32.6 mm (95 %: 31.9 … 33.3)". */
export function withInterval(e: { value: number; ci95: readonly number[] } | null | undefined, unit: string, digits = 3): string {
  if (!e) return '—';
  return `${formatQuantity(e.value, unit, digits)} (95 %: ${formatQuantity(e.ci95[0], unit, digits)} … ${formatQuantity(e.ci95[1], unit, digits)})`;
}

/** A value ± its standard error. */
export function withError(e: { value: number; stdError: number } | null | undefined, unit: string, digits = 3): string {
  if (!e) return '—';
  return `${formatQuantity(e.value, unit, digits)} ± ${formatQuantity(e.stdError, unit, 2)}`;
}

export function orientationLabel(o: RunOrientation): string {
  return RUN_ORIENTATION_LABELS[o];
}

export function celsius(kelvin: number): string {
  return formatQuantity(kelvin, 'degC', 3);
}
