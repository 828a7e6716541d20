/**
 * Tolerance analysis: seeded Monte Carlo propagation of input tolerances (scalar outputs and
 * curves), one-at-a-time tornado ranking, and ready-made capillary studies.
 */
export { createRng, splitMix64, xoshiro128ss, type Rng } from './prng';
export { normalCdf, normalPdf, normalQuantile } from './normal';
export {
  prepareTolerance,
  type NormalTolerance,
  type PreparedTolerance,
  type Tolerance,
  type TriangularTolerance,
  type UniformTolerance,
} from './distributions';
export {
  meanSd,
  percentileSelect,
  percentileSorted,
  summarize,
  summarizeBySelection,
  summarizeInPlace,
  type SampleStatistics,
} from './statistics';
export {
  monteCarlo,
  monteCarloCurve,
  type CurveModel,
  type MonteCarloCurveResult,
  type MonteCarloFailures,
  type MonteCarloInputs,
  type MonteCarloOptions,
  type MonteCarloResult,
  type ScalarModel,
} from './monte-carlo';
export { tornado, type TornadoBar, type TornadoInputs, type TornadoResult } from './sensitivity';
export {
  heightCurveModel,
  timeToHeightModel,
  timeToHeightTolerance,
  uptakeBand,
  withPhysicalBounds,
  type CapillaryInput,
  type CapillaryToleranceInput,
  type TimeToHeightToleranceInput,
  type TimeToHeightToleranceResult,
  type UptakeBandInput,
} from './capillary-cases';
export { toleranceModels } from './models';
