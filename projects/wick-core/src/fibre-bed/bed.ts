import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requireContactAngle, requireFraction, requirePositive } from '../validate';
import { blendFibres, type BlendComponent } from './blend';
import { readShapeFactor } from './fibre';

/**
 * Fibre-bed (web, pad, fabric) structure and its capillary and capacity estimates.
 *
 * Porosity from basis weight:  c = BW/(ρf t), ε = 1 − c
 *   BW basis weight (kg/m²), t thickness (m), ρf fibre density (kg/m³), c solid fraction.
 * Hydraulic radius (Carman's convention: pore volume / wetted surface):
 *   r_h = ε/((1 − ε)·S_v) = ε d/(4χ(1 − ε))
 *   S_v specific surface per volume of fibre (1/m), d equivalent round diameter (m), χ perimeter ratio.
 *   With this convention a round tube of radius r has r_h = r/2; the hydraulic diameter is 4 r_h.
 * Capillary pressure (Young–Laplace with the mean hydraulic radius): Pc = γ cos θ / r_h, which gives
 *   2γ cos θ/r for a round tube. From a measured pore diameter D (mean-flow pore of a porometer, or a mean
 *   pore diameter): Pc = 4γ cos θ/D (= 2γ cos θ/(D/2)).
 * Saturated capacity (all pores filled): per area C_A = ρ_l ε t (kg/m²); per mass of dry web
 *   C_m = ρ_l ε/(ρf (1 − ε)) = C_A/BW (kg/kg, numerically g/g).
 *
 * Validity: uniform isotropic web, rigid (no swelling, no collapse on wetting), liquid held only between
 * fibres (water absorbed inside cellulose fibres or superabsorbent is not counted), thickness measured under
 * a stated low pressure (nonwoven thickness methods use about 0.5 kPa for ordinary webs — from memory).
 * Sources: P. C. Carman, Trans. Inst. Chem. Eng. 15 (1937) 150 (hydraulic radius); A. E. Scheidegger, The Physics
 * of Flow through Porous Media, 3rd ed. (1974), ch. 6 (from memory); Young–Laplace, Adamson & Gast, Physical
 * Chemistry of Surfaces, 6th ed. (1997), §II-2 (from memory).
 */

export interface WebPorosityInput {
  /** Basis weight BW, kg/m² (1 g/m² = 0.001 kg/m²). */
  readonly basisWeight: number;
  /** Thickness t, m. */
  readonly thickness: number;
  /** Fibre (or blend) density ρf, kg/m³. */
  readonly fibreDensity: number;
}

export interface WebPorosityResult extends ResultBase<WebPorosityInput> {
  /** ε = 1 − BW/(ρf t). */
  readonly porosity: number;
  /** c = BW/(ρf t). */
  readonly solidFraction: number;
}

/**
 * Porosity of a web from basis weight, thickness and fibre density: ε = 1 − BW/(ρf t) (exact mass balance).
 * @throws DomainError 'out-of-range' when BW/(ρf t) ≥ 1 (the web would be denser than its fibres).
 */
export function webPorosity(input: WebPorosityInput): WebPorosityResult {
  const basisWeight = requirePositive('basisWeight', input.basisWeight);
  const thickness = requirePositive('thickness', input.thickness);
  const fibreDensity = requirePositive('fibreDensity', input.fibreDensity);
  const solidFraction = basisWeight / (fibreDensity * thickness);
  if (solidFraction >= 1) {
    throw new DomainError(
      'out-of-range',
      `Basis weight ${(basisWeight * 1000).toPrecision(4)} g/m² in ${(thickness * 1000).toPrecision(4)} mm ` +
        'would be denser than the fibre itself: check the thickness, its unit and the fibre density.',
      'thickness',
      { solidFraction },
    );
  }
  const warnings: ModelWarning[] = [];
  if (solidFraction > 0.6) {
    warnings.push({
      code: 'dense-web',
      message:
        `Solid fraction ${solidFraction.toFixed(3)} is unusually high for a fibrous web: check that the ` +
        'thickness was measured under a low, stated pressure.',
    });
  }
  return { inputs: { basisWeight, thickness, fibreDensity }, warnings, porosity: 1 - solidFraction, solidFraction };
}

