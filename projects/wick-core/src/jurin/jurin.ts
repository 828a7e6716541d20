import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireContactAngle, requireInRange, requireNonNegative, requirePositive } from '../validate';

/**
 * Jurin's law: equilibrium capillary rise in a round tube, with the hemispherical-meniscus
 * (Rayleigh) correction, tilt, and the inverse (surface tension from a measured rise).
 *
 * Sources: Jurin, Phil. Trans. R. Soc. 30 (1718) 739; Rayleigh, Proc. R. Soc. A 92 (1916) 184;
 * Adamson & Gast, Physical Chemistry of Surfaces, 6th ed. (1997) Ch. II.
 */

/** Density of air at about 20 °C and 1 atm, kg/m³ (common practice), the default displaced fluid. */
export const AIR_DENSITY = 1.2;

/** Tilt below which the column length along the tube is flagged as very long (rad, 5°). */
const SHALLOW_TILT = (5 * Math.PI) / 180;
/** r/h above which the first-order meniscus correction is no longer adequate. */
const WIDE_TUBE_RATIO = 0.1;

export interface JurinCommonInput {
  /** ρ_liquid, kg/m³ */
  readonly liquidDensity: number;
  /** ρ of the fluid the liquid displaces, kg/m³; air (1.2 kg/m³) when omitted. */
  readonly displacedDensity?: number;
  /** g, m/s²; standard gravity 9.80665 m/s² when omitted. */
  readonly gravity?: number;
}

function densityDifference(input: JurinCommonInput): { deltaRho: number; g: number } {
  const rhoL = requirePositive('liquidDensity', input.liquidDensity);
  const rhoD = input.displacedDensity === undefined ? AIR_DENSITY : requireNonNegative('displacedDensity', input.displacedDensity);
  const g = input.gravity === undefined ? STANDARD_GRAVITY : requirePositive('gravity', input.gravity);
  const deltaRho = rhoL - rhoD;
  if (!(deltaRho > 0)) {
    throw new DomainError(
      'out-of-range',
      `The liquid (${rhoL} kg/m³) must be denser than the fluid it displaces (${rhoD} kg/m³) to form a capillary column.`,
      'displacedDensity',
    );
  }
  return { deltaRho, g };
}

export interface JurinHeightInput extends JurinCommonInput {
  /** γ, N/m */
  readonly surfaceTension: number;
  /** θ, rad (0–π) */
  readonly contactAngle: number;
  /** r, m: tube radius. */
  readonly radius: number;
  /** α, rad: tube angle from the horizontal, 0 < α ≤ π/2; vertical (π/2) when omitted. */
  readonly tilt?: number;
}

export interface JurinHeightResult extends ResultBase<JurinHeightInput> {
  /** 'rise' for θ < 90°, 'none' at 90°, 'depression' for θ > 90° (no spontaneous rise). */
  readonly status: 'rise' | 'none' | 'depression';
  /** Jurin height h = 2γ cos θ/(Δρ g r), m, vertical; negative for a depression. */
  readonly height: number;
  /**
   * Height to the bottom of the meniscus after the hemispherical-meniscus correction,
   * h − r/3, m; null when the liquid does not rise.
   */
  readonly correctedHeight: number | null;
  /** h / sin α, m: column length along a tilted tube; null for a horizontal tube. */
  readonly lengthAlongTube: number | null;
  /** correctedHeight / sin α, m; null when either is undefined. */
  readonly correctedLengthAlongTube: number | null;
  /** Δρ used, kg/m³ */
  readonly densityDifference: number;
  /** Capillary length √(γ/(Δρ g)), m: Jurin's law needs r well below it. */
  readonly capillaryLength: number;
}

/**
 * Equilibrium capillary rise (Jurin's law), with the meniscus correction and tube tilt.
 *
 * h = 2γ cos θ / (Δρ g r),  Δρ = ρ_liquid − ρ_displaced
 * corrected (hemispherical meniscus, Rayleigh's first term): h_c = h − r/3
 * tilted tube at α from horizontal: vertical height unchanged, length along the tube h/sin α.
 *
 * - γ: surface tension, N/m; θ: contact angle, rad; r: tube radius, m; ρ: densities, kg/m³;
 *   g: m/s²; α: rad. Heights in m.
 * - Validity: r well below the capillary length (warning when r/h > 0.1, where the meniscus is no
 *   longer a hemisphere and higher Rayleigh terms matter); the correction is exact to first order
 *   for θ = 0 and approximate otherwise; static equilibrium (the time to reach it is Washburn's).
 *   θ ≥ 90°: no spontaneous rise — the result is a depression (negative h).
 * - Source: Jurin (1718); Rayleigh, Proc. R. Soc. A 92 (1916) 184; Adamson & Gast, 6th ed., Ch. II.
 */
