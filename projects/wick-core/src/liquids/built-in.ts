import { ZERO_CELSIUS } from '../constants';

/** A handbook value: the number (SI), the temperature it was measured at (K) and where it comes from. */
export interface HandbookValue {
  readonly value: number;
  readonly temperature: number;
  readonly source: string;
}

export type LiquidKind = 'water' | 'aqueous' | 'handbook';

interface BuiltInBase {
  readonly id: string;
  readonly name: string;
  /** Temperatures (K) inside which values are given without a range warning. */
  readonly validRange: { readonly min: number; readonly max: number };
  readonly flammable: boolean;
  /** Remarks always attached to results for this liquid (handling, composition). */
  readonly notes?: readonly { readonly code: string; readonly message: string }[];
}

/** Pure water from the IAPWS/Tanaka correlations. */
export interface WaterEntry extends BuiltInBase {
  readonly kind: 'water';
}

/**
 * A dilute aqueous solution described as water plus corrections: σ = σw(T) + Δσ (or a fixed σ),
 * μ = μw(T)·fμ, ρ = ρw(T)·fρ, the factors taken from values at 20 °C.
 */
export interface AqueousEntry extends BuiltInBase {
  readonly kind: 'aqueous';
  readonly surfaceTensionOffset?: HandbookValue;
  /** A fixed surface tension (e.g. a surfactant-adjusted test liquid's specification). */
  readonly surfaceTensionFixed?: HandbookValue;
  /** Viscosity at `temperature`; the ratio to water at that temperature is kept at other T. */
  readonly viscosity: HandbookValue;
  /** Density at `temperature`; the ratio to water at that temperature is kept at other T. */
  readonly density: HandbookValue;
}

/** A pure liquid with single handbook values near room temperature. */
export interface HandbookEntry extends BuiltInBase {
  readonly kind: 'handbook';
  readonly surfaceTension: HandbookValue;
  readonly viscosity: HandbookValue;
  readonly density: HandbookValue;
}

export type BuiltInEntry = WaterEntry | AqueousEntry | HandbookEntry;

const C = (celsius: number): number => ZERO_CELSIUS + celsius;
const CRC = 'CRC Handbook of Chemistry and Physics';

/**
 * Handbook values are used unchanged within this distance (K) of the temperature they were
 * measured at; beyond it a warning says so. (Surface tensions of organic liquids fall by roughly
 * 0.1 mN/m per kelvin and viscosities by 1–2 % per kelvin — common practice, from memory.)
 */
export const HANDBOOK_TOLERANCE_K = 5;

export const FLAMMABLE_CAUTION =
  'Flammable reference solvent: use small quantities in a fume hood away from ignition sources, follow its ' +
  'safety data sheet and local regulations, and have the procedure reviewed by a qualified person. ' +
  'Results are engineering estimates: confirm them with standard tests.';

