import { STANDARD_GRAVITY } from '../constants';
import type { ModelWarning } from '../errors';
import type { ResultBase } from '../api/model-spec';
import { requireFinite, requireInRange, requireNonNegative, requirePositive } from '../validate';
import { DEFAULT_CHECKPOINT_HEIGHTS, DEFAULT_CHECKPOINT_TIMES, readCheckpoints } from './checkpoints';
import { sinTilt, type TimeToHeight } from './capillary';
import { gravityHeightUnchecked, gravityRateUnchecked, gravityTimeUnchecked } from './gravity';

/**
 * Wicking into a porous strip (paper, nonwoven, fabric) dipped into a liquid, sharp-front (Green–Ampt) form.
 *
 * Darcy flow through the wetted length h behind a front at capillary pressure Pc, mass balance at the front:
 *   ε S dh/dt = (k/η)·(Pc/h − ρ g sin α)
 * so dh/dt = a/h − b with a = k Pc/(ε S η) and b = k ρ g sin α/(ε S η), solved in closed form (./gravity).
 * Symbols: k permeability of the wetted zone (m²); ε porosity (−); S liquid saturation behind the front (−,
 * default 1); η viscosity (Pa·s); Pc capillary pressure (Pa); ρ liquid density (kg/m³); g gravity (m/s²);
 * α tilt from horizontal (π/2 vertical). Equilibrium height (vertical) h_eq = Pc/(ρ g).
 * Uptake: mass m = ρ ε S w δ h, rate dm/dt = ρ ε S w δ·dh/dt, w strip width and δ thickness (m).
 *
 * A straight capillary is the special case k = r²/8, ε = S = 1, Pc = 2γ cos θ/r (exactly the capillary model).
 *
 * Validity: sharp front with uniform saturation behind it, rigid non-swelling medium, no evaporation from the
 * strip faces, liquid reservoir at the strip foot, Pc and k taken as constants of the material.
 * Sources: W. H. Green & G. A. Ampt, J. Agric. Sci. 4 (1911) 1–24 (sharp-front Darcy infiltration);
 * E. W. Washburn, Phys. Rev. 17 (1921) 273; N. Fries & M. Dreyer, J. Colloid Interface Sci. 320 (2008) 259;
 * H. Darcy, Les fontaines publiques de la ville de Dijon (1856).
 */

export interface PorousStripInput {
  /** Permeability of the wetted zone k, m². */
  readonly permeability: number;
  /** Porosity ε, 0 < ε ≤ 1. */
  readonly porosity: number;
  /** Capillary pressure Pc at the front, Pa (≤ 0: no spontaneous uptake). */
  readonly capillaryPressure: number;
  /** Dynamic viscosity η, Pa·s. */
  readonly viscosity: number;
  /** Liquid density ρ, kg/m³. */
  readonly density: number;
  /** Strip width w, m. */
  readonly width: number;
  /** Strip thickness δ, m. */
  readonly thickness: number;
  /** Saturation behind the front S, 0 < S ≤ 1 (default 1). */
  readonly saturation?: number;
  /** Gravitational acceleration g, m/s² (default 9.80665). */
  readonly gravity?: number;
  /** Tilt of the strip from horizontal α, rad, 0 … π/2 (default π/2, vertical). */
  readonly tilt?: number;
  /** Reading times, s (> 0; default 10, 30, 60, 300, 600 s). */
  readonly times?: readonly number[];
  /** Target wetted lengths along the strip, m (default 10, 20, 30 mm). */
  readonly heights?: readonly number[];
}

export interface StripAtTime {
  /** s */
  readonly time: number;
  /** Wetted length along the strip, m. */
  readonly height: number;
  /** Vertical rise h·sin α, m. */
  readonly verticalRise: number;
  /** Front speed dh/dt, m/s. */
  readonly velocity: number;
  /** Liquid taken up m = ρ ε S w δ h, kg. */
  readonly mass: number;
  /** Uptake rate dm/dt, kg/s. */
  readonly massRate: number;
}

