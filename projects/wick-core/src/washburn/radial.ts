import type { ModelWarning } from '../errors';
import type { ResultBase } from '../api/model-spec';
import { DomainError } from '../errors';
import { lambertW0PlusOneInverse, lambertW0PlusOneUnchecked } from '../numeric/lambert-w';
import { requireFinite, requireFraction, requireInRange, requireNonNegative, requirePositive } from '../validate';
import { DEFAULT_CHECKPOINT_TIMES, readCheckpoints } from './checkpoints';

/**
 * Radial in-plane spreading in a thin horizontal porous sheet from a wetted spot of radius r0 that is kept
 * supplied with liquid at ambient pressure (unlimited reservoir).
 *
 * Derivation (quasi-steady Darcy flow in the annulus r0 < r < R, sharp front at capillary pressure Pc):
 *   volumetric flow per thickness Q/δ = 2π (k/η) Pc / ln(R/r0),
 *   front balance ε S · 2π R · dR/dt = Q/δ  ⇒  ε S R ln(R/r0) dR/dt = k Pc/η.
 * Integrating from R = r0 at t = 0:
 *   R² ln(R/r0) − (R² − r0²)/2 = 2 k Pc t/(ε S η) = 2 a t,   a = k Pc/(ε S η) (the strip model's a).
 * This is the unlimited-reservoir law of Marmur (1988) and Danino & Marmur (1994) (citation details from
 * memory). It has an explicit solution: with u = 2 ln(R/r0), 1 + (u − 1)eᵘ = 4at/r0², so
 *   R = r0 · exp(½·[1 + W₀((4at/r0² − 1)/e)])
 * (Lambert W, principal branch). Early times: (R − r0)² → 2at, the planar Washburn law; late times
 * R² (2 ln(R/r0) − 1) ≈ 4at.
 *
 * Symbols: k permeability (m²), ε porosity, S saturation behind the front (default 1), η viscosity (Pa·s),
 * Pc capillary pressure (Pa), r0 source radius (m), R wetted radius (m), t time (s).
 * Validity: thin isotropic sheet (thickness ≪ r0), gravity and evaporation negligible, the source keeps the
 * spot at ambient pressure (a limited drop gives a different law), rigid medium.
 * Sources: A. Marmur, J. Colloid Interface Sci. 124 (1988) 301–308; D. Danino & A. Marmur, J. Colloid
 * Interface Sci. 166 (1994) 245–250; see also A. Borhan & K. K. Rungta, J. Colloid Interface Sci. 158 (1993)
 * 403–411 (all from memory).
 */

/** Wetted radius R(t) without checks: a > 0 (m²/s), r0 > 0 (m), t ≥ 0 (s). */
export function radialRadiusUnchecked(a: number, r0: number, t: number): number {
  if (t === 0) return r0;
  const q = (4 * a * t) / (r0 * r0);
  return r0 * Math.exp(lambertW0PlusOneUnchecked(q) / 2);
}

/** Time to reach radius R ≥ r0 without checks, s. */
export function radialTimeUnchecked(a: number, r0: number, radius: number): number {
  const u = 2 * Math.log1p((radius - r0) / r0);
  return (lambertW0PlusOneInverse(u) * r0 * r0) / (4 * a);
}

/**
 * Wetted radius at time t for radial spreading from a fed spot of radius r0:
 * R² ln(R/r0) − (R² − r0²)/2 = 2at, solved explicitly with Lambert W (see module comment).
 * @param a k Pc/(ε S η), m²/s (> 0). @param r0 source radius, m (> 0). @param t time, s (≥ 0).
 * @returns R in m (≥ r0).
 */
export function radialRadius(a: number, r0: number, t: number): number {
  requirePositive('a', a);
  requirePositive('sourceRadius', r0);
  requireNonNegative('t', t);
  const r = radialRadiusUnchecked(a, r0, t);
  if (!Number.isFinite(r)) {
    throw new DomainError('out-of-range', 'The wetted radius is too large to represent; check the units.', 't');
  }
  return r;
}

/**
 * Time for the front to reach radius R: t = [R² ln(R/r0) − (R² − r0²)/2]/(2a), evaluated without cancellation
 * near R = r0. @param a m²/s (> 0). @param r0 m (> 0). @param radius R, m (≥ r0). @returns t in s.
 */
export function radialTime(a: number, r0: number, radius: number): number {
  requirePositive('a', a);
  requirePositive('sourceRadius', r0);
  requireFinite('radius', radius);
  if (radius < r0) {
    throw new DomainError(
      'out-of-range',
      `The target radius (${radius} m) must not be smaller than the wetted source radius (${r0} m).`,
      'radius',
    );
  }
  const t = radialTimeUnchecked(a, r0, radius);
  if (!Number.isFinite(t)) {
    throw new DomainError('out-of-range', 'The time is too large to represent; check the units.', 'radius');
  }
  return t;
}

