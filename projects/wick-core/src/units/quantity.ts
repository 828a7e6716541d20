import { DomainError } from '../errors';
import { requireFinite } from '../validate';
import {
  DIMENSION_INFO,
  type Dimension,
  type DimensionInfo,
  dimensionInfo,
  sameVector,
} from './dimensions';
import { math } from './math';

/** A parsed quantity: its SI value, the unit it was typed in (normalised, ASCII) and its dimension. */
export interface ParsedQuantity {
  /** Value in the SI unit of `dimension` (K for temperatures, rad for angles, 0.5 for 50 %). */
  readonly si: number;
  /** Unit as typed, normalised to what `toSI` accepts ('µm' → 'um', '%RH' → '%', '°C' → 'degC'). */
  readonly unit: string;
  readonly dimension: Dimension;
}

/** Affine map to SI: si = (value + offset) · scale. Offset is non-zero only for °C and °F. */
interface UnitEntry {
  readonly unit: string;
  readonly scale: number;
  readonly offset: number;
  readonly vector: readonly number[];
  /** Dimension the unit itself names when its vector is shared (darcy, St, %, g/g). */
  readonly hint?: Dimension;
}

const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-',
};
const TO_SUPERSCRIPT: Record<string, string> = Object.fromEntries(
  Object.entries(SUPERSCRIPTS).map(([k, val]) => [val, k]),
);

/**
 * Rewrites what people type into what mathjs parses: µ/μ → u, °C/℃ → degC, ° → deg,
 * %RH/% → percent, m² → m^2, s⁻¹ → s^-1, mPa·s and mPa.s → mPa s.
 */
function normaliseUnit(text: string): string {
  let s = text.trim();
  if (s === '' || s === '1' || s === '-') return '';
  s = s
    .replace(/[µμ]/g, 'u')
    .replace(/℃|°\s*C\b|\bdeg\s+C\b/g, 'degC')
    .replace(/℉|°\s*F\b|\bdeg\s+F\b/g, 'degF')
    .replace(/°/g, 'deg')
    .replace(/%\s*(RH|rh|r\.h\.)?/g, 'percent')
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]+/g, (run) => '^' + [...run].map((c) => SUPERSCRIPTS[c]).join(''))
    .replace(/[·⋅∙]/g, ' ')
    .replace(/([A-Za-z])\.(?=[A-Za-z])/g, '$1 ')
    .replace(/\s+/g, ' ');
  return s;
}

/** The unit as written back to callers: ASCII, percent shown as %. */
function publicUnit(normalised: string): string {
  return normalised === '' ? '1' : normalised.replace(/\bpercent\b/g, '%');
}

/**
 * What mathjs 15 returns at run time for a parsed unit. Its typings declare `prefix` as a string,
 * but the runtime value is the prefix object, and `value`/`offset` may be Fractions (°F).
 */
interface RuntimeUnit {
  readonly value: number | null;
  readonly dimensions: readonly number[];
  readonly units: ReadonlyArray<{
    readonly power: number;
    readonly prefix: { readonly name: string; readonly value: number };
    readonly unit: { readonly name: string; readonly value: unknown; readonly offset: unknown; readonly base: { readonly key: string } };
  }>;
  toSI(): { readonly value: unknown };
}

function parseUnit(text: string): RuntimeUnit {
  return math.unit(text) as unknown as RuntimeUnit;
}

const MAX_CACHE = 512;
const ZERO_VECTOR: readonly number[] = [0, 0, 0, 0, 0, 0, 0, 0, 0];
const cache = new Map<string, UnitEntry>();
/** The same entries by the text as written, so that a repeated unit skips even the normalisation (live results format dozens of values per keystroke). */
const textCache = new Map<string, UnitEntry>();

function isUnknownUnitMessage(message: string): boolean {
  return /not found/i.test(message);
}

