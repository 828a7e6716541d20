/**
 * The input fields of a variant: path, label and physical dimension. Used for messages (a DomainError's
 * `field` is the path), for the unit-switchable form in the UI, and for the input tables of CSV exports and
 * reports.
 */
import type { Dimension } from '../units/dimensions';
import type { ToleranceParameter } from './variant';

export interface VariantFieldInfo {
  readonly path: string;
  readonly label: string;
  readonly dimension: Dimension;
}

const f = (path: string, label: string, dimension: Dimension): VariantFieldInfo => ({ path, label, dimension });

export const VARIANT_FIELDS: readonly VariantFieldInfo[] = [
  f('structure.fibreDiameter', 'Fibre diameter', 'length'),
  f('structure.linearDensity', 'Fibre linear density', 'linearDensity'),
  f('structure.fibreDensity', 'Fibre density', 'density'),
  f('structure.shapeFactor', 'Fibre shape factor', 'dimensionless'),
  f('structure.basisWeight', 'Basis weight', 'basisWeight'),
  f('structure.thickness', 'Thickness', 'length'),
  f('structure.porosity', 'Porosity (measured)', 'fraction'),
  f('structure.contactAngle', 'Contact angle', 'angle'),
  f('structure.poreDiameter', 'Mean pore diameter', 'length'),
  f('structure.permeability.value', 'Permeability (measured)', 'permeability'),
  f('structure.permeability.kozenyConstant', 'Kozeny constant', 'dimensionless'),
  f('capillary.radius', 'Capillary radius', 'length'),
  f('capillary.contactAngle', 'Contact angle', 'angle'),
  f('liquid.temperature', 'Temperature', 'temperature'),
  f('dimensions.width', 'Strip width', 'length'),
  f('dimensions.length', 'Strip length', 'length'),
  f('dimensions.tilt', 'Tilt from horizontal', 'angle'),
  f('dimensions.sourceRadius', 'Wetted spot radius', 'length'),
  f('dimensions.duration', 'Curve duration', 'time'),
  f('checkpoints.heights', 'Target heights', 'length'),
  f('checkpoints.times', 'Reading times', 'time'),
  f('humidity', 'Relative humidity', 'fraction'),
];

const BY_PATH = new Map(VARIANT_FIELDS.map((x) => [x.path, x]));

export function variantField(path: string): VariantFieldInfo | undefined {
  return BY_PATH.get(path.replace(/\[\d+\]$/, ''));
}

/** Label and dimension of each toleranced parameter. */
export const TOLERANCE_FIELDS: Readonly<Record<ToleranceParameter, { readonly label: string; readonly dimension: Dimension }>> = {
  fibreDiameter: { label: 'Fibre diameter', dimension: 'length' },
  linearDensity: { label: 'Fibre linear density', dimension: 'linearDensity' },
  fibreDensity: { label: 'Fibre density', dimension: 'density' },
  basisWeight: { label: 'Basis weight', dimension: 'basisWeight' },
  thickness: { label: 'Thickness', dimension: 'length' },
  porosity: { label: 'Porosity', dimension: 'fraction' },
  contactAngle: { label: 'Contact angle', dimension: 'angle' },
  permeability: { label: 'Permeability', dimension: 'permeability' },
  poreDiameter: { label: 'Mean pore diameter', dimension: 'length' },
  capillaryRadius: { label: 'Capillary radius', dimension: 'length' },
  surfaceTension: { label: 'Surface tension', dimension: 'surfaceTension' },
  viscosity: { label: 'Viscosity', dimension: 'viscosity' },
  liquidDensity: { label: 'Liquid density', dimension: 'density' },
  tilt: { label: 'Tilt from horizontal', dimension: 'angle' },
  sourceRadius: { label: 'Wetted spot radius', dimension: 'length' },
  width: { label: 'Strip width', dimension: 'length' },
};
