/**
 * Pore-size models: a layer as a bundle of independent capillaries with a pore-size distribution —
 * equilibrium saturation profile and retention curve, uptake versus time, summary pore sizes.
 */
export {
  cumulativeToDifferential,
  differentialToCumulative,
  preparePoreSizeDistribution,
  type DistributionForm,
  type PoreSizeDistribution,
  type PoreSizeDistributionInput,
} from './distribution';
export {
  capillaryLengthWarning,
  equilibriumSaturationAt,
  jurinHeightForDiameter,
  poreSizeEquilibrium,
  wettingTension,
  type PoreLiquidFields,
  type PoreSizeEquilibriumInput,
  type PoreSizeEquilibriumResult,
  type PsdFields,
} from './equilibrium';
export { poreSizeUptake, type PoreSizeUptakeInput, type PoreSizeUptakeResult } from './uptake';
export { diameterAtFractionFiner, poreSizeStatistics, type PoreSizeStatisticsResult } from './statistics';
export { poreSizeModels } from './models';