/** Parses a bare unit string once and caches its affine map to SI. */
function unitEntry(unitText: string, original: string): UnitEntry {
  const seen = textCache.get(unitText);
  if (seen) return seen;
  const key = normaliseUnit(unitText);
  const hit = cache.get(key);
  if (hit) return remember(unitText, hit);

  let entry: UnitEntry;
  if (key === '') {
    entry = { unit: '1', scale: 1, offset: 0, vector: ZERO_VECTOR };
  } else {
    let u: RuntimeUnit;
    try {
      u = parseUnit(key);
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      if (isUnknownUnitMessage(message)) {
        throw new DomainError('unknown-unit', `Unknown unit in "${original}": ${message.replace(/^Unit /, 'unit ')}`, undefined, {
          unit: unitText,
        });
      }
      throw new DomainError('unparsable', `Cannot read "${original}" as a quantity with a unit, e.g. 12 µm.`, undefined, {
        unit: unitText,
      });
    }
    // '1/s' parses as the quantity 1 s⁻¹; any other number in the unit part ("12 m 3") is an error.
    const reciprocal = /^1\s*\//.test(key);
    if (u.value !== null && !reciprocal) {
      throw new DomainError('unparsable', `Cannot read "${original}" as a quantity with a unit, e.g. 12 µm.`);
    }
    const parts = u.units;
    const single = parts.length === 1 && parts[0].power === 1 ? parts[0] : undefined;
    const offset = single ? Number(single.unit.offset) : 0;
    let scale: number;
    if (offset !== 0 && single) {
      // Offset units (°C, °F): read the definition rather than subtract two SI values, so
      // 25 °C is exactly 25 + 273.15 K.
      scale = Number(single.unit.value) * Number(single.prefix.value);
    } else {
      scale = Number((reciprocal ? u : (math.unit(1, key) as unknown as RuntimeUnit)).toSI().value);
    }
    const names = parts.map((p) => p.unit.name);
    let hint: Dimension | undefined;
    if (names.includes('darcy') || names.includes('D')) hint = 'permeability';
    else if (names.includes('St') || names.includes('stokes')) hint = 'kinematicViscosity';
    else if (names.includes('percent')) hint = 'fraction';
    else if (sameVector(u.dimensions, []) && parts.some((p) => p.unit.base.key === 'MASS')) hint = 'massPerMass';
    entry = { unit: publicUnit(key), scale, offset, vector: [...u.dimensions], hint };
  }
  if (!Number.isFinite(entry.scale) || entry.scale === 0) {
    throw new DomainError('unparsable', `Cannot use "${original}" as a unit.`);
  }
  if (cache.size >= MAX_CACHE) cache.clear();
  cache.set(key, entry);
  return remember(unitText, entry);
}

function remember(unitText: string, entry: UnitEntry): UnitEntry {
  if (textCache.size >= MAX_CACHE) textCache.clear();
  textCache.set(unitText, entry);
  return entry;
}

function matchesDimension(entry: UnitEntry, dimension: Dimension): boolean {
  const info = dimensionInfo(dimension);
  return sameVector(entry.vector, info.vector);
}

/** Which dimension a unit denotes when the caller did not say. */
function inferDimension(entry: UnitEntry): DimensionInfo | undefined {
  if (entry.hint) return dimensionInfo(entry.hint);
  return DIMENSION_INFO.find((d) => sameVector(entry.vector, d.vector));
}

function wrongDimension(text: string, expected: Dimension, got?: DimensionInfo): DomainError {
  const info = dimensionInfo(expected);
  const gotText = got ? ` (that is ${got.words})` : '';
  return new DomainError(
    'wrong-dimension',
    `"${text}"${gotText} does not fit here: expected ${info.words}, e.g. ${info.example}.`,
    undefined,
    { expected, got: got?.dimension },
  );
}

function resolve(entry: UnitEntry, text: string, expected?: Dimension): Dimension {
  if (expected !== undefined) {
    if (!matchesDimension(entry, expected)) throw wrongDimension(text, expected, inferDimension(entry));
    return expected;
  }
  const inferred = inferDimension(entry);
  if (!inferred) {
    throw new DomainError(
      'wrong-dimension',
      `"${text}" is not a kind of quantity Wickwright uses (its unit is ${entry.unit}).`,
      undefined,
      { unit: entry.unit },
    );
  }
  return inferred.dimension;
}

// Number, optionally "× 10^n" or "x10^n", then the unit.
const QUANTITY_RE =
  /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)(?:\s*[x×*]\s*10\s*\^?\s*([+-]?\d+))?\s*(.*?)\s*$/;

/**
 * Reads a quantity typed by a person and converts it to SI.
 *
 * Accepts a number and a unit, with or without a space: '12 µm', '12um', '12 micron', '1.7 dtex',
 * '3 denier', '45 gsm', '45 g/m²', '72.8 mN/m', '1.0 mPa·s', '1 cP', '25 °C' (→ 298.15 K),
 * '50 %RH' (→ 0.5), '30°' or '30 deg' (→ rad), '2 darcy', '1e-11 m^2', '1.2×10^-5 m'.
 * A bare number is a pure number (dimensionless, fraction or mass ratio only).
 *
 * @param text What was typed.
 * @param expected Dimension the field needs; the SI value is then in `SI_UNIT[expected]`, and a
 *   unit of another kind is refused.
 * @throws DomainError 'wrong-dimension' (message: "expected a length, e.g. 12 µm"),
 *   'unknown-unit', 'unparsable' or 'not-finite'.
 */
