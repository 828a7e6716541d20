import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireContactAngle, requireNonNegative, requirePositive } from '../validate';
import { preparePoreSizeDistribution, type DistributionForm, type PoreSizeDistribution } from './distribution';

/** Pore-size distribution fields shared by the pore-size models (see ./distribution). */
export interface PsdFields {
  /** Class diameters D, m, strictly increasing. */
  readonly diameters: ArrayLike<number>;
  /** Pore-volume fractions in the form given by `form`. */
  readonly fractions: ArrayLike<number>;
  readonly form: DistributionForm;
}

/** Liquid and wetting fields: γ N/m, θ rad, ρ kg/m³, g m/s². */
export interface PoreLiquidFields {
  readonly surfaceTension: number;
  readonly contactAngle: number;
  readonly density: number;
  /** Default standard gravity 9.80665 m/s². */
  readonly gravity?: number;
}

export interface PoreSizeEquilibriumInput extends PsdFields, PoreLiquidFields {
  /** Heights z above the liquid level (m, ≥ 0, vertical) at which to report S(z); optional. */
  readonly heights?: ArrayLike<number>;
}

export interface PoreSizeEquilibriumResult extends ResultBase<PoreSizeEquilibriumInput> {
  /** The checked distribution (differential fractions, Σ = 1). */
  readonly distribution: PoreSizeDistribution;
  /** Jurin height of each class, m (same order as the diameters, so decreasing). */
  readonly jurinHeights: Float64Array;
  /**
   * Equilibrium saturation profile as steps with heights ascending: S(z) = saturation[k] for
   * stepHeights[k−1] < z ≤ stepHeights[k] (stepHeights[−1] = 0); S = 0 above the last height.
   */
  readonly profile: { readonly stepHeights: Float64Array; readonly saturation: Float64Array };
  /** S(z) at the requested heights (empty when none were asked for). */
  readonly saturationAtHeights: Float64Array;
  /**
   * Retention curve of the bundle (wetting branch): capillary pressure Pc = 4γcosθ/D at which the
   * class of diameter D fills, and the saturation reached = fraction of pore volume in pores with
   * D′ ≤ D. Ascending saturation, descending pressure; `head` = Pc/(ρg), m.
   */
  readonly retention: {
    readonly saturation: Float64Array;
    readonly capillaryPressure: Float64Array;
    readonly head: Float64Array;
  };
  /** Σ fᵢ hᵢ, m: equilibrium liquid volume per unit pore cross-section (times ε per unit layer cross-section). */
  readonly meanFilledHeight: number;
}

/** γ cos θ after checking the liquid; refuses θ ≥ 90° (no spontaneous rise). */
export function wettingTension(surfaceTension: number, contactAngle: number): number {
  const gamma = requirePositive('surfaceTension', surfaceTension);
  const theta = requireContactAngle('contactAngle', contactAngle);
  const cos = Math.cos(theta);
  if (!(cos > 1e-9)) {
    throw new DomainError(
      'out-of-range',
      `The contact angle must be below 90° for spontaneous capillary uptake (got ${((theta * 180) / Math.PI).toFixed(1)}°).`,
      'contactAngle',
    );
  }
  return gamma * cos;
}

/**
 * Jurin height of a cylindrical pore of diameter D (J. Jurin, Phil. Trans. 30 (1718) 739; P.-G. de
 * Gennes, F. Brochard-Wyart & D. Quéré, *Capillarity and Wetting Phenomena*, Springer 2004):
 *   h = 4γ cosθ / (ρ g D)
 * γ surface tension N/m, θ contact angle rad (< 90°), ρ density kg/m³, g m/s² (> 0), D diameter m.
 * Valid for D well below the capillary length √(γ/(ρg)) (≈ 2.7 mm for water).
 */
export function jurinHeightForDiameter(
  diameter: number,
  surfaceTension: number,
  contactAngle: number,
  density: number,
  gravity = STANDARD_GRAVITY,
): number {
  requirePositive('diameter', diameter);
  const c = wettingTension(surfaceTension, contactAngle);
  return (4 * c) / (requirePositive('density', density) * requirePositive('gravity', gravity) * diameter);
}

