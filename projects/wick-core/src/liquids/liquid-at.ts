import type { ResultBase } from '../api/model-spec';
import { ZERO_CELSIUS } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requirePositive } from '../validate';
import {
  type BuiltInEntry,
  builtInEntry,
  BUILT_IN_ENTRIES,
  FLAMMABLE_CAUTION,
  HANDBOOK_TOLERANCE_K,
  type HandbookValue,
} from './built-in';
import { checkTable, interpolateTable, type TablePoint } from './interpolate';
import { iapwsViscosity, tanakaDensity, waterProperties } from './water';

/** A property given by the user: one constant (SI) or a table over temperature (K → SI value). */
export type PropertyDefinition = number | readonly TablePoint[];

/** A liquid the user describes. Values in SI: N/m, Pa·s, kg/m³; table temperatures in K. */
export interface UserLiquidDefinition {
  readonly id?: string;
  readonly name: string;
  readonly surfaceTension: PropertyDefinition;
  readonly viscosity: PropertyDefinition;
  readonly density: PropertyDefinition;
  /** Where each value comes from (shown beside the numbers); "user input" when omitted. */
  readonly sources?: Partial<Record<LiquidProperty, string>>;
  readonly flammable?: boolean;
}

export type LiquidProperty = 'surfaceTension' | 'viscosity' | 'density';

export interface LiquidAtInput {
  readonly liquid: string | UserLiquidDefinition;
  /** K */
  readonly temperature: number;
}

/** Properties of a liquid at one temperature, with where each came from and any validity remarks. */
export interface LiquidProperties extends ResultBase<LiquidAtInput> {
  readonly id: string;
  readonly name: string;
  /** K */
  readonly temperature: number;
  /** N/m */
  readonly surfaceTension: number;
  /** Pa·s */
  readonly viscosity: number;
  /** kg/m³ */
  readonly density: number;
  readonly sources: Readonly<Record<LiquidProperty, string>>;
  readonly flammable?: boolean;
}

const PROPERTY_WORDS: Record<LiquidProperty, string> = {
  surfaceTension: 'surface tension',
  viscosity: 'viscosity',
  density: 'density',
};

const celsius = (k: number): string => `${(k - ZERO_CELSIUS).toFixed(1)} °C`;

function handbook(
  v: HandbookValue,
  property: LiquidProperty,
  name: string,
  T: number,
  warnings: ModelWarning[],
): number {
  if (Math.abs(T - v.temperature) > HANDBOOK_TOLERANCE_K) {
    warnings.push({
      code: 'handbook-temperature',
      message: `The ${name} ${PROPERTY_WORDS[property]} is a handbook value at ${celsius(v.temperature)}, used unchanged at ${celsius(T)}.`,
    });
  }
  return v.value;
}

function rangeWarning(entry: BuiltInEntry, T: number, warnings: ModelWarning[]): void {
  const { min, max } = entry.validRange;
  if (T < min || T > max) {
    warnings.push({
      code: 'outside-range',
      message: `${entry.name} values are meant for ${celsius(min)} to ${celsius(max)}; ${celsius(T)} is outside.`,
    });
  }
}

function builtIn(entry: BuiltInEntry, T: number, input: LiquidAtInput): LiquidProperties {
  const warnings: ModelWarning[] = [];
  let surfaceTension: number;
  let viscosity: number;
  let density: number;
  let sources: Record<LiquidProperty, string>;

  switch (entry.kind) {
    case 'water': {
      const w = waterProperties({ temperature: T });
      warnings.push(...w.warnings);
      surfaceTension = w.surfaceTension;
      viscosity = w.viscosity;
      density = w.density;
      sources = {
        surfaceTension: 'IAPWS R1-76(2014)',
        viscosity: 'IAPWS R12-08 (Huber et al. 2009), critical enhancement omitted',
        density: 'Tanaka et al., Metrologia 38 (2001) 301 (0–40 °C)',
      };
      break;
    }
    case 'aqueous': {
      const w = waterProperties({ temperature: T });
      warnings.push(...w.warnings);
      if (entry.surfaceTensionFixed) {
        surfaceTension = handbook(entry.surfaceTensionFixed, 'surfaceTension', entry.name, T, warnings);
      } else {
        surfaceTension = w.surfaceTension + (entry.surfaceTensionOffset?.value ?? 0);
      }
      // Keep the solution/water ratio measured at the reference temperature.
      const tv = entry.viscosity.temperature;
      viscosity = w.viscosity * (entry.viscosity.value / iapwsViscosity(tv, tanakaDensity(tv)));
      density = w.density * (entry.density.value / tanakaDensity(entry.density.temperature));
      sources = {
        surfaceTension: (entry.surfaceTensionFixed ?? entry.surfaceTensionOffset)?.source ?? 'IAPWS R1-76(2014)',
        viscosity: entry.viscosity.source,
        density: entry.density.source,
      };
      break;
    }
    case 'handbook':
      surfaceTension = handbook(entry.surfaceTension, 'surfaceTension', entry.name, T, warnings);
      viscosity = handbook(entry.viscosity, 'viscosity', entry.name, T, warnings);
      density = handbook(entry.density, 'density', entry.name, T, warnings);
      sources = {
        surfaceTension: entry.surfaceTension.source,
        viscosity: entry.viscosity.source,
        density: entry.density.source,
      };
      break;
  }
  rangeWarning(entry, T, warnings);
  if (entry.notes) warnings.push(...entry.notes);
  if (entry.flammable) warnings.push({ code: 'flammable', message: FLAMMABLE_CAUTION });
  return {
    inputs: input,
    warnings,
    id: entry.id,
    name: entry.name,
    temperature: T,
    surfaceTension,
    viscosity,
    density,
    sources,
    flammable: entry.flammable,
  };
}