/**
 * Hydraulic radius r_h = ε d/(4χ(1 − ε)), m (Carman 1937 convention: pore volume / wetted area).
 * @param porosity ε in (0, 1). @param diameter equivalent round fibre diameter d, m. @param shapeFactor χ ≥ 1.
 */
export function hydraulicRadius(porosity: number, diameter: number, shapeFactor = 1): number {
  requireFraction('porosity', porosity);
  requirePositive('diameter', diameter);
  const chi = readShapeFactor('shapeFactor', shapeFactor);
  return (porosity * diameter) / (4 * chi * (1 - porosity));
}

/**
 * Hydraulic radius from the fibres' specific surface: r_h = ε/((1 − ε) S_v), m (Carman 1937).
 * @param porosity ε in (0, 1). @param specificSurfaceVolume S_v per volume of fibre, 1/m.
 */
export function hydraulicRadiusFromSurface(porosity: number, specificSurfaceVolume: number): number {
  requireFraction('porosity', porosity);
  requirePositive('specificSurfaceVolume', specificSurfaceVolume);
  return porosity / ((1 - porosity) * specificSurfaceVolume);
}

/**
 * Capillary pressure Pc = γ cos θ / r_h, Pa (Young–Laplace with the hydraulic radius; 2γ cos θ/r for a tube).
 * Negative for θ > 90° (pressure needed to push the liquid in).
 * @param surfaceTension γ, N/m. @param contactAngle θ, rad. @param hydraulicRadiusM r_h, m.
 */
export function capillaryPressureFromHydraulicRadius(
  surfaceTension: number,
  contactAngle: number,
  hydraulicRadiusM: number,
): number {
  requirePositive('surfaceTension', surfaceTension);
  requireContactAngle('contactAngle', contactAngle);
  requirePositive('hydraulicRadius', hydraulicRadiusM);
  return (surfaceTension * Math.cos(contactAngle)) / hydraulicRadiusM;
}

/**
 * Capillary pressure from a measured pore diameter D (e.g. mean-flow pore diameter): Pc = 4γ cos θ/D, Pa
 * (Young–Laplace for a cylindrical pore of radius D/2).
 */
export function capillaryPressureFromPoreDiameter(
  surfaceTension: number,
  contactAngle: number,
  poreDiameter: number,
): number {
  requirePositive('surfaceTension', surfaceTension);
  requireContactAngle('contactAngle', contactAngle);
  requirePositive('poreDiameter', poreDiameter);
  return (4 * surfaceTension * Math.cos(contactAngle)) / poreDiameter;
}

/**
 * Saturated capacity: per area C_A = ρ_l ε t (kg/m²) and per dry mass C_m = ρ_l ε/(ρf (1 − ε)) (kg/kg).
 * @param porosity ε. @param thickness t, m. @param fibreDensity ρf, kg/m³. @param liquidDensity ρ_l, kg/m³.
 */
export function saturatedCapacity(
  porosity: number,
  thickness: number,
  fibreDensity: number,
  liquidDensity: number,
): { perArea: number; perMass: number } {
  requireFraction('porosity', porosity);
  requirePositive('thickness', thickness);
  requirePositive('fibreDensity', fibreDensity);
  requirePositive('liquidDensity', liquidDensity);
  return {
    perArea: liquidDensity * porosity * thickness,
    perMass: (liquidDensity * porosity) / (fibreDensity * (1 - porosity)),
  };
}

export interface FibreBedInput {
  /** Basis weight BW, kg/m². */
  readonly basisWeight: number;
  /** Thickness t, m (state the measuring pressure with the material). */
  readonly thickness: number;
  /** Fibre components by mass fraction (one component for a single fibre). */
  readonly fibres: readonly BlendComponent[];
  /** Liquid surface tension γ, N/m (optional: enables Pc). */
  readonly surfaceTension?: number;
  /** Contact angle θ, rad (default 0 when surfaceTension is given). */
  readonly contactAngle?: number;
  /** Liquid density ρ_l, kg/m³ (optional: enables capacity). */
  readonly liquidDensity?: number;
  /** Measured pore diameter D, m (optional: Pc = 4γ cos θ/D for comparison). */
  readonly poreDiameter?: number;
}

