import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requireInRange, requirePositive } from '../validate';

/**
 * Single-fibre geometry from linear density.
 *
 * A fibre of linear density λ (kg/m) and density ρf (kg/m³) has cross-section area A = λ/ρf. Its
 * equivalent round diameter (the diameter of a circle of the same area) is
 *   d = √(4A/π) = √(4λ/(π ρf)).
 * In textile units d(µm) = 11.284·√(dtex/ρf[g/cm³]) (11.284 = 20/√π). Linear density units: 1 tex = 1 g per
 * 1 000 m = 1e-6 kg/m; 1 dtex = 0.1 tex; 1 denier = 1 g per 9 000 m = 1/9 tex.
 *
 * Non-round fibres (trilobal, ribbon, hollow outside surface …) are described by a shape factor
 *   χ = P / (π d),  P the real perimeter, d the equivalent round diameter,
 * so χ = 1 for a circle and χ > 1 otherwise (isoperimetric inequality: the circle has the least perimeter for
 * its area). The specific surface per volume of fibre is S_v = P/A = 4χ/d (1/m); per mass S_m = S_v/ρf (m²/kg).
 * Fibre ends are neglected (long fibres). Sources: Morton & Hearle, Physical Properties of Textile Fibres,
 * 4th ed. (2008), ch. 1 (fineness and density); ISO 1144 (tex system, from memory).
 */

/** Textile linear-density units and their value in kg/m (exact by definition). */
export const LINEAR_DENSITY_UNITS = {
  tex: 1e-6,
  dtex: 1e-7,
  denier: 1e-6 / 9,
} as const;

export type LinearDensityUnit = keyof typeof LINEAR_DENSITY_UNITS;

/**
 * Converts a linear density given in tex, dtex or denier to kg/m.
 * @param value the number in `unit` (> 0). @param unit 'tex' | 'dtex' | 'denier'.
 */
export function linearDensityToSI(value: number, unit: LinearDensityUnit): number {
  requirePositive('linearDensity', value);
  const factor = Object.hasOwn(LINEAR_DENSITY_UNITS, unit) ? LINEAR_DENSITY_UNITS[unit] : undefined;
  if (factor === undefined) {
    throw new DomainError('unknown-unit', `Unknown linear-density unit "${String(unit)}" (use tex, dtex or denier).`, 'unit');
  }
  return value * factor;
}

/** Converts kg/m to tex, dtex or denier. */
export function linearDensityFromSI(kgPerMetre: number, unit: LinearDensityUnit): number {
  requirePositive('linearDensity', kgPerMetre);
  const factor = Object.hasOwn(LINEAR_DENSITY_UNITS, unit) ? LINEAR_DENSITY_UNITS[unit] : undefined;
  if (factor === undefined) {
    throw new DomainError('unknown-unit', `Unknown linear-density unit "${String(unit)}" (use tex, dtex or denier).`, 'unit');
  }
  return kgPerMetre / factor;
}

/** Equivalent round diameter d = √(4λ/(π ρf)), m, from λ in kg/m and ρf in kg/m³. No checks. */
export function diameterFromLinearDensity(linearDensity: number, fibreDensity: number): number {
  return Math.sqrt((4 * linearDensity) / (Math.PI * fibreDensity));
}

/** Linear density λ = π d² ρf / 4, kg/m, the inverse of {@link diameterFromLinearDensity}. No checks. */
export function linearDensityFromDiameter(diameter: number, fibreDensity: number): number {
  return (Math.PI * diameter * diameter * fibreDensity) / 4;
}

/** Validates a shape factor χ = perimeter/(π d) ≥ 1 (default 1, round). */
export function readShapeFactor(field: string, value: number | undefined): number {
  if (value === undefined) return 1;
  requireFinite(field, value);
  // Lower bound: the circle has the least perimeter for its area (isoperimetric inequality). Upper bound: a
  // guard against typing errors; deep-grooved fibres stay well below 10 (a flat ribbon 1:25 is ≈ 3).
  return requireInRange(field, value, 1, 10);
}

export interface FibreGeometryInput {
  /** Linear density λ, kg/m (1 dtex = 1e-7 kg/m). */
  readonly linearDensity: number;
  /** Fibre (polymer) density ρf, kg/m³. */
  readonly fibreDensity: number;
  /** Perimeter ratio χ = P/(π d) ≥ 1 (default 1, round). */
  readonly shapeFactor?: number;
}

export interface FibreGeometryResult extends ResultBase<FibreGeometryInput> {
  /** Equivalent round diameter d, m. */
  readonly diameter: number;
  /** Cross-section area A = λ/ρf, m². */
  readonly crossSectionArea: number;
  /** Perimeter P = χ π d, m. */
  readonly perimeter: number;
  /** Specific surface per volume of fibre S_v = 4χ/d, 1/m. */
  readonly specificSurfaceVolume: number;
  /** Specific surface per mass of fibre S_m = 4χ/(d ρf), m²/kg. */
  readonly specificSurfaceMass: number;
}

/**
 * Fibre diameter and specific surface from linear density and fibre density.
 * d = √(4λ/(π ρf)); S_v = 4χ/d; S_m = S_v/ρf (see module comment; Morton & Hearle 2008).
 * Validity: solid (not hollow) fibres of uniform cross-section; for swelling fibres use the dry density.
 */
export function fibreGeometry(input: FibreGeometryInput): FibreGeometryResult {
  const linearDensity = requirePositive('linearDensity', input.linearDensity);
  const fibreDensity = requirePositive('fibreDensity', input.fibreDensity);
  const shapeFactor = readShapeFactor('shapeFactor', input.shapeFactor);
  const warnings: ModelWarning[] = [];
  if (fibreDensity < 800 || fibreDensity > 2700) {
    warnings.push({
      code: 'unusual-fibre-density',
      message:
        `A fibre density of ${(fibreDensity / 1000).toFixed(3)} g/cm³ is outside the usual 0.8–2.7 g/cm³ of ` +
        'textile and glass fibres (Morton & Hearle 2008, Table 5.1): check the unit.',
    });
  }
  const diameter = diameterFromLinearDensity(linearDensity, fibreDensity);
  const specificSurfaceVolume = (4 * shapeFactor) / diameter;
  return {
    inputs: { linearDensity, fibreDensity, shapeFactor },
    warnings,
    diameter,
    crossSectionArea: linearDensity / fibreDensity,
    perimeter: shapeFactor * Math.PI * diameter,
    specificSurfaceVolume,
    specificSurfaceMass: specificSurfaceVolume / fibreDensity,
  };
}
