export * from './types';
export { simulateStack, frontPosition } from './simulate';
export { stackRetentionCurve, type RetentionCurveInput, type RetentionCurveResult } from './curve';
export { fitPoreSizeRetention, type PoreSizeRetentionFit, type PoreSizeRetentionFitInput } from './pore-size-fit';
export { BrooksCoreyBurdine, VanGenuchtenMualem, type HydraulicFunctions } from './retention';
export { stackModels } from './models';