/** Built-in liquids. Values in SI: N/m, Pa·s, kg/m³; temperatures in K. */
export const BUILT_IN_ENTRIES: readonly BuiltInEntry[] = [
  {
    id: 'water',
    name: 'Water',
    kind: 'water',
    validRange: { min: C(0), max: C(100) },
    flammable: false,
  },
  {
    id: 'saline-0.9',
    name: '0.9 % NaCl saline',
    kind: 'aqueous',
    validRange: { min: C(15), max: C(40) },
    flammable: false,
    surfaceTensionOffset: {
      value: 0.25e-3,
      temperature: C(20),
      source: 'Approximate: water (IAPWS R1-76(2014)) + 0.25 mN/m for 0.9 % NaCl (from memory; measure for accurate work)',
    },
    viscosity: {
      value: 1.02e-3,
      temperature: C(20),
      source: 'Approximate: 1.02 mPa·s at 20 °C, scaled with water viscosity (IAPWS R12-08) at other temperatures (from memory)',
    },
    density: {
      value: 1004.6,
      temperature: C(20),
      source: 'Approximate: 1.0046 g/cm³ at 20 °C, scaled with water density (Tanaka 2001) at other temperatures (from memory)',
    },
    notes: [
      {
        code: 'approximate-solution',
        message: '0.9 % saline properties are approximate values for 0.154 mol/kg NaCl; measure the batch for accurate work.',
      },
    ],
  },
  {
    id: 'simulated-urine',
    name: 'Simulated urine (9 g/L NaCl, 70 mN/m)',
    kind: 'aqueous',
    validRange: { min: C(15), max: C(40) },
    flammable: false,
    surfaceTensionFixed: {
      value: 70e-3,
      temperature: C(23),
      source: 'Specification target 70 ± 2 mN/m of simulated urine for nonwoven coverstock tests (from memory)',
    },
    viscosity: {
      value: 1.02e-3,
      temperature: C(20),
      source: 'As 0.9 % saline (9 g/L NaCl): ≈1.02 mPa·s at 20 °C (from memory)',
    },
    density: {
      value: 1004.6,
      temperature: C(20),
      source: 'As 0.9 % saline (9 g/L NaCl): ≈1.0046 g/cm³ at 20 °C (from memory)',
    },
    notes: [
      {
        code: 'specified-surface-tension',
        message:
          'Surface tension of simulated urine is a specification (70 ± 2 mN/m, set with a surfactant), not a property: measure each batch.',
      },
    ],
  },
  {
    id: 'n-hexane',
    name: 'n-Hexane',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: true,
    surfaceTension: { value: 17.9e-3, temperature: C(20), source: `${CRC}: 17.9 mN/m at 20 °C` },
    viscosity: { value: 0.3e-3, temperature: C(25), source: `${CRC}: 0.300 mPa·s at 25 °C (from memory)` },
    density: { value: 659.4, temperature: C(20), source: `${CRC}: 0.6594 g/cm³ at 20 °C (from memory)` },
    notes: [
      {
        code: 'health-hazard',
        message: 'n-Hexane is also harmful on repeated exposure (nerve damage): prefer n-heptane where the method allows.',
      },
    ],
  },
  {
    id: 'n-heptane',
    name: 'n-Heptane',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: true,
    surfaceTension: { value: 20.14e-3, temperature: C(20), source: `${CRC}: 20.14 mN/m at 20 °C` },
    viscosity: { value: 0.387e-3, temperature: C(25), source: `${CRC}: 0.387 mPa·s at 25 °C (from memory)` },
    density: { value: 683.7, temperature: C(20), source: `${CRC}: 0.6837 g/cm³ at 20 °C (from memory)` },
  },
  {
    id: 'n-decane',
    name: 'n-Decane',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: true,
    surfaceTension: { value: 23.8e-3, temperature: C(20), source: `${CRC}: 23.8 mN/m at 20 °C` },
    viscosity: { value: 0.838e-3, temperature: C(25), source: `${CRC}: 0.838 mPa·s at 25 °C (from memory)` },
    density: { value: 730.1, temperature: C(20), source: `${CRC}: 0.7301 g/cm³ at 20 °C (from memory)` },
  },
  {
    id: 'ethanol',
    name: 'Ethanol',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: true,
    surfaceTension: {
      value: 22.39e-3,
      temperature: C(20),
      source: 'Adamson & Gast, Physical Chemistry of Surfaces, 6th ed.: 22.39 mN/m at 20 °C',
    },
    viscosity: { value: 1.074e-3, temperature: C(25), source: `${CRC}: 1.074 mPa·s at 25 °C (from memory)` },
    density: { value: 789.3, temperature: C(20), source: `${CRC}: 0.7893 g/cm³ at 20 °C (from memory)` },
    notes: [
      {
        code: 'hygroscopic',
        message: 'Ethanol takes up water from the air, which raises its surface tension: use fresh absolute ethanol.',
      },
    ],
  },
  {
    id: 'glycerol',
    name: 'Glycerol',
    kind: 'handbook',
    validRange: { min: C(15), max: C(25) },
    flammable: false,
    surfaceTension: { value: 63.4e-3, temperature: C(20), source: `${CRC}: 63.4 mN/m at 20 °C (from memory)` },
    viscosity: { value: 1.412, temperature: C(20), source: `${CRC}: 1412 mPa·s at 20 °C (from memory)` },
    density: { value: 1261, temperature: C(20), source: `${CRC}: 1.261 g/cm³ at 20 °C (from memory)` },
    notes: [
      {
        code: 'hygroscopic',
        message:
          'Glycerol is hygroscopic and its viscosity falls steeply with absorbed water and with temperature (about a third lower at 25 °C than at 20 °C): measure it for quantitative work.',
      },
    ],
  },
  {
    id: 'diiodomethane',
    name: 'Diiodomethane',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: false,
    surfaceTension: {
      value: 50.8e-3,
      temperature: C(20),
      source: `${CRC}: 50.8 mN/m at 20 °C (a value of 67.0 mN/m seen in some tables is wrong)`,
    },
    viscosity: { value: 2.6e-3, temperature: C(25), source: `${CRC}: ≈2.6 mPa·s at 25 °C (from memory)` },
    density: { value: 3325, temperature: C(20), source: `${CRC}: 3.325 g/cm³ at 20 °C (from memory)` },
    notes: [
      {
        code: 'hazardous',
        message: 'Diiodomethane is harmful and light-sensitive: handle it per its safety data sheet, in a fume hood.',
      },
    ],
  },
  {
    id: 'ethylene-glycol',
    name: 'Ethylene glycol',
    kind: 'handbook',
    validRange: { min: C(15), max: C(30) },
    flammable: false,
    surfaceTension: { value: 48.0e-3, temperature: C(20), source: `${CRC}: 48.0 mN/m at 20 °C` },
    viscosity: { value: 16.2e-3, temperature: C(25), source: `${CRC}: 16.2 mPa·s at 25 °C` },
    density: { value: 1113, temperature: C(20), source: `${CRC}: 1.113 g/cm³ at 20 °C (from memory)` },
    notes: [
      {
        code: 'hazardous',
        message: 'Ethylene glycol is toxic if swallowed and hygroscopic: handle it per its safety data sheet.',
      },
    ],
  },
];

/** What the UI lists: id, display name, range without warnings (K) and the flammable flag. */
export interface BuiltInLiquidInfo {
  readonly id: string;
  readonly name: string;
  readonly validRange: { readonly min: number; readonly max: number };
  readonly flammable: boolean;
}

export const BUILT_IN_LIQUIDS: readonly BuiltInLiquidInfo[] = BUILT_IN_ENTRIES.map((e) => ({
  id: e.id,
  name: e.name,
  validRange: e.validRange,
  flammable: e.flammable,
}));

const BY_ID = new Map<string, BuiltInEntry>(BUILT_IN_ENTRIES.map((e) => [e.id, e]));

export function builtInEntry(id: string): BuiltInEntry | undefined {
  return BY_ID.get(id);
}