export interface RadialSpreadInput {
  /** Permeability k, m². */
  readonly permeability: number;
  /** Porosity ε, 0 < ε < 1. */
  readonly porosity: number;
  /** Capillary pressure Pc, Pa. */
  readonly capillaryPressure: number;
  /** Dynamic viscosity η, Pa·s. */
  readonly viscosity: number;
  /** Radius of the fed wetted spot r0, m. */
  readonly sourceRadius: number;
  /** Saturation behind the front S, 0 < S ≤ 1 (default 1). */
  readonly saturation?: number;
  /** Sheet thickness δ, m (optional: enables mass). */
  readonly thickness?: number;
  /** Liquid density ρ, kg/m³ (optional: enables mass). */
  readonly density?: number;
  /** Reading times, s (> 0; default 10, 30, 60, 300, 600 s). */
  readonly times?: readonly number[];
  /** Target wetted radii, m (≥ r0; default 10, 25, 50 mm). */
  readonly radii?: readonly number[];
}

export interface RadialAtTime {
  readonly time: number;
  /** Wetted radius R, m. */
  readonly radius: number;
  /** Front speed dR/dt = a/(R ln(R/r0)), m/s. */
  readonly velocity: number;
  /** Wetted area outside the source π(R² − r0²), m². */
  readonly area: number;
  /** Liquid in that ring ρ ε S δ·area, kg; null without thickness and density. */
  readonly mass: number | null;
}

export interface RadialToRadius {
  readonly radius: number;
  readonly time: number;
}

export interface RadialSpreadOk extends ResultBase<RadialSpreadInput> {
  readonly status: 'ok';
  /** a = k Pc/(ε S η), m²/s. */
  readonly a: number;
  readonly atTimes: readonly RadialAtTime[];
  readonly toRadii: readonly RadialToRadius[];
}

export interface RadialSpreadNoUptake extends ResultBase<RadialSpreadInput> {
  readonly status: 'no-spontaneous-uptake';
}

export type RadialSpreadResult = RadialSpreadOk | RadialSpreadNoUptake;

/** Default target radii, m: 10, 25, 50 mm (the last a 100 mm circle). */
export const DEFAULT_TARGET_RADII: readonly number[] = [0.01, 0.025, 0.05];

/**
 * Radial spreading from a fed spot: wetted radius, area and mass at reading times; time to target radii.
 * Equations and sources: module comment (Marmur 1988; Danino & Marmur 1994 — from memory).
 * @throws DomainError for invalid input, or target radii smaller than the source.
 */
export function radialSpreading(input: RadialSpreadInput): RadialSpreadResult {
  const permeability = requirePositive('permeability', input.permeability);
  const porosity = requireFraction('porosity', input.porosity);
  const capillaryPressure = requireFinite('capillaryPressure', input.capillaryPressure);
  const viscosity = requirePositive('viscosity', input.viscosity);
  const sourceRadius = requirePositive('sourceRadius', input.sourceRadius);
  const saturation = requireInRange('saturation', input.saturation ?? 1, 0, 1, { min: true });
  const thickness = input.thickness === undefined ? undefined : requirePositive('thickness', input.thickness);
  const density = input.density === undefined ? undefined : requirePositive('density', input.density);
  const times = readCheckpoints('times', input.times, DEFAULT_CHECKPOINT_TIMES, true);
  const radii = readCheckpoints('radii', input.radii, DEFAULT_TARGET_RADII, true);
  radii.forEach((r, i) => {
    if (r < sourceRadius) {
      throw new DomainError(
        'out-of-range',
        `radii[${i}] (${r} m) is smaller than the wetted source radius (${sourceRadius} m).`,
        `radii[${i}]`,
      );
    }
  });
  const inputs: RadialSpreadInput = {
    permeability,
    porosity,
    capillaryPressure,
    viscosity,
    sourceRadius,
    saturation,
    thickness,
    density,
    times,
    radii,
  };
  if (capillaryPressure <= 0) {
    return {
      status: 'no-spontaneous-uptake',
      inputs,
      warnings: [
        {
          code: 'no-spontaneous-uptake',
          message: 'The capillary pressure is zero or negative: the liquid does not spread into the sheet by itself.',
        },
      ],
    };
  }
  const a = (permeability * capillaryPressure) / (porosity * saturation * viscosity);
  const massPerArea =
    thickness !== undefined && density !== undefined ? density * porosity * saturation * thickness : null;
  const warnings: ModelWarning[] = [];
  if (massPerArea === null) {
    warnings.push({ code: 'mass-not-computed', message: 'Give thickness and density to get the liquid mass.' });
  }
  const atTimes: RadialAtTime[] = times.map((time) => {
    const radius = radialRadiusUnchecked(a, sourceRadius, time);
    const area = Math.PI * (radius - sourceRadius) * (radius + sourceRadius);
    return {
      time,
      radius,
      velocity: a / (radius * Math.log1p((radius - sourceRadius) / sourceRadius)),
      area,
      mass: massPerArea === null ? null : massPerArea * area,
    };
  });
  const toRadii: RadialToRadius[] = radii.map((radius) => ({
    radius,
    time: radialTimeUnchecked(a, sourceRadius, radius),
  }));
  return { status: 'ok', inputs, warnings, a, atTimes, toRadii };
}
