/**
 * The physical quantities Wickwright reads and writes, with their SI unit, the words used in
 * messages and the units the UI offers for display.
 *
 * A dimension is identified by its exponent vector over mathjs' base quantities
 * [mass, length, time, current, temperature, luminous intensity, amount, angle, bit].
 * Several names share a vector (area and permeability, diffusivity and kinematic viscosity,
 * the dimensionless trio): the caller's `expected` dimension, or a unit hint (darcy → permeability,
 * St → kinematic viscosity, % → fraction, g/g → mass per mass), picks between them.
 */

/** Quantities known to the units module. SI unit in brackets. */
export type Dimension =
  /** [m] */
  | 'length'
  /** [m²] */
  | 'area'
  /** [m³] */
  | 'volume'
  /** [kg] */
  | 'mass'
  /** [s] */
  | 'time'
  /** [K] absolute temperature; °C and °F are converted with their offsets. */
  | 'temperature'
  /** [rad] plane angle. */
  | 'angle'
  /** [N/m] surface tension or surface energy. */
  | 'surfaceTension'
  /** [Pa·s] dynamic viscosity. */
  | 'viscosity'
  /** [m²/s] kinematic viscosity (St, cSt). */
  | 'kinematicViscosity'
  /** [kg/m³] */
  | 'density'
  /** [kg/m²] areal mass of a web or sheet (gsm). */
  | 'basisWeight'
  /** [kg/m] fibre linear density (tex, dtex, denier). */
  | 'linearDensity'
  /** [Pa] */
  | 'pressure'
  /** [m²] Darcy permeability. */
  | 'permeability'
  /** [kg/(m²·s)] mass flow per area. */
  | 'massFlux'
  /** [kg/s] */
  | 'massFlowRate'
  /** [m³/s] */
  | 'volumeFlowRate'
  /** [m/s] */
  | 'velocity'
  /** [m/s^½] Lucas–Washburn slope h/√t. */
  | 'sorptivity'
  /** [1/s] */
  | 'frequency'
  /** [1] a fraction of a whole: porosity, saturation, relative humidity (50 % → 0.5). */
  | 'fraction'
  /** [1] any other pure number. */
  | 'dimensionless'
  /** [m²/kg] specific surface area per mass. */
  | 'specificArea'
  /** [m²/s] */
  | 'diffusivity'
  /** [kg/kg] absorptive capacity, g of liquid per g of material. */
  | 'massPerMass'
  /** [kg/mol] */
  | 'molarMass'
  /** [m³/mol] */
  | 'molarVolume';

export interface DimensionInfo {
  readonly dimension: Dimension;
  /** Exponents over [M, L, T, I, Θ, J, N, angle, bit]. */
  readonly vector: readonly number[];
  /** SI unit as the units module parses it. */
  readonly si: string;
  /** Words for messages: "a length". */
  readonly words: string;
  /** Example input for messages: "12 µm". */
  readonly example: string;
  /** Units offered by the UI, most common first; each is accepted by `toSI`. */
  readonly display: readonly string[];
}

const v = (m = 0, l = 0, t = 0, n = 0, theta = 0, angle = 0): readonly number[] => [m, l, t, 0, theta, 0, n, angle, 0];

/**
 * Table order matters: when a vector is shared and nothing else decides, the first entry wins
 * (area before permeability, diffusivity before kinematic viscosity, dimensionless first).
 */
