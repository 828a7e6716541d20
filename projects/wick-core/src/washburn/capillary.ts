import { STANDARD_GRAVITY } from '../constants';
import type { ModelWarning } from '../errors';
import type { ResultBase } from '../api/model-spec';
import {
  requireContactAngle,
  requireInRange,
  requireNonNegative,
  requirePositive,
} from '../validate';
import { DEFAULT_CHECKPOINT_HEIGHTS, DEFAULT_CHECKPOINT_TIMES, readCheckpoints } from './checkpoints';
import { gravityHeightUnchecked, gravityRateUnchecked, gravityTimeUnchecked } from './gravity';
import { bosanquetRatio } from './inertia';

/**
 * Lucas–Washburn uptake in a single round capillary, with gravity along a tilted tube.
 *
 * Poiseuille flow behind a meniscus of constant contact angle:
 *   dh/dt = a/h − b,  a = γ r cos θ/(4η),  b = ρ g r² sin α/(8η)
 * h: wetted length along the tube axis (m); γ: surface tension (N/m); r: tube radius (m); θ: contact angle;
 * η: dynamic viscosity (Pa·s); ρ: liquid density (kg/m³); g: gravity (m/s²); α: tilt from horizontal
 * (α = π/2 vertical, 0 horizontal).
 * Horizontal: h² = (r γ cos θ/(2η))·t (Washburn 1921; Lucas 1918). With gravity: the explicit solution of
 * Fries & Dreyer (2008), see ./gravity. Equilibrium length a/b; its vertical projection is Jurin's height
 * 2γ cos θ/(ρ g r).
 *
 * Validity: viscous regime (t ≫ τ = ρ r²/(8η), Bosanquet 1923), narrow tube (meniscus close to a spherical cap,
 * r ≪ capillary length √(γ/(ρ g))), no evaporation, no swelling, constant θ. θ ≥ 90° gives no spontaneous
 * uptake. Sources: R. Lucas, Kolloid-Z. 23 (1918) 15; E. W. Washburn, Phys. Rev. 17 (1921) 273;
 * N. Fries & M. Dreyer, J. Colloid Interface Sci. 320 (2008) 259; J. Jurin, Phil. Trans. 30 (1718) 739.
 */

export interface CapillaryUptakeInput {
  /** Tube radius r, m. */
  readonly radius: number;
  /** Surface tension γ, N/m. */
  readonly surfaceTension: number;
  /** Dynamic viscosity η, Pa·s. */
  readonly viscosity: number;
  /** Static contact angle θ, rad. */
  readonly contactAngle: number;
  /** Liquid density ρ, kg/m³. */
  readonly density: number;
  /** Gravitational acceleration g, m/s² (default standard gravity 9.80665). */
  readonly gravity?: number;
  /** Tilt of the tube from horizontal α, rad, 0 … π/2 (default π/2: vertical rise). */
  readonly tilt?: number;
  /** Reading times, s (default 10, 30, 60, 300, 600 s). */
  readonly times?: readonly number[];
  /** Target wetted lengths along the tube, m (default 10, 20, 30 mm). */
  readonly heights?: readonly number[];
}

export interface UptakeAtTime {
  /** s */
  readonly time: number;
  /** Wetted length along the axis, m. */
  readonly height: number;
  /** Vertical rise h·sin α, m. */
  readonly verticalRise: number;
  /** Front speed dh/dt, m/s; null at t = 0 (unbounded there). */
  readonly velocity: number | null;
}

export interface TimeToHeight {
  /** Target wetted length along the axis, m. */
  readonly height: number;
  /** false when the target lies at or beyond the equilibrium length. */
  readonly reached: boolean;
  /** s; null when not reached. */
  readonly time: number | null;
}

export interface CapillaryUptakeOk extends ResultBase<CapillaryUptakeInput> {
  readonly status: 'ok';
  /** a = γ r cos θ/(4η), m²/s. */
  readonly a: number;
  /** b = ρ g r² sin α/(8η), m/s. */
  readonly b: number;
  /** Washburn coefficient h²/t = 2a = r γ cos θ/(2η) of the horizontal law, m²/s. */
  readonly washburnCoefficient: number;
  /** Capillary pressure 2γ cos θ/r, Pa (Young–Laplace). */
  readonly capillaryPressure: number;
  /** Equilibrium length along the tube a/b, m; null when horizontal (no limit). */
  readonly equilibriumLength: number | null;
  /** Jurin height 2γ cos θ/(ρ g r), m: the vertical projection of the equilibrium length; null when g = 0. */
  readonly jurinHeight: number | null;
  /** t* = a/b², s; null when horizontal. */
  readonly characteristicTime: number | null;
  /** Bosanquet viscous–inertial time ρ r²/(8η), s. */
  readonly inertialTime: number;
  readonly atTimes: readonly UptakeAtTime[];
  readonly toHeights: readonly TimeToHeight[];
}

