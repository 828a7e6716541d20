export * from './types';
export { simulateStack, frontPosition } from './simulate';
export { stackRetentionCurve, type RetentionCurveInput, type RetentionCurveResult } from './curve';
export { fitPoreSizeRetention, type PoreSizeRetentionFit, type PoreSizeRetentionFitInput } from './pore-size-fit';
export { BrooksCoreyBurdine, VanGenuchtenMualem, type HydraulicFunctions } from './retention';
export { stackModels } from './models';
// The design workspace's stack variant (design/stack-*), listed here until design/index.ts takes it over.
export * from '../design/stack-variant';
export { readStackVariantInputs } from '../design/stack-read-inputs';
export { evaluateStackVariant, stackKeyFigures, stackSolverInput, STACK_EQUATIONS } from '../design/stack-evaluate';
export { stackLayerFromLibrary, type StackLayerFromLibrary } from '../design/stack-from-library';
export { STACK_VARIANT_EXAMPLE, stackVariantModels } from '../design/stack-models';
export * from '../design/variant-kinds';