export const DIMENSION_INFO: readonly DimensionInfo[] = [
  { dimension: 'length', vector: v(0, 1), si: 'm', words: 'a length', example: '12 µm', display: ['um', 'mm', 'cm', 'm', 'nm'] },
  { dimension: 'area', vector: v(0, 2), si: 'm^2', words: 'an area', example: '25 cm^2', display: ['mm^2', 'cm^2', 'm^2'] },
  { dimension: 'volume', vector: v(0, 3), si: 'm^3', words: 'a volume', example: '10 mL', display: ['uL', 'mL', 'L', 'cm^3', 'm^3'] },
  { dimension: 'mass', vector: v(1), si: 'kg', words: 'a mass', example: '2.5 g', display: ['mg', 'g', 'kg'] },
  { dimension: 'time', vector: v(0, 0, 1), si: 's', words: 'a time', example: '30 s', display: ['ms', 's', 'min', 'h'] },
  { dimension: 'temperature', vector: v(0, 0, 0, 0, 1), si: 'K', words: 'a temperature', example: '25 °C', display: ['degC', 'K', 'degF'] },
  { dimension: 'angle', vector: v(0, 0, 0, 0, 0, 1), si: 'rad', words: 'an angle', example: '30 deg', display: ['deg', 'rad'] },
  { dimension: 'surfaceTension', vector: v(1, 0, -2), si: 'N/m', words: 'a surface tension', example: '72.8 mN/m', display: ['mN/m', 'N/m', 'dyn/cm'] },
  { dimension: 'viscosity', vector: v(1, -1, -1), si: 'Pa s', words: 'a dynamic viscosity', example: '1.0 mPa s', display: ['mPa s', 'cP', 'Pa s'] },
  { dimension: 'density', vector: v(1, -3), si: 'kg/m^3', words: 'a density', example: '998 kg/m^3', display: ['kg/m^3', 'g/cm^3'] },
  { dimension: 'basisWeight', vector: v(1, -2), si: 'kg/m^2', words: 'a basis weight', example: '45 g/m^2', display: ['g/m^2', 'kg/m^2'] },
  { dimension: 'linearDensity', vector: v(1, -1), si: 'kg/m', words: 'a linear density', example: '1.7 dtex', display: ['dtex', 'denier', 'tex', 'kg/m'] },
  { dimension: 'pressure', vector: v(1, -1, -2), si: 'Pa', words: 'a pressure', example: '0.5 kPa', display: ['Pa', 'kPa', 'mbar', 'cmH2O', 'psi'] },
  { dimension: 'permeability', vector: v(0, 2), si: 'm^2', words: 'a permeability', example: '2 darcy', display: ['m^2', 'um^2', 'darcy'] },
  { dimension: 'massFlux', vector: v(1, -2, -1), si: 'kg/(m^2 s)', words: 'a mass flux', example: '5 g/(m^2 s)', display: ['g/(m^2 s)', 'kg/(m^2 s)'] },
  { dimension: 'massFlowRate', vector: v(1, 0, -1), si: 'kg/s', words: 'a mass flow rate', example: '0.5 g/s', display: ['g/s', 'g/min', 'kg/s'] },
  { dimension: 'volumeFlowRate', vector: v(0, 3, -1), si: 'm^3/s', words: 'a volume flow rate', example: '7 mL/s', display: ['mL/s', 'mL/min', 'L/min', 'm^3/s'] },
  { dimension: 'velocity', vector: v(0, 1, -1), si: 'm/s', words: 'a velocity', example: '2 mm/s', display: ['mm/s', 'mm/min', 'm/s'] },
  { dimension: 'sorptivity', vector: v(0, 1, -0.5), si: 'm/s^0.5', words: 'a Washburn slope (length per square root of time)', example: '3 mm/s^0.5', display: ['mm/s^0.5', 'm/s^0.5'] },
  { dimension: 'frequency', vector: v(0, 0, -1), si: '1/s', words: 'a rate per time', example: '0.1 1/s', display: ['1/s', '1/min', 'Hz'] },
  { dimension: 'dimensionless', vector: v(), si: '1', words: 'a pure number', example: '0.5', display: ['1'] },
  { dimension: 'fraction', vector: v(), si: '1', words: 'a fraction', example: '50 %', display: ['%', '1'] },
  { dimension: 'massPerMass', vector: v(), si: 'kg/kg', words: 'a mass ratio', example: '12 g/g', display: ['g/g'] },
  { dimension: 'specificArea', vector: v(-1, 2), si: 'm^2/kg', words: 'a specific surface area', example: '0.5 m^2/g', display: ['m^2/g', 'm^2/kg'] },
  { dimension: 'diffusivity', vector: v(0, 2, -1), si: 'm^2/s', words: 'a diffusivity', example: '1e-9 m^2/s', display: ['m^2/s', 'mm^2/s', 'cm^2/s'] },
  { dimension: 'kinematicViscosity', vector: v(0, 2, -1), si: 'm^2/s', words: 'a kinematic viscosity', example: '1 cSt', display: ['cSt', 'mm^2/s', 'm^2/s'] },
  { dimension: 'molarMass', vector: v(1, 0, 0, -1), si: 'kg/mol', words: 'a molar mass', example: '18.015 g/mol', display: ['g/mol', 'kg/mol'] },
  { dimension: 'molarVolume', vector: v(0, 3, 0, -1), si: 'm^3/mol', words: 'a molar volume', example: '18.07 cm^3/mol', display: ['cm^3/mol', 'm^3/mol'] },
];

const BY_NAME = new Map<Dimension, DimensionInfo>(DIMENSION_INFO.map((d) => [d.dimension, d]));

/** Every dimension name, in table order. */
export const DIMENSIONS: readonly Dimension[] = DIMENSION_INFO.map((d) => d.dimension);

export function dimensionInfo(dimension: Dimension): DimensionInfo {
  const info = BY_NAME.get(dimension);
  if (!info) throw new Error(`unknown dimension ${String(dimension)}`);
  return info;
}

function record<T>(pick: (d: DimensionInfo) => T): Record<Dimension, T> {
  const out = {} as Record<Dimension, T>;
  for (const d of DIMENSION_INFO) out[d.dimension] = pick(d);
  return out;
}

/** SI unit of each dimension, as `toSI`/`fromSI` accept it ('1' for pure numbers). */
export const SI_UNIT: Readonly<Record<Dimension, string>> = record((d) => d.si);

/**
 * Units the UI suggests for each dimension, most common first. ASCII, as `toSI` accepts them;
 * `unitLabel` turns them into display text (um → µm, degC → °C, g/m^2 → g/m²).
 */
export const DISPLAY_UNITS: Readonly<Record<Dimension, readonly string[]>> = record((d) => d.display);

/** Dimensions whose vector is all zeros (told apart only by hints or by `expected`). */
export const PURE_NUMBER_DIMENSIONS: readonly Dimension[] = ['dimensionless', 'fraction', 'massPerMass'];

export function sameVector(a: readonly number[], b: readonly number[]): boolean {
  for (let i = 0; i < a.length; i++) {
    if (Math.abs(a[i] - (b[i] ?? 0)) > 1e-12) return false;
  }
  return true;
}