export function parseQuantity(text: string, expected?: Dimension): ParsedQuantity {
  if (typeof text !== 'string') {
    throw new DomainError('unparsable', `Expected a quantity as text, e.g. 12 µm (got ${typeof text}).`);
  }
  const cleaned = text.replace(/−/g, '-').replace(/\u00a0|\u202f/g, ' ');
  const m = QUANTITY_RE.exec(cleaned);
  if (!m) {
    const example = expected ? dimensionInfo(expected).example : '12 µm';
    throw new DomainError('unparsable', `Cannot read "${text}" as a number with a unit, e.g. ${example}.`);
  }
  let value = Number(m[1]);
  if (m[2] !== undefined) value *= 10 ** Number(m[2]);
  requireFinite('value', value);
  const entry = unitEntry(m[3], text);
  const dimension = resolve(entry, text, expected);
  const si = (value + entry.offset) * entry.scale;
  requireFinite('value', si);
  return { si, unit: entry.unit, dimension };
}

/**
 * Converts `value` given in `unit` to SI: si = (value + offset) · scale (offset only for °C, °F).
 *
 * @param expected When given, `unit` must be of this dimension (else DomainError 'wrong-dimension').
 * @throws DomainError 'not-finite', 'unknown-unit', 'unparsable', 'wrong-dimension'.
 */
export function toSI(value: number, unit: string, expected?: Dimension): number {
  requireFinite('value', value);
  const entry = unitEntry(unit, unit);
  if (expected !== undefined) resolve(entry, `${value} ${unit}`, expected);
  return requireFinite('value', (value + entry.offset) * entry.scale);
}

/** Converts an SI value to `unit` (the inverse of {@link toSI}). */
export function fromSI(si: number, unit: string): number {
  requireFinite('value', si);
  const entry = unitEntry(unit, unit);
  return requireFinite('value', si / entry.scale - entry.offset);
}

/** The dimension a unit denotes on its own (e.g. 'um' → 'length', 'darcy' → 'permeability'). */
export function unitDimension(unit: string): Dimension {
  return resolve(unitEntry(unit, unit), unit);
}

/** True when `unit` can hold a quantity of `dimension` (m² fits both area and permeability). */
export function unitFits(unit: string, dimension: Dimension): boolean {
  try {
    return matchesDimension(unitEntry(unit, unit), dimension);
  } catch (e) {
    if (e instanceof DomainError) return false;
    throw e;
  }
}

const labelCache = new Map<string, string>();

function prettyToken(token: string): string {
  switch (token) {
    case 'degC':
      return '°C';
    case 'degF':
      return '°F';
    case 'deg':
      return '°';
    case 'percent':
      return '%';
    case 'um':
      return 'µm';
    default:
      break;
  }
  try {
    const u = parseUnit(token);
    const p = u.units[0];
    if (u.units.length === 1 && p.prefix.name === 'u' && token === 'u' + p.unit.name) return 'µ' + p.unit.name;
  } catch {
    // Not a unit by itself (should not happen after the entry was parsed): keep as typed.
  }
  return token;
}

/**
 * Display text for a unit: µ for micro, °C, °, %, superscript powers and a middle dot for products
 * ('um' → 'µm', 'g/m^2' → 'g/m²', 'mPa s' → 'mPa·s', 'degC' → '°C').
 */
export function unitLabel(unit: string): string {
  const entry = unitEntry(unit, unit);
  const cached = labelCache.get(entry.unit);
  if (cached !== undefined) return cached;
  const norm = normaliseUnit(entry.unit);
  let label: string;
  if (norm === '') {
    label = '';
  } else {
    label = norm
      .replace(/[A-Za-z_][A-Za-z_0-9]*/g, (t) => prettyToken(t))
      .replace(/\s*([/^()*])\s*/g, '$1')
      .replace(/\^\(?(-?\d+)\)?(?![\d.])/g, (_m, p: string) => [...p].map((c) => TO_SUPERSCRIPT[c] ?? c).join(''))
      .replace(/[*\s]+/g, '·');
  }
  if (labelCache.size >= MAX_CACHE) labelCache.clear();
  labelCache.set(entry.unit, label);
  return label;
}

/**
 * Writes an SI value in `unit` with `significant` significant digits (trailing zeros dropped,
 * exponent form outside 1e-3 … 1e5), e.g. formatQuantity(1.2e-5, 'um') → '12 µm',
 * formatQuantity(298.15, 'degC') → '25 °C', formatQuantity(0.5236, 'deg') → '30°'.
 */
export function formatQuantity(si: number, unit: string, significant = 4): string {
  const value = fromSI(si, unit);
  const digits = Math.min(17, Math.max(1, Math.round(significant)));
  let text = math.format(value, { precision: digits }) as string;
  if (/^-0(\.0*)?$/.test(text)) text = '0';
  const label = unitLabel(unit);
  if (label === '') return text;
  if (label === '°') return text + label;
  return `${text} ${label}`;
}

/** For tests and long-running servers: forget cached unit parses. */
export function clearUnitCache(): void {
  cache.clear();
  textCache.clear();
  labelCache.clear();
}