export function jurinHeight(input: JurinHeightInput): JurinHeightResult {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const r = requirePositive('radius', input.radius);
  const alpha = input.tilt === undefined ? Math.PI / 2 : requireInRange('tilt', input.tilt, 0, Math.PI / 2);
  const { deltaRho, g } = densityDifference(input);
  const warnings: ModelWarning[] = [];

  const cos = theta === Math.PI / 2 ? 0 : Math.cos(theta);
  const height = (2 * gamma * cos) / (deltaRho * g * r);
  const capillaryLength = Math.sqrt(gamma / (deltaRho * g));
  const status: JurinHeightResult['status'] = cos > 0 ? 'rise' : cos < 0 ? 'depression' : 'none';

  let correctedHeight: number | null = null;
  if (status === 'rise') {
    correctedHeight = height - r / 3;
    if (r / height > WIDE_TUBE_RATIO) {
      warnings.push({
        code: 'wide-tube',
        message: `The tube radius is more than a tenth of the rise (r/h = ${(r / height).toFixed(2)}): the meniscus is not a hemisphere and both heights are rough.`,
      });
    }
  } else if (status === 'depression') {
    warnings.push({
      code: 'no-rise',
      message: 'Contact angle above 90°: there is no spontaneous rise; the liquid is depressed below the outside level (negative height).',
    });
  } else {
    warnings.push({ code: 'no-rise', message: 'Contact angle of 90°: the meniscus is flat and the liquid neither rises nor falls.' });
  }

  let lengthAlongTube: number | null = null;
  let correctedLengthAlongTube: number | null = null;
  const sinA = alpha === Math.PI / 2 ? 1 : Math.sin(alpha);
  if (alpha === 0) {
    if (status === 'rise') {
      warnings.push({
        code: 'horizontal-tube',
        message: 'Horizontal tube: gravity does not stop the liquid, which advances until the tube ends.',
      });
    }
  } else {
    lengthAlongTube = height / sinA;
    correctedLengthAlongTube = correctedHeight === null ? null : correctedHeight / sinA;
    if (alpha < SHALLOW_TILT && status === 'rise') {
      warnings.push({
        code: 'shallow-tilt',
        message: 'Tube nearly horizontal: the column length along it, h/sin α, becomes very long and sensitive to the angle.',
      });
    }
  }

  return {
    inputs: input,
    warnings,
    status,
    height,
    correctedHeight,
    lengthAlongTube,
    correctedLengthAlongTube,
    densityDifference: deltaRho,
    capillaryLength,
  };
}

export interface SurfaceTensionFromRiseInput extends JurinCommonInput {
  /** h, m: measured vertical rise to the bottom of the meniscus. */
  readonly height: number;
  /** r, m: tube radius. */
  readonly radius: number;
  /** θ, rad, below 90°; 0 (complete wetting) when omitted. */
  readonly contactAngle?: number;
}

export interface SurfaceTensionFromRiseResult extends ResultBase<SurfaceTensionFromRiseInput> {
  /** γ = ½ Δρ g r h / cos θ, N/m */
  readonly surfaceTension: number;
  /** γ = ½ Δρ g r (h + r/3) / cos θ, N/m (hemispherical-meniscus correction) */
  readonly correctedSurfaceTension: number;
  readonly densityDifference: number;
}

/**
 * Surface tension from a measured capillary rise (the capillary-rise method), with and without
 * the meniscus correction.
 *
 * γ = ½ Δρ g r h / cos θ;  corrected: γ = ½ Δρ g r (h + r/3) / cos θ
 *
 * - h: rise to the bottom of the meniscus, m (> 0); r: tube radius, m; θ: contact angle, rad
 *   (< 90°; usually 0 with a clean glass tube); Δρ, g as {@link jurinHeight}. γ in N/m.
 * - Validity: r ≪ h (warning when r/h > 0.1); the r/3 term is Rayleigh's first-order correction.
 * - Source: Adamson & Gast, 6th ed., Ch. II; Rayleigh, Proc. R. Soc. A 92 (1916) 184.
 */
export function surfaceTensionFromRise(input: SurfaceTensionFromRiseInput): SurfaceTensionFromRiseResult {
  const h = requirePositive('height', input.height);
  const r = requirePositive('radius', input.radius);
  const theta = input.contactAngle === undefined ? 0 : requireContactAngle('contactAngle', input.contactAngle);
  if (theta >= Math.PI / 2) {
    throw new DomainError(
      'out-of-range',
      'The capillary-rise method needs a contact angle below 90°: with 90° or more the liquid does not rise.',
      'contactAngle',
    );
  }
  const { deltaRho, g } = densityDifference(input);
  const warnings: ModelWarning[] = [];
  if (r / h > WIDE_TUBE_RATIO) {
    warnings.push({
      code: 'wide-tube',
      message: `The tube radius is more than a tenth of the rise (r/h = ${(r / h).toFixed(2)}): the meniscus correction is inaccurate.`,
    });
  }
  const cos = Math.cos(theta);
  const k = (0.5 * deltaRho * g * r) / cos;
  return {
    inputs: input,
    warnings,
    surfaceTension: k * h,
    correctedSurfaceTension: k * (h + r / 3),
    densityDifference: deltaRho,
  };
}