export interface StripToHeight extends TimeToHeight {
  /** Liquid held when the front is at the target, kg. */
  readonly mass: number;
}

export type StripOrientation = 'horizontal' | 'inclined' | 'vertical';

export interface PorousStripOk extends ResultBase<PorousStripInput> {
  readonly status: 'ok';
  readonly orientation: StripOrientation;
  /** a = k Pc/(ε S η), m²/s. */
  readonly a: number;
  /** b = k ρ g sin α/(ε S η), m/s. */
  readonly b: number;
  /** h²/t of the horizontal (gravity-free) law, 2a, m²/s. */
  readonly washburnCoefficient: number;
  /** Early-time mass uptake per √time, m/√t = ρ ε S w δ √(2a), kg/s^½. */
  readonly massCoefficient: number;
  /** Liquid held per metre of wetted length ρ ε S w δ, kg/m. */
  readonly massPerLength: number;
  /** Equilibrium wetted length a/b along the strip, m; null when horizontal. */
  readonly equilibriumLength: number | null;
  /** Equilibrium vertical height Pc/(ρ g), m; null when g = 0. */
  readonly equilibriumHeight: number | null;
  /** t* = a/b², s; null when horizontal. */
  readonly characteristicTime: number | null;
  readonly atTimes: readonly StripAtTime[];
  readonly toHeights: readonly StripToHeight[];
}

export interface PorousStripNoUptake extends ResultBase<PorousStripInput> {
  readonly status: 'no-spontaneous-uptake';
}

export type PorousStripResult = PorousStripOk | PorousStripNoUptake;

export type PorousCoefficientsInput = Omit<PorousStripInput, 'width' | 'thickness' | 'times' | 'heights'>;

/**
 * Coefficients of dh/dt = a/h − b for Darcy flow behind a sharp front (Green & Ampt 1911 form):
 *   a = k Pc/(ε S η)  (m²/s),  b = k ρ g sin α/(ε S η)  (m/s).
 * a ≤ 0 (Pc ≤ 0) means no spontaneous uptake.
 *
 * Two call forms:
 * - `porousCoefficients({ permeability, porosity, capillaryPressure, viscosity, density, saturation?, gravity?,
 *   tilt? })`: validated SI inputs; S defaults to 1, g to 9.80665 m/s², α to π/2.
 * - `porousCoefficients(k, ε, S, η, Pc, ρ, g, sin α)`: hot-path form without checks; pass validated SI values.
 * @throws DomainError (object form) for invalid inputs.
 */
export function porousCoefficients(input: PorousCoefficientsInput): { a: number; b: number };
export function porousCoefficients(
  permeability: number,
  porosity: number,
  saturation: number,
  viscosity: number,
  capillaryPressure: number,
  density: number,
  gravity: number,
  sinAlpha: number,
): { a: number; b: number };
export function porousCoefficients(
  first: number | PorousCoefficientsInput,
  porosity = 0,
  saturation = 0,
  viscosity = 0,
  capillaryPressure = 0,
  density = 0,
  gravity = 0,
  sinAlpha = 0,
): { a: number; b: number } {
  if (typeof first === 'object' && first !== null) {
    return porousCoefficients(
      requirePositive('permeability', first.permeability),
      // ε = 1 is allowed: an open channel.
      requireInRange('porosity', first.porosity, 0, 1, { min: true }),
      requireInRange('saturation', first.saturation ?? 1, 0, 1, { min: true }),
      requirePositive('viscosity', first.viscosity),
      requireFinite('capillaryPressure', first.capillaryPressure),
      requirePositive('density', first.density),
      requireNonNegative('gravity', first.gravity ?? STANDARD_GRAVITY),
      sinTilt(requireInRange('tilt', first.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12)),
    );
  }
  const mobility = (first as number) / (porosity * saturation * viscosity);
  return { a: mobility * capillaryPressure, b: mobility * density * gravity * sinAlpha };
}

function orientationOf(tilt: number): StripOrientation {
  if (tilt === 0) return 'horizontal';
  if (Math.abs(tilt - Math.PI / 2) < 1e-12) return 'vertical';
  return 'inclined';
}

