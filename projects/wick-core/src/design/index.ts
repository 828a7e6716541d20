/** Design variants: wire types, input checking, the evaluator, key figures and input tables. */
export * from './variant';
export { VARIANT_FIELDS, TOLERANCE_FIELDS, variantField, type VariantFieldInfo } from './fields';
export { readVariantInputs } from './read-inputs';
export { evaluateVariant, variantBandPart, curveTimes } from './evaluate';
export { percentileBands, bandPart, mergeBandParts, type BandModel, type BandPart, type BandResult } from './band';
export { keyFigures, compareKeyFigures, type KeyFigure, type ComparedFigure, type ComparedValue, type ComparableVariant, type BetterDirection } from './key-figures';
export { describeInputs, type VariantInputRow } from './describe';
export { VARIANT_EQUATIONS } from './equations';
export { structureFromLibrary, liquidFromLibrary, type LibraryFibre, type StructureFromLibrary } from './from-library';
export { fixtureKeys, fixtureMismatches, type FixtureCase, type VariantFixture } from './fixture';
export { designModels, VARIANT_EXAMPLE } from './models';
export * from './api';
