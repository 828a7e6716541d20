import type { ResultBase } from '../api/model-spec';
import { GAS_CONSTANT, MOLAR_MASS_WATER } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { iapwsSurfaceTension, tanakaDensity, waterProperties } from '../liquids/water';
import { requireContactAngle, requireFraction, requirePositive } from '../validate';

/**
 * Kelvin equation: vapour pressure over a curved liquid surface.
 *
 * ln(p/p0) = γ Vm (1/R1 + 1/R2) / (R T), Vm = M/ρ
 *
 * with the radii positive for a convex surface (droplet). Sources: Thomson (Lord Kelvin), Phil. Mag.
 * 42 (1871) 448; Adamson & Gast, Physical Chemistry of Surfaces, 6th ed. (1997) Ch. III;
 * Butt, Graf & Kappl, Physics and Chemistry of Interfaces (2003) Ch. 2.
 */

/** Below this radius (m) the Kelvin equation is only approximate (common practice). */
export const KELVIN_NANOSCALE = 10e-9;

/** The liquid in a Kelvin calculation. Water at the temperature fills whatever is omitted. */
export interface KelvinLiquid {
  /** γ, N/m; water (IAPWS R1-76(2014)) at T when omitted. */
  readonly surfaceTension?: number;
  /** Vm, m³/mol; else M/ρ. */
  readonly molarVolume?: number;
  /** M, kg/mol; water 0.01801528 kg/mol when omitted. */
  readonly molarMass?: number;
  /** ρ, kg/m³; water (Tanaka 2001) at T when omitted. */
  readonly density?: number;
  /** T, K */
  readonly temperature: number;
}

interface ResolvedLiquid {
  readonly surfaceTension: number;
  readonly molarVolume: number;
  readonly temperature: number;
}

/** Fills omitted liquid properties with water at T; pushes the water-range warnings if water is used. */
function resolveLiquid(input: KelvinLiquid, warnings: ModelWarning[]): ResolvedLiquid {
  const T = requirePositive('temperature', input.temperature);
  const needsWater =
    input.surfaceTension === undefined ||
    (input.molarVolume === undefined && (input.density === undefined || input.molarMass === undefined));
  if (needsWater) {
    // Range checks and warnings for the water formulas.
    const w = waterProperties({ temperature: T });
    warnings.push(...w.warnings);
    warnings.push({
      code: 'water-defaults',
      message: 'Properties not given were taken for water at this temperature (IAPWS R1-76(2014), Tanaka et al. 2001).',
    });
  }
  const surfaceTension =
    input.surfaceTension === undefined ? iapwsSurfaceTension(T) : requirePositive('surfaceTension', input.surfaceTension);
  let molarVolume: number;
  if (input.molarVolume !== undefined) {
    molarVolume = requirePositive('molarVolume', input.molarVolume);
  } else {
    const M = input.molarMass === undefined ? MOLAR_MASS_WATER : requirePositive('molarMass', input.molarMass);
    const rho = input.density === undefined ? tanakaDensity(T) : requirePositive('density', input.density);
    molarVolume = M / rho;
  }
  return { surfaceTension, molarVolume, temperature: T };
}

function nanoscaleWarning(field: string, r: number, warnings: ModelWarning[]): void {
  if (r < KELVIN_NANOSCALE) {
    warnings.push({
      code: 'nanoscale',
      message: `${field} is below 10 nm: the Kelvin equation assumes bulk surface tension and a continuum meniscus, which is only approximate here.`,
    });
  }
}

export interface KelvinRatioResult<I> extends ResultBase<I> {
  /** p/p0, vapour pressure over the curved surface relative to a flat one. */
  readonly ratio: number;
  /** ln(p/p0) */
  readonly lnRatio: number;
  /** γ used, N/m */
  readonly surfaceTension: number;
  /** Vm used, m³/mol */
  readonly molarVolume: number;
}

export interface KelvinDropletInput extends KelvinLiquid {
  /** r, m: droplet radius. */
  readonly radius: number;
}

/**
 * Vapour pressure over a convex spherical droplet, relative to a flat surface.
 *
 * ln(p/p0) = 2γVm/(r R T)
 *
 * - γ: surface tension, N/m; Vm = M/ρ: molar volume, m³/mol; r: droplet radius, m;
 *   R = 8.314462618 J/(mol·K); T: temperature, K. p/p0 > 1.
 * - Validity: incompressible liquid, ideal vapour, bulk γ (approximate below about 10 nm).
 * - Source: Thomson, Phil. Mag. 42 (1871) 448; Adamson & Gast, 6th ed., Ch. III.
 */
export function kelvinDroplet(input: KelvinDropletInput): KelvinRatioResult<KelvinDropletInput> {
  const warnings: ModelWarning[] = [];
  const r = requirePositive('radius', input.radius);
  const liquid = resolveLiquid(input, warnings);
  nanoscaleWarning('radius', r, warnings);
  const lnRatio = (2 * liquid.surfaceTension * liquid.molarVolume) / (r * GAS_CONSTANT * liquid.temperature);
  const ratio = Math.exp(lnRatio);
  if (!Number.isFinite(ratio)) {
    throw new DomainError('out-of-range', 'The droplet is too small for the Kelvin equation: the vapour pressure ratio overflows.', 'radius');
  }
  return { inputs: input, warnings, ratio, lnRatio, surfaceTension: liquid.surfaceTension, molarVolume: liquid.molarVolume };
}