/**
 * Wicking in a porous strip: wetted length, mass and uptake rate at reading times, and time to target lengths.
 *
 * Equations and sources: module comment (Green & Ampt 1911; Washburn 1921; Fries & Dreyer 2008).
 * Targets at or beyond the equilibrium length are reported as not reached (time null) with a warning.
 * @throws DomainError for non-finite or out-of-range inputs.
 */
export function porousStripUptake(input: PorousStripInput): PorousStripResult {
  const permeability = requirePositive('permeability', input.permeability);
  // ε = 1 is allowed: an open channel (the capillary model is the case k = r²/8, ε = 1).
  const porosity = requireInRange('porosity', input.porosity, 0, 1, { min: true });
  const capillaryPressure = requireFinite('capillaryPressure', input.capillaryPressure);
  const viscosity = requirePositive('viscosity', input.viscosity);
  const density = requirePositive('density', input.density);
  const width = requirePositive('width', input.width);
  const thickness = requirePositive('thickness', input.thickness);
  const saturation = requireInRange('saturation', input.saturation ?? 1, 0, 1, { min: true });
  const gravity = requireNonNegative('gravity', input.gravity ?? STANDARD_GRAVITY);
  const tilt = requireInRange('tilt', input.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12);
  const times = readCheckpoints('times', input.times, DEFAULT_CHECKPOINT_TIMES, true);
  const heights = readCheckpoints('heights', input.heights, DEFAULT_CHECKPOINT_HEIGHTS);
  const inputs: PorousStripInput = {
    permeability,
    porosity,
    capillaryPressure,
    viscosity,
    density,
    width,
    thickness,
    saturation,
    gravity,
    tilt,
    times,
    heights,
  };

  if (capillaryPressure <= 0) {
    return {
      status: 'no-spontaneous-uptake',
      inputs,
      warnings: [
        {
          code: 'no-spontaneous-uptake',
          message: 'The capillary pressure is zero or negative: the liquid does not wick into the strip by itself.',
        },
      ],
    };
  }

  const s = sinTilt(tilt);
  const { a, b } = porousCoefficients(
    permeability,
    porosity,
    saturation,
    viscosity,
    capillaryPressure,
    density,
    gravity,
    s,
  );
  const massPerLength = density * porosity * saturation * width * thickness;
  const warnings: ModelWarning[] = [];

  const atTimes: StripAtTime[] = times.map((time) => {
    const height = gravityHeightUnchecked(a, b, time);
    const velocity = gravityRateUnchecked(a, b, height);
    return {
      time,
      height,
      verticalRise: height * s,
      velocity,
      mass: massPerLength * height,
      massRate: massPerLength * velocity,
    };
  });
  const toHeights: StripToHeight[] = heights.map((height) => {
    const time = gravityTimeUnchecked(a, b, height);
    return { height, reached: time !== null, time, mass: massPerLength * height };
  });

  const unreached = toHeights.filter((r) => !r.reached).map((r) => r.height);
  if (unreached.length > 0) {
    warnings.push({
      code: 'not-reached',
      message:
        `Not reached: ${unreached.map((h) => `${(h * 1000).toPrecision(3)} mm`).join(', ')} ` +
        `(at or beyond the equilibrium length ${((a / b) * 1000).toPrecision(4)} mm).`,
    });
  }
  if (saturation < 1) {
    warnings.push({
      code: 'partial-saturation',
      message:
        'Saturation below 1: the permeability entered should be the effective permeability at that ' +
        'saturation, not the saturated value.',
    });
  }

  return {
    status: 'ok',
    inputs,
    warnings,
    orientation: orientationOf(tilt),
    a,
    b,
    washburnCoefficient: 2 * a,
    massCoefficient: massPerLength * Math.sqrt(2 * a),
    massPerLength,
    equilibriumLength: b > 0 ? a / b : null,
    equilibriumHeight: gravity > 0 ? capillaryPressure / (density * gravity) : null,
    characteristicTime: b > 0 ? a / (b * b) : null,
    atTimes,
    toHeights,
  };
}
