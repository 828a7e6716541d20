import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireContactAngle, requireFinite, requirePositive } from '../validate';

/**
 * Young–Laplace pressure jumps across curved liquid surfaces.
 *
 * Sign convention: ΔP = P(concave side) − P(convex side). A radius is positive when the surface is
 * convex towards the side the pressure is measured against (a droplet seen from outside), negative
 * when concave (the two principal radii of a saddle have opposite signs).
 *
 * Source for all: Young (1805), Laplace (1806); in modern form e.g. Adamson & Gast, Physical
 * Chemistry of Surfaces, 6th ed. (1997) Ch. II; Butt, Graf & Kappl, Physics and Chemistry of
 * Interfaces (2003) Ch. 2.
 */

/** Below this radius (m) the continuum description is only approximate (common practice). */
export const NANOSCALE_RADIUS = 10e-9;

export interface LaplaceResult<I> extends ResultBase<I> {
  /** Pressure jump ΔP, Pa (see the sign convention above). */
  readonly pressure: number;
}

export interface MeniscusResult<I> extends LaplaceResult<I> {
  /**
   * Radius of curvature of the meniscus, m: r/cos θ in a tube, w/(2 cos θ) between plates; null
   * for a flat meniscus (θ = 90°). Negative for a convex (non-wetting) meniscus.
   */
  readonly meniscusRadius: number | null;
}

function smallRadiusWarning(field: string, r: number, warnings: ModelWarning[]): void {
  if (Math.abs(r) < NANOSCALE_RADIUS) {
    warnings.push({
      code: 'nanoscale',
      message: `${field} is below 10 nm: the Young–Laplace equation treats the surface as a continuum, which is only approximate at this scale.`,
    });
  }
}

function requireNonZeroRadius(field: string, r: number): number {
  requireFinite(field, r);
  if (r === 0) throw new DomainError('out-of-range', `${field} must not be zero (a zero radius is an infinite curvature).`, field);
  return r;
}

export interface GeneralLaplaceInput {
  /** γ, N/m */
  readonly surfaceTension: number;
  /** R1, m, signed. */
  readonly radius1: number;
  /** R2, m, signed; omit for a surface flat in the second direction (R2 → ∞). */
  readonly radius2?: number;
}

/**
 * General Young–Laplace equation with two principal radii of curvature.
 *
 * ΔP = γ (1/R1 + 1/R2)
 *
 * - γ: surface tension, N/m (> 0); R1, R2: signed principal radii, m (non-zero; R2 omitted = ∞).
 * - Validity: static interface, radii well above molecular size (≳ 10 nm; warning below).
 * - Source: Young (1805), Laplace (1806); Adamson & Gast, 6th ed., Ch. II.
 */
export function youngLaplace(input: GeneralLaplaceInput): LaplaceResult<GeneralLaplaceInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const r1 = requireNonZeroRadius('radius1', input.radius1);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('radius1', r1, warnings);
  let curvature = 1 / r1;
  if (input.radius2 !== undefined) {
    const r2 = requireNonZeroRadius('radius2', input.radius2);
    smallRadiusWarning('radius2', r2, warnings);
    curvature += 1 / r2;
  }
  return { inputs: input, warnings, pressure: gamma * curvature };
}

export interface RadiusInput {
  /** γ, N/m */
  readonly surfaceTension: number;
  /** R, m */
  readonly radius: number;
}

/**
 * Pressure inside a spherical droplet or a gas bubble in a liquid (one surface).
 *
 * ΔP = 2γ/R
 *
 * - γ: surface tension, N/m; R: sphere radius, m (> 0). ΔP in Pa, inside minus outside.
 * - Validity: as {@link youngLaplace} with R1 = R2 = R.
 * - Source: Adamson & Gast, 6th ed., Ch. II.
 */
export function laplaceSphere(input: RadiusInput): LaplaceResult<RadiusInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const r = requirePositive('radius', input.radius);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('radius', r, warnings);
  return { inputs: input, warnings, pressure: (2 * gamma) / r };
}

/**
 * Pressure inside a thin-film bubble (soap bubble) with two liquid–gas surfaces.
 *
 * ΔP = 4γ/R
 *
 * - γ: surface tension of the film liquid, N/m; R: bubble radius, m (> 0; film thickness ≪ R).
 * - Validity: thin film, both surfaces of radius ≈ R.
 * - Source: Adamson & Gast, 6th ed., Ch. II; Butt, Graf & Kappl (2003) Ch. 2.
 */