export interface FibreBedResult extends ResultBase<FibreBedInput> {
  readonly porosity: number;
  readonly solidFraction: number;
  /** Blend fibre density, kg/m³. */
  readonly fibreDensity: number;
  /** Surface-equivalent fibre diameter 4/S_v, m. */
  readonly equivalentDiameter: number;
  /** Specific surface per volume of fibre, 1/m. */
  readonly specificSurfaceVolume: number;
  /** Specific surface per mass of fibre, m²/kg. */
  readonly specificSurfaceMass: number;
  /** Wetted surface per volume of bed (1 − ε) S_v, 1/m. */
  readonly bedSpecificSurface: number;
  /** r_h = ε/((1 − ε) S_v), m. */
  readonly hydraulicRadius: number;
  /** γ cos θ / r_h, Pa; null without surface tension. */
  readonly capillaryPressure: number | null;
  /** 4γ cos θ/D from the measured pore diameter, Pa; null without it. */
  readonly capillaryPressureFromPores: number | null;
  /** ρ_l ε t, kg/m²; null without liquid density. */
  readonly capacityPerArea: number | null;
  /** ρ_l ε/(ρf (1 − ε)), kg/kg; null without liquid density. */
  readonly capacityPerMass: number | null;
}

/**
 * Structure, capillary pressure and saturated capacity of a fibre web from basis weight, thickness and its
 * fibre blend. Equations and sources in the module comment.
 */
export function fibreBed(input: FibreBedInput): FibreBedResult {
  const blend = blendFibres(input.fibres);
  const web = webPorosity({
    basisWeight: input.basisWeight,
    thickness: input.thickness,
    fibreDensity: blend.fibreDensity,
  });
  const warnings: ModelWarning[] = [...blend.warnings, ...web.warnings];
  const porosity = web.porosity;
  const rh = hydraulicRadiusFromSurface(porosity, blend.specificSurfaceVolume);

  let capillaryPressure: number | null = null;
  let capillaryPressureFromPores: number | null = null;
  const surfaceTension = input.surfaceTension === undefined ? undefined : requirePositive('surfaceTension', input.surfaceTension);
  const contactAngle = input.contactAngle === undefined ? undefined : requireContactAngle('contactAngle', input.contactAngle);
  const poreDiameter = input.poreDiameter === undefined ? undefined : requirePositive('poreDiameter', input.poreDiameter);
  if (surfaceTension !== undefined) {
    const theta = contactAngle ?? 0;
    capillaryPressure = capillaryPressureFromHydraulicRadius(surfaceTension, theta, rh);
    if (poreDiameter !== undefined) {
      capillaryPressureFromPores = capillaryPressureFromPoreDiameter(surfaceTension, theta, poreDiameter);
    }
    if (theta >= Math.PI / 2 - 1e-9) {
      warnings.push({
        code: 'non-wetting',
        message: 'Contact angle 90° or more: the web does not take up this liquid by itself (Pc ≤ 0).',
      });
    }
  } else if (poreDiameter !== undefined) {
    warnings.push({ code: 'pc-not-computed', message: 'Give the surface tension to turn the pore diameter into a pressure.' });
  }

  let capacityPerArea: number | null = null;
  let capacityPerMass: number | null = null;
  const liquidDensity = input.liquidDensity === undefined ? undefined : requirePositive('liquidDensity', input.liquidDensity);
  if (liquidDensity !== undefined) {
    const cap = saturatedCapacity(porosity, web.inputs.thickness, blend.fibreDensity, liquidDensity);
    capacityPerArea = cap.perArea;
    capacityPerMass = cap.perMass;
  }

  return {
    inputs: {
      basisWeight: web.inputs.basisWeight,
      thickness: web.inputs.thickness,
      fibres: blend.inputs.components,
      surfaceTension,
      contactAngle,
      liquidDensity,
      poreDiameter,
    },
    warnings,
    porosity,
    solidFraction: web.solidFraction,
    fibreDensity: blend.fibreDensity,
    equivalentDiameter: blend.equivalentDiameter,
    specificSurfaceVolume: blend.specificSurfaceVolume,
    specificSurfaceMass: blend.specificSurfaceMass,
    bedSpecificSurface: (1 - porosity) * blend.specificSurfaceVolume,
    hydraulicRadius: rh,
    capillaryPressure,
    capillaryPressureFromPores,
    capacityPerArea,
    capacityPerMass,
  };
}
