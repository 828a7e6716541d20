import { formatQuantity, type KeyFigure } from 'wick-core';

/** Display units for result values by SI unit: what an absorbent-product engineer reads them in. */
const DISPLAY: Readonly<Record<string, string>> = {
  m: 'mm',
  s: 's',
  Pa: 'Pa',
  'm^2': 'um^2',
  kg: 'g',
  'kg/s': 'g/s',
  'kg/m^2': 'g/m^2',
  'kg/kg': 'g/g',
  'm^3': 'mL',
  'm^3/m^3': '%',
  '1': '1',
  'N/m': 'mN/m',
  'Pa s': 'mPa s',
  'kg/m^3': 'kg/m^3',
  K: 'degC',
};

/** An SI value as text in its display unit ('—' for null). Radii below a micrometre read in nm. */
export function show(si: number | null | undefined, siUnit: string, significant = 4): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return '—';
  let unit = DISPLAY[siUnit] ?? siUnit;
  if (siUnit === 'm' && si !== 0 && Math.abs(si) < 1e-6) unit = 'nm';
  if (unit === '1') return Number(si.toPrecision(significant)).toString();
  try {
    return formatQuantity(si, unit, significant);
  } catch {
    return `${Number(si.toPrecision(significant))} ${siUnit}`;
  }
}

export function showFigure(f: Pick<KeyFigure, 'value' | 'unit' | 'nullMeans'>): string {
  return f.value === null && f.nullMeans ? f.nullMeans : show(f.value, f.unit);
}

/** A relative change as a signed percentage. */
export function showRelative(r: number | null): string {
  if (r === null || !Number.isFinite(r)) return '';
  // Below round-off of the figures compared (e.g. two runs that differ only in the last bits): no change.
  const pct = Math.abs(r) < 1e-9 ? 0 : r * 100;
  const size = Math.abs(pct);
  const digits = size === 0 ? '0' : size >= 100 ? Math.round(size).toLocaleString('en-GB') : String(Number(size.toPrecision(2)));
  return `${pct > 0 ? '+' : pct < 0 ? '−' : '±'}${digits} %`;
}

/** A row of an input table: numbers in their display unit, text as it is. */
export function showInputValue(v: number | string, siUnit: string): string {
  return typeof v === 'number' ? show(v, siUnit, 5) : v;
}
