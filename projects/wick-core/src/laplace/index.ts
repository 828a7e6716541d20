/** Young–Laplace pressure jumps: general surface, sphere, bubble, cylinder, tube and slit menisci. */
export {
  type GeneralLaplaceInput,
  type LaplaceResult,
  laplaceBubble,
  laplaceCylinder,
  laplaceSphere,
  type MeniscusResult,
  NANOSCALE_RADIUS,
  type RadiusInput,
  slitMeniscus,
  type SlitMeniscusInput,
  tubeMeniscus,
  type TubeMeniscusInput,
  youngLaplace,
} from './young-laplace';
export { laplaceModels } from './models';