export interface CapillaryNoUptake extends ResultBase<CapillaryUptakeInput> {
  readonly status: 'no-spontaneous-uptake';
  /** 2γ cos θ/r, Pa (≤ 0): the pressure that would have to be applied to push liquid in. */
  readonly capillaryPressure: number;
}

export type CapillaryUptakeResult = CapillaryUptakeOk | CapillaryNoUptake;

/** Contact angles within this margin of 90° count as 90° (cos θ ≈ 6e-17 at the double nearest π/2). */
const RIGHT_ANGLE_MARGIN = 1e-9;
/** Warn when the Bosanquet factor lowers h by more than this fraction at a reading. */
const INERTIAL_TOLERANCE = 0.01;
/** Warn when Rayleigh's meniscus correction r/3 exceeds this fraction of the Jurin height. */
const MENISCUS_TOLERANCE = 0.01;

/** Whether a contact angle allows spontaneous capillary uptake (θ < 90°). */
export function isWetting(contactAngle: number): boolean {
  return contactAngle < Math.PI / 2 - RIGHT_ANGLE_MARGIN;
}

export type CapillaryCoefficientsInput = Omit<CapillaryUptakeInput, 'times' | 'heights'>;

/**
 * Coefficients of dh/dt = a/h − b for a round capillary (Washburn 1921; gravity term as in Fries & Dreyer 2008):
 *   a = γ r cos θ/(4η)  (m²/s),  b = ρ g r² sin α/(8η)  (m/s).
 * a ≤ 0 (θ ≥ 90°) means no spontaneous uptake.
 *
 * Two call forms:
 * - `capillaryCoefficients({ radius, surfaceTension, viscosity, contactAngle, density, gravity?, tilt? })`:
 *   validated SI inputs, angles in radians; gravity defaults to 9.80665 m/s², tilt to π/2 (vertical).
 * - `capillaryCoefficients(r, γ, η, cos θ, ρ, g, sin α)`: hot-path form without checks (called per pore class);
 *   pass validated SI values.
 * @throws DomainError (object form) for invalid inputs.
 */
export function capillaryCoefficients(input: CapillaryCoefficientsInput): { a: number; b: number };
export function capillaryCoefficients(
  radius: number,
  surfaceTension: number,
  viscosity: number,
  cosTheta: number,
  density: number,
  gravity: number,
  sinAlpha: number,
): { a: number; b: number };
export function capillaryCoefficients(
  first: number | CapillaryCoefficientsInput,
  surfaceTension = 0,
  viscosity = 0,
  cosTheta = 0,
  density = 0,
  gravity = 0,
  sinAlpha = 0,
): { a: number; b: number } {
  if (typeof first === 'object' && first !== null) {
    const radius = requirePositive('radius', first.radius);
    const gamma = requirePositive('surfaceTension', first.surfaceTension);
    const eta = requirePositive('viscosity', first.viscosity);
    const theta = requireContactAngle('contactAngle', first.contactAngle);
    const rho = requirePositive('density', first.density);
    const g = requireNonNegative('gravity', first.gravity ?? STANDARD_GRAVITY);
    const tilt = requireInRange('tilt', first.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12);
    return capillaryCoefficients(radius, gamma, eta, Math.cos(theta), rho, g, sinTilt(tilt));
  }
  const radius = first as number;
  return {
    a: (surfaceTension * radius * cosTheta) / (4 * viscosity),
    b: (density * gravity * radius * radius * sinAlpha) / (8 * viscosity),
  };
}

/** sin α, exact at the two ends users type most (0° and 90°). */
export function sinTilt(tilt: number): number {
  if (tilt === 0) return 0;
  if (Math.abs(tilt - Math.PI / 2) < 1e-12) return 1;
  return Math.sin(tilt);
}

/**
 * Capillary uptake in a round tube: wetted length at given times and time to given lengths.
 *
 * Equations: see the module comment (Washburn 1921; Fries & Dreyer 2008; Jurin 1718).
 * Warnings: 'inertial-regime' when Bosanquet's (1923) inertial correction changes h by more than 1 % at a
 * reading; 'wide-capillary' when Rayleigh's meniscus correction r/3 (Adamson & Gast, Physical Chemistry of
 * Surfaces, §II-2, from memory) exceeds 1 % of the Jurin height; 'not-reached' for targets beyond equilibrium.
 * θ ≥ 90°: status 'no-spontaneous-uptake', no numbers.
 * @throws DomainError for non-finite or out-of-range inputs.
 */