/** Warn when the largest pores are not small against the capillary length (Jurin overestimates there). */
export function capillaryLengthWarning(
  maxDiameter: number,
  surfaceTension: number,
  density: number,
  gravity: number,
): ModelWarning | null {
  if (!(gravity > 0)) return null;
  const lc = Math.sqrt(surfaceTension / (density * gravity));
  // Common practice: a meniscus stays close to a spherical cap for radii below ~0.1 capillary length.
  return maxDiameter / 2 > 0.1 * lc
    ? {
        code: 'pores-not-capillary',
        message:
          `The largest pores (D = ${(maxDiameter * 1e3).toPrecision(3)} mm) are not small against the capillary ` +
          `length (${(lc * 1e3).toPrecision(3)} mm): their meniscus flattens and Jurin's law overestimates their rise.`,
      }
    : null;
}

/**
 * Equilibrium of a bundle of independent vertical capillaries with the given pore-size
 * distribution. Each class of diameter D rises to its own Jurin height h_D = 4γcosθ/(ρgD); the
 * saturation at height z is the pore-volume fraction of the classes with h_D ≥ z:
 *   S(z) = Σ_{i: hᵢ ≥ z} fᵢ.
 * Assumptions: pores are independent parallel tubes (no interconnection, no films or corner flow,
 * no hysteresis or ink-bottle effects): the wetting branch of an ideal capillary bundle (the
 * "capillaric" models reviewed by F. A. L. Dullien, *Porous Media: Fluid Transport and Pore
 * Structure*, 2nd ed., Academic Press 1992 — from memory).
 * The retention points (Pc = 4γcosθ/D, S = fraction finer) are the same statement in pressure
 * form (Young–Laplace), e.g. as data for a retention-curve fit in the unsaturated-flow model.
 */
export function poreSizeEquilibrium(input: PoreSizeEquilibriumInput): PoreSizeEquilibriumResult {
  const warnings: ModelWarning[] = [];
  const psd = preparePoreSizeDistribution(input, warnings);
  const c = wettingTension(input.surfaceTension, input.contactAngle);
  const density = requirePositive('density', input.density);
  const gravity = requirePositive('gravity', input.gravity ?? STANDARD_GRAVITY);
  const rhoG = density * gravity;
  const n = psd.diameters.length;
  const jurinHeights = new Float64Array(n);
  let meanFilledHeight = 0;
  for (let i = 0; i < n; i++) {
    jurinHeights[i] = (4 * c) / (rhoG * psd.diameters[i]);
    meanFilledHeight += psd.fractions[i] * jurinHeights[i];
  }
  const w = capillaryLengthWarning(psd.diameters[n - 1], input.surfaceTension, density, gravity);
  if (w) warnings.push(w);

  // Heights ascend as diameters descend: step k (ascending) is class n−1−k, and S up to that
  // height is the fraction finer than or equal to that class.
  const stepHeights = new Float64Array(n);
  const saturation = new Float64Array(n);
  const capillaryPressure = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const i = n - 1 - k;
    stepHeights[k] = jurinHeights[i];
    saturation[k] = psd.cumulativeFiner[i];
    capillaryPressure[i] = (4 * c) / psd.diameters[i];
  }
  const heights = input.heights ?? [];
  const saturationAtHeights = new Float64Array(heights.length);
  for (let j = 0; j < heights.length; j++) {
    saturationAtHeights[j] = equilibriumSaturationAt(psd.fractions, jurinHeights, requireNonNegative(`heights[${j}]`, heights[j]));
  }
  return {
    inputs: input,
    warnings,
    distribution: psd,
    jurinHeights,
    profile: { stepHeights, saturation },
    saturationAtHeights,
    retention: { saturation: psd.cumulativeFiner, capillaryPressure, head: jurinHeights.slice() },
    meanFilledHeight,
  };
}

/** S(z) = Σ_{i: hᵢ ≥ z} fᵢ for class fractions and class heights (equilibrium or at one time). */
export function equilibriumSaturationAt(fractions: ArrayLike<number>, classHeights: ArrayLike<number>, z: number): number {
  let s = 0;
  for (let i = 0; i < classHeights.length; i++) if (classHeights[i] >= z) s += fractions[i];
  return Math.min(s, 1);
}
