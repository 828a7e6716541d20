import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireInRange, requirePositive } from '../validate';
import { diameterFromLinearDensity, readShapeFactor } from './fibre';

/**
 * Fibre blends by mass fraction.
 *
 * Blend density (volumes add):            1/ρf = Σ wᵢ/ρᵢ
 * Volume fraction of component i:         φᵢ = (wᵢ/ρᵢ)·ρf
 * Specific surface per volume of fibre:   S_v = Σ φᵢ·4χᵢ/dᵢ   (1/m)
 * Specific surface per mass of fibre:     S_m = S_v/ρf = Σ wᵢ·4χᵢ/(ρᵢ dᵢ)   (m²/kg)
 * Surface-equivalent diameter:            d_s = 4/S_v (the round-fibre diameter with the blend's S_v)
 * wᵢ mass fraction, ρᵢ fibre density (kg/m³), dᵢ equivalent round diameter (m), χᵢ perimeter ratio (≥ 1).
 * These are exact volume and area balances (REFERENCES: "blends 1/ρf = Σ wᵢ/ρᵢ [exact]").
 */

export interface BlendComponent {
  /** Mass fraction wᵢ of this fibre in the web, 0 < w ≤ 1. */
  readonly massFraction: number;
  /** Fibre density ρᵢ, kg/m³. */
  readonly fibreDensity: number;
  /** Equivalent round diameter dᵢ, m (give this or linearDensity). */
  readonly diameter?: number;
  /** Linear density λᵢ, kg/m (used when diameter is absent). */
  readonly linearDensity?: number;
  /** Perimeter ratio χᵢ ≥ 1 (default 1). */
  readonly shapeFactor?: number;
  /** Optional label for messages, e.g. "PP 1.7 dtex". */
  readonly name?: string;
}

export interface BlendResult extends ResultBase<{ readonly components: readonly BlendComponent[] }> {
  /** Blend fibre density ρf, kg/m³. */
  readonly fibreDensity: number;
  /** Volume fraction of each component within the fibre volume. */
  readonly volumeFractions: readonly number[];
  /** Diameter used for each component, m. */
  readonly diameters: readonly number[];
  /** Specific surface per volume of fibre S_v, 1/m. */
  readonly specificSurfaceVolume: number;
  /** Specific surface per mass of fibre S_m, m²/kg. */
  readonly specificSurfaceMass: number;
  /** Surface-equivalent round diameter 4/S_v, m. */
  readonly equivalentDiameter: number;
}

/** Mass fractions may sum to 1 within this tolerance (rounded percentages); they are then normalised. */
const FRACTION_SUM_TOLERANCE = 0.005;

/**
 * Blend density, volume fractions and specific surface of a fibre blend (see module comment).
 * Mass fractions must add up to 1 (± 0.5 %, then normalised with a warning).
 * @throws DomainError for an empty blend, fractions not adding up, or a component without size.
 */
export function blendFibres(components: readonly BlendComponent[]): BlendResult {
  if (!Array.isArray(components) || components.length === 0) {
    throw new DomainError('invalid-input', 'Give at least one fibre component.', 'components');
  }
  const warnings: ModelWarning[] = [];
  const checked = components.map((c, i) => {
    const field = `components[${i}]`;
    const massFraction = requireInRange(`${field}.massFraction`, c.massFraction, 0, 1, { min: true });
    const fibreDensity = requirePositive(`${field}.fibreDensity`, c.fibreDensity);
    const shapeFactor = readShapeFactor(`${field}.shapeFactor`, c.shapeFactor);
    let diameter: number;
    if (c.diameter !== undefined) {
      diameter = requirePositive(`${field}.diameter`, c.diameter);
      if (c.linearDensity !== undefined) {
        const fromTitre = diameterFromLinearDensity(requirePositive(`${field}.linearDensity`, c.linearDensity), fibreDensity);
        if (Math.abs(fromTitre / diameter - 1) > 0.05) {
          warnings.push({
            code: 'diameter-mismatch',
            message:
              `${c.name ?? field}: the diameter given differs by more than 5 % from the one implied by the linear ` +
              'density and fibre density; the diameter given is used.',
          });
        }
      }
    } else if (c.linearDensity !== undefined) {
      diameter = diameterFromLinearDensity(requirePositive(`${field}.linearDensity`, c.linearDensity), fibreDensity);
    } else {
      throw new DomainError('invalid-input', `${c.name ?? field}: give a diameter or a linear density.`, field);
    }
    return { ...c, massFraction, fibreDensity, shapeFactor, diameter };
  });

  const sum = checked.reduce((s, c) => s + c.massFraction, 0);
  if (Math.abs(sum - 1) > FRACTION_SUM_TOLERANCE) {
    throw new DomainError(
      'out-of-range',
      `The mass fractions add up to ${sum.toFixed(4)}, not 1.`,
      'components',
      { sum },
    );
  }
  if (Math.abs(sum - 1) > 1e-9) {
    warnings.push({
      code: 'mass-fractions-normalised',
      message: `The mass fractions added up to ${sum.toFixed(4)} and were scaled to 1.`,
    });
  }
  // 1/ρf = Σ wᵢ/ρᵢ with normalised wᵢ.
  const specificVolume = checked.reduce((s, c) => s + c.massFraction / sum / c.fibreDensity, 0);
  const fibreDensity = 1 / specificVolume;
  const volumeFractions = checked.map((c) => c.massFraction / sum / c.fibreDensity / specificVolume);
  const specificSurfaceVolume = checked.reduce(
    (s, c, i) => s + (volumeFractions[i] * 4 * c.shapeFactor) / c.diameter,
    0,
  );
  return {
    inputs: { components: checked },
    warnings,
    fibreDensity,
    volumeFractions,
    diameters: checked.map((c) => c.diameter),
    specificSurfaceVolume,
    specificSurfaceMass: specificSurfaceVolume / fibreDensity,
    equivalentDiameter: 4 / specificSurfaceVolume,
  };
}