export function capillaryUptake(input: CapillaryUptakeInput): CapillaryUptakeResult {
  const radius = requirePositive('radius', input.radius);
  const surfaceTension = requirePositive('surfaceTension', input.surfaceTension);
  const viscosity = requirePositive('viscosity', input.viscosity);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const density = requirePositive('density', input.density);
  const gravity = requireNonNegative('gravity', input.gravity ?? STANDARD_GRAVITY);
  const tilt = requireInRange('tilt', input.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12);
  const times = readCheckpoints('times', input.times, DEFAULT_CHECKPOINT_TIMES);
  const heights = readCheckpoints('heights', input.heights, DEFAULT_CHECKPOINT_HEIGHTS);
  const inputs: CapillaryUptakeInput = {
    radius,
    surfaceTension,
    viscosity,
    contactAngle: theta,
    density,
    gravity,
    tilt,
    times,
    heights,
  };
  const cosTheta = Math.cos(theta);
  const capillaryPressure = (2 * surfaceTension * cosTheta) / radius;

  if (!isWetting(theta)) {
    return {
      status: 'no-spontaneous-uptake',
      inputs,
      capillaryPressure: Math.min(capillaryPressure, 0),
      warnings: [
        {
          code: 'no-spontaneous-uptake',
          message:
            'The contact angle is 90° or more: the liquid does not enter the capillary by itself ' +
            '(a pressure of at least −2γ cos θ / r would be needed).',
        },
      ],
    };
  }

  const s = sinTilt(tilt);
  const { a, b } = capillaryCoefficients(radius, surfaceTension, viscosity, cosTheta, density, gravity, s);
  const tau = (density * radius * radius) / (8 * viscosity);
  const warnings: ModelWarning[] = [];

  const atTimes: UptakeAtTime[] = times.map((time) => {
    const height = gravityHeightUnchecked(a, b, time);
    return {
      time,
      height,
      verticalRise: height * s,
      velocity: time === 0 ? null : gravityRateUnchecked(a, b, height),
    };
  });
  const toHeights: TimeToHeight[] = heights.map((height) => {
    const time = gravityTimeUnchecked(a, b, height);
    return { height, reached: time !== null, time };
  });

  const unreached = toHeights.filter((r) => !r.reached).map((r) => r.height);
  if (unreached.length > 0) {
    warnings.push({
      code: 'not-reached',
      message: `Not reached: ${unreached.map((h) => `${(h * 1000).toPrecision(3)} mm`).join(', ')} ` +
        `(at or beyond the equilibrium length ${((a / b) * 1000).toPrecision(4)} mm).`,
    });
  }

  // Earliest positive moment the result is read at: the inertial correction is largest there.
  const moments = [...times, ...toHeights.map((r) => r.time ?? Number.POSITIVE_INFINITY)].filter((t) => t > 0);
  if (moments.length > 0) {
    const tMin = Math.min(...moments);
    const ratio = bosanquetRatio(tMin, tau);
    if (1 - ratio > INERTIAL_TOLERANCE) {
      warnings.push({
        code: 'inertial-regime',
        message:
          `At ${tMin.toPrecision(3)} s the liquid is still accelerating: the inertial time ρr²/(8η) = ` +
          `${tau.toPrecision(3)} s is not small against it (Bosanquet 1923), so the viscous Washburn length ` +
          `is about ${((1 / ratio - 1) * 100).toPrecision(2)} % too long there.`,
      });
    }
  }

  const jurinHeight = gravity > 0 ? (2 * surfaceTension * cosTheta) / (density * gravity * radius) : 0;
  if (gravity > 0 && s > 0 && radius / 3 > MENISCUS_TOLERANCE * jurinHeight) {
    warnings.push({
      code: 'wide-capillary',
      message:
        'The tube is wide against the capillary length √(γ/(ρg)): the meniscus is not a spherical cap and ' +
        'the rise height differs from Jurin’s law by more than 1 % (Rayleigh’s correction r/3).',
    });
  }

  return {
    status: 'ok',
    inputs,
    warnings,
    a,
    b,
    washburnCoefficient: 2 * a,
    capillaryPressure,
    equilibriumLength: b > 0 ? a / b : null,
    jurinHeight: gravity > 0 ? jurinHeight : null,
    characteristicTime: b > 0 ? a / (b * b) : null,
    inertialTime: tau,
    atTimes,
    toHeights,
  };
}
