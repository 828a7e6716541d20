/**
 * Fitting of lab wicking data: Washburn slope with automatic window, gravity-restrained
 * Levenberg–Marquardt fit, reference-liquid contact angle, replicate statistics, prediction errors.
 */
export { checkUptakeSeries, type CheckedSeries } from './series';
export { regularizedIncompleteBeta, studentTCdf, studentTPdf, studentTQuantile } from './student-t';
export { fitLine, type LineFit, type LineFitInputs } from './linear-regression';
export { integralGravityEstimate } from './integral-estimate';
export {
  fitWashburnSlope,
  suggestWashburnWindow,
  type SuggestedWindow,
  type WashburnSlopeInput,
  type WashburnSlopeResult,
} from './washburn-slope';
export { gravityHeightDerivatives } from './gravity-jacobian';
export {
  EQUILIBRIUM_APPROACH_WARNING,
  fitGravityWashburn,
  type Estimate,
  type GravityFitInput,
  type GravityFitResult,
} from './gravity-fit';
export {
  REFERENCE_LIQUID_CAUTION,
  referenceLiquidContactAngle,
  type LiquidRuns,
  type ReferenceLiquidInput,
  type ReferenceLiquidResult,
} from './contact-angle';
export { replicateStatistics, spread, type ReplicateInput, type ReplicateResult, type SpreadSummary } from './replicates';
export {
  firstCrossingTime,
  predictionError,
  type PredictionErrorInput,
  type PredictionErrorResult,
  type Series,
  type TimeToHeightError,
} from './metrics';
export {
  analyseLabRun,
  DEFAULT_FIT_SETTINGS,
  type FitFailure,
  type FitSettings,
  type FitWindow,
  labRunFigures,
  type LabRunFitInput,
  labRunWashburnFit,
  REPLICATE_FIGURES,
  type ReplicateFigure,
  type ReplicateFigureKey,
  replicateFigures,
  type RunAnalysis,
  type RunFigures,
  type WireGravityFit,
  type WireWashburnFit,
} from './lab-run';
export { fittingModels } from './models';