export function laplaceBubble(input: RadiusInput): LaplaceResult<RadiusInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const r = requirePositive('radius', input.radius);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('radius', r, warnings);
  return { inputs: input, warnings, pressure: (4 * gamma) / r };
}

/**
 * Pressure inside a liquid cylinder (a thread, or a meniscus curved in one direction only).
 *
 * ΔP = γ/R
 *
 * - γ: surface tension, N/m; R: cylinder radius, m (> 0).
 * - Validity: as {@link youngLaplace} with R2 → ∞.
 * - Source: Adamson & Gast, 6th ed., Ch. II.
 */
export function laplaceCylinder(input: RadiusInput): LaplaceResult<RadiusInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const r = requirePositive('radius', input.radius);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('radius', r, warnings);
  return { inputs: input, warnings, pressure: gamma / r };
}

function wettingWarnings(theta: number, warnings: ModelWarning[]): void {
  if (theta > Math.PI / 2) {
    warnings.push({
      code: 'non-wetting',
      message:
        'Contact angle above 90°: the capillary pressure is negative — the liquid does not enter by itself; it must be pushed in with at least this pressure.',
    });
  } else if (theta === Math.PI / 2) {
    warnings.push({ code: 'flat-meniscus', message: 'Contact angle of 90°: the meniscus is flat and there is no capillary pressure.' });
  }
}

export interface TubeMeniscusInput {
  /** γ, N/m */
  readonly surfaceTension: number;
  /** θ, rad, 0 ≤ θ ≤ π */
  readonly contactAngle: number;
  /** r, m: tube (capillary) radius. */
  readonly radius: number;
}

/**
 * Capillary pressure of a meniscus in a round tube (spherical cap of radius r/cos θ).
 *
 * ΔP = 2γ cos θ / r
 *
 * - γ: surface tension, N/m; θ: contact angle, rad; r: tube radius, m. ΔP (Pa) is the suction
 *   drawing a wetting liquid in (θ < 90°); negative for θ > 90° (entry pressure).
 * - Validity: r well below the capillary length √(γ/(ρg)) (≈ 2.7 mm for water) so the meniscus is
 *   a spherical cap; static contact angle.
 * - Source: Adamson & Gast, 6th ed., Ch. II (capillary rise); Washburn, Phys. Rev. 17 (1921) 273.
 */
export function tubeMeniscus(input: TubeMeniscusInput): MeniscusResult<TubeMeniscusInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const r = requirePositive('radius', input.radius);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('radius', r, warnings);
  wettingWarnings(theta, warnings);
  const cos = theta === Math.PI / 2 ? 0 : Math.cos(theta);
  return {
    inputs: input,
    warnings,
    pressure: (2 * gamma * cos) / r,
    meniscusRadius: cos === 0 ? null : r / cos,
  };
}

export interface SlitMeniscusInput {
  /** γ, N/m */
  readonly surfaceTension: number;
  /** θ, rad, 0 ≤ θ ≤ π */
  readonly contactAngle: number;
  /** w, m: gap between the plates. */
  readonly gap: number;
}

/**
 * Capillary pressure of a meniscus between two parallel plates (cylindrical meniscus of radius
 * w/(2 cos θ)).
 *
 * ΔP = 2γ cos θ / w
 *
 * - γ: surface tension, N/m; θ: contact angle, rad; w: gap, m. Sign as {@link tubeMeniscus}.
 * - Validity: plates much wider than w; w well below the capillary length.
 * - Source: Adamson & Gast, 6th ed., Ch. II; Butt, Graf & Kappl (2003) Ch. 2.
 */
export function slitMeniscus(input: SlitMeniscusInput): MeniscusResult<SlitMeniscusInput> {
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const w = requirePositive('gap', input.gap);
  const warnings: ModelWarning[] = [];
  smallRadiusWarning('gap', w, warnings);
  wettingWarnings(theta, warnings);
  const cos = theta === Math.PI / 2 ? 0 : Math.cos(theta);
  return {
    inputs: input,
    warnings,
    pressure: (2 * gamma * cos) / w,
    meniscusRadius: cos === 0 ? null : w / (2 * cos),
  };
}
