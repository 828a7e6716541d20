/** Kelvin equation: vapour pressure over droplets and pore menisci, and the Kelvin radius. */
export {
  KELVIN_NANOSCALE,
  kelvinDroplet,
  type KelvinDropletInput,
  type KelvinLiquid,
  kelvinMeniscus,
  type KelvinMeniscusInput,
  kelvinRadius,
  type KelvinRadiusInput,
  type KelvinRadiusResult,
  type KelvinRatioResult,
} from './kelvin';
export { kelvinModels } from './models';
