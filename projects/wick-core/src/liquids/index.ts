/**
 * Liquid properties: water from IAPWS and CIPM formulas, a table of common test liquids with their
 * sources, and user-defined liquids (constants or temperature tables).
 */
export {
  iapwsSurfaceTension,
  iapwsViscosity,
  tanakaDensity,
  waterProperties,
  type WaterPropertiesInput,
  type WaterPropertiesResult,
  TANAKA_RANGE,
  WATER_CRITICAL_TEMPERATURE,
  WATER_HARD_RANGE,
  WATER_RANGE,
  WATER_TRIPLE_POINT,
} from './water';
export {
  BUILT_IN_LIQUIDS,
  type BuiltInLiquidInfo,
  FLAMMABLE_CAUTION,
  HANDBOOK_TOLERANCE_K,
  type HandbookValue,
} from './built-in';
export {
  liquidAt,
  type LiquidAtInput,
  type LiquidProperties,
  type LiquidProperty,
  type PropertyDefinition,
  type UserLiquidDefinition,
} from './liquid-at';
export { type TablePoint, checkTable, interpolateTable, type TableLookup } from './interpolate';
export { liquidsModels } from './models';
