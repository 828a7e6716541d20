/**
 * Units at the edges: parse what people type, convert to SI, format SI values for display.
 * The mathjs instance behind it is private to this folder.
 */
export {
  type Dimension,
  type DimensionInfo,
  DIMENSIONS,
  DIMENSION_INFO,
  DISPLAY_UNITS,
  PURE_NUMBER_DIMENSIONS,
  SI_UNIT,
  dimensionInfo,
} from './dimensions';
export {
  type ParsedQuantity,
  clearUnitCache,
  formatQuantity,
  fromSI,
  parseQuantity,
  toSI,
  unitDimension,
  unitFits,
  unitLabel,
} from './quantity';
export { DARCY_M2 } from './math';
export { unitsModels } from './models';
export { convertQuantity, type ConvertQuantityInput, type ConvertQuantityResult } from './convert';
