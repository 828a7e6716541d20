/** Jurin's law: capillary rise with meniscus correction and tilt, and surface tension from a measured rise. */
export {
  AIR_DENSITY,
  type JurinCommonInput,
  jurinHeight,
  type JurinHeightInput,
  type JurinHeightResult,
  surfaceTensionFromRise,
  type SurfaceTensionFromRiseInput,
  type SurfaceTensionFromRiseResult,
} from './jurin';
export { jurinModels } from './models';