export interface KelvinMeniscusInput extends KelvinLiquid {
  /** r, m: pore (capillary) radius. */
  readonly radius: number;
  /** θ, rad */
  readonly contactAngle: number;
}

/**
 * Vapour pressure over the meniscus in a cylindrical pore (a spherical cap of radius r/cos θ,
 * concave for θ < 90°).
 *
 * ln(p/p0) = −2γVm cos θ/(r R T)
 *
 * - γ, Vm, R, T as {@link kelvinDroplet}; r: pore radius, m; θ: contact angle, rad (0–π).
 *   p/p0 < 1 for wetting liquids (θ < 90°), > 1 for non-wetting ones.
 * - Validity: as {@link kelvinDroplet}; hemispherical meniscus (r well below the capillary length).
 * - Source: Adamson & Gast, 6th ed., Ch. III and Ch. XVII (capillary condensation); Butt, Graf &
 *   Kappl (2003) Ch. 2.
 */
export function kelvinMeniscus(input: KelvinMeniscusInput): KelvinRatioResult<KelvinMeniscusInput> {
  const warnings: ModelWarning[] = [];
  const r = requirePositive('radius', input.radius);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const liquid = resolveLiquid(input, warnings);
  nanoscaleWarning('radius', r, warnings);
  const cos = theta === Math.PI / 2 ? 0 : Math.cos(theta);
  const lnRatio = (-2 * liquid.surfaceTension * liquid.molarVolume * cos) / (r * GAS_CONSTANT * liquid.temperature);
  const ratio = Math.exp(lnRatio);
  if (!Number.isFinite(ratio)) {
    throw new DomainError('out-of-range', 'The pore is too small for the Kelvin equation: the vapour pressure ratio overflows.', 'radius');
  }
  return { inputs: input, warnings, ratio, lnRatio, surfaceTension: liquid.surfaceTension, molarVolume: liquid.molarVolume };
}

export interface KelvinRadiusInput extends KelvinLiquid {
  /** RH = p/p0, strictly between 0 and 1. */
  readonly relativeHumidity: number;
  /** θ, rad */
  readonly contactAngle: number;
}

export interface KelvinRadiusResult extends ResultBase<KelvinRadiusInput> {
  /**
   * 'condensation': cylindrical pores of radius below `kelvinRadius` fill with condensed liquid;
   * 'no-condensation': θ ≥ 90°, the meniscus is not concave and pores do not fill below saturation.
   */
  readonly status: 'condensation' | 'no-condensation';
  /** r_K, m: pore radius in equilibrium at this RH; null when there is no condensation. */
  readonly kelvinRadius: number | null;
  readonly surfaceTension: number;
  readonly molarVolume: number;
}

/**
 * Kelvin radius: the largest cylindrical pore radius that fills by capillary condensation at a
 * relative humidity (for a hemispherical meniscus).
 *
 * r_K = −2γVm cos θ/(R T ln RH)
 *
 * - γ, Vm, R, T as {@link kelvinDroplet}; RH = p/p0 in (0, 1); θ: contact angle, rad.
 *   Note: some texts define the Kelvin radius as the mean radius of curvature γVm/(RT |ln RH|),
 *   half of this pore radius for θ = 0.
 * - Validity: θ < 90° (else status 'no-condensation'); no adsorbed film thickness correction
 *   (add the t-layer for pore sizing); approximate below about 10 nm.
 * - Source: Adamson & Gast, 6th ed., Ch. XVII; Butt, Graf & Kappl (2003) Ch. 2.
 */
export function kelvinRadius(input: KelvinRadiusInput): KelvinRadiusResult {
  const warnings: ModelWarning[] = [];
  const rh = requireFraction('relativeHumidity', input.relativeHumidity);
  const theta = requireContactAngle('contactAngle', input.contactAngle);
  const liquid = resolveLiquid(input, warnings);
  const base = { inputs: input, surfaceTension: liquid.surfaceTension, molarVolume: liquid.molarVolume };
  if (theta >= Math.PI / 2) {
    warnings.push({
      code: 'no-condensation',
      message: 'Contact angle of 90° or more: the meniscus is not concave, so pores do not fill by capillary condensation below saturation.',
    });
    return { ...base, warnings, status: 'no-condensation', kelvinRadius: null };
  }
  const rK = (-2 * liquid.surfaceTension * liquid.molarVolume * Math.cos(theta)) / (GAS_CONSTANT * liquid.temperature * Math.log(rh));
  if (!Number.isFinite(rK)) {
    throw new DomainError('out-of-range', 'The relative humidity is too close to 1 for a finite Kelvin radius.', 'relativeHumidity');
  }
  nanoscaleWarning('Kelvin radius', rK, warnings);
  return { ...base, warnings, status: 'condensation', kelvinRadius: rK };
}