function userProperty(
  def: PropertyDefinition,
  property: LiquidProperty,
  name: string,
  T: number,
  warnings: ModelWarning[],
): number {
  if (typeof def === 'number') return requirePositive(property, def);
  const table = checkTable(property, def);
  const hit = interpolateTable(table, T);
  if (hit.clampedTo) {
    const end = hit.clampedTo === 'min' ? hit.range.min : hit.range.max;
    warnings.push({
      code: 'table-clamped',
      message: `${celsius(T)} lies outside the ${name} ${PROPERTY_WORDS[property]} table (${celsius(hit.range.min)} to ${celsius(hit.range.max)}): the value at ${celsius(end)} is used.`,
    });
  }
  return hit.value;
}

function userLiquid(def: UserLiquidDefinition, T: number, input: LiquidAtInput): LiquidProperties {
  if (typeof def !== 'object' || def === null || typeof def.name !== 'string' || def.name.trim() === '') {
    throw new DomainError('invalid-input', 'A user liquid needs a name and its surface tension, viscosity and density.', 'liquid');
  }
  const warnings: ModelWarning[] = [];
  const surfaceTension = userProperty(def.surfaceTension, 'surfaceTension', def.name, T, warnings);
  const viscosity = userProperty(def.viscosity, 'viscosity', def.name, T, warnings);
  const density = userProperty(def.density, 'density', def.name, T, warnings);
  if (def.flammable) warnings.push({ code: 'flammable', message: FLAMMABLE_CAUTION });
  const s = def.sources ?? {};
  return {
    inputs: input,
    warnings,
    id: def.id ?? 'user',
    name: def.name,
    temperature: T,
    surfaceTension,
    viscosity,
    density,
    sources: {
      surfaceTension: s.surfaceTension ?? 'user input',
      viscosity: s.viscosity ?? 'user input',
      density: s.density ?? 'user input',
    },
    flammable: def.flammable,
  };
}

/**
 * Surface tension (N/m), viscosity (Pa·s) and density (kg/m³) of a built-in or user-defined liquid
 * at temperature T (K).
 *
 * - Water: IAPWS R1-76(2014), IAPWS R12-08 (μ̄2 = 1), Tanaka et al. (2001); see {@link waterProperties}.
 * - Aqueous test liquids: water at T plus a surface-tension offset (or a specified value), viscosity
 *   and density scaled with water by their ratio at 20 °C.
 * - Handbook liquids: single values near room temperature, each with its source; used unchanged
 *   within ±5 K of their temperature, with a warning beyond.
 * - User liquids: constants, or tables over temperature interpolated linearly; outside a table the
 *   end value is used with a warning.
 *
 * Flammable liquids carry a caution; results are engineering estimates.
 *
 * @throws DomainError 'unknown-liquid' for an unknown id, guards' errors for invalid values.
 */
export function liquidAt(idOrDefinition: string | UserLiquidDefinition, temperatureK: number): LiquidProperties {
  const T = requirePositive('temperature', temperatureK);
  const input: LiquidAtInput = { liquid: idOrDefinition, temperature: T };
  if (typeof idOrDefinition === 'string') {
    const entry = builtInEntry(idOrDefinition);
    if (!entry) {
      const known = BUILT_IN_ENTRIES.map((e) => e.id).join(', ');
      throw new DomainError('unknown-liquid', `Unknown liquid "${idOrDefinition}". Built-in liquids: ${known}.`, 'liquid');
    }
    return builtIn(entry, T, input);
  }
  return userLiquid(idOrDefinition, T, input);
}
