import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requireFraction, requireInRange, requirePositive } from '../validate';
import { fitPoreSizeRetention } from './pore-size-fit';
import { BrooksCoreyBurdine, VanGenuchtenMualem, type HydraulicFunctions } from './retention';
import type { RetentionInput, StackLayerInput, StackLiquidInput } from './types';

/** Checked liquid properties. */
export interface CheckedLiquid {
  readonly density: number;
  readonly viscosity: number;
  readonly surfaceTension?: number;
}

export function checkLiquid(liquid: StackLiquidInput | undefined, field = 'liquid'): CheckedLiquid {
  if (liquid === null || typeof liquid !== 'object') {
    throw new DomainError('invalid-input', 'Give the liquid (density, viscosity and, for pore-size curves, surface tension).', field);
  }
  const density = requirePositive(`${field}.density`, liquid.density);
  const viscosity = requirePositive(`${field}.viscosity`, liquid.viscosity);
  const surfaceTension =
    liquid.surfaceTension === undefined ? undefined : requirePositive(`${field}.surfaceTension`, liquid.surfaceTension);
  return { density, viscosity, surfaceTension };
}

/**
 * Builds the head-form hydraulic functions of a layer for a liquid.
 *
 * Pressure → head: ψ = p/(ρ g), so α_head = α·ρ g (1/m) and hb = Pb/(ρ g) (m); Ks = k ρ g/η (m/s)
 * from the permeability k (m²) (Darcy's law; e.g. Bear, Dynamics of Fluids in Porous Media, 1972).
 *
 * @param layer the layer (θs, θr, retention, k or Ks).
 * @param liquid ρ (kg/m³), η (Pa·s), γ (N/m, pore-size curves only).
 * @param inPlane use the in-plane permeability when given.
 * @param field field prefix for error messages, e.g. "layers[1]".
 * @param warnings receives fit remarks of pore-size curves.
 */
export function layerHydraulics(
  layer: StackLayerInput,
  liquid: CheckedLiquid,
  inPlane: boolean,
  field: string,
  warnings: ModelWarning[],
): HydraulicFunctions {
  if (layer === null || typeof layer !== 'object') {
    throw new DomainError('invalid-input', `${field} must be a layer description.`, field);
  }
  const thetaS = requireFraction(`${field}.porosity`, layer.porosity);
  const thetaR =
    layer.residualContent === undefined
      ? 0
      : requireInRange(`${field}.residualContent`, layer.residualContent, 0, thetaS, { max: true });
  const rhoG = liquid.density * STANDARD_GRAVITY;
  const ks = saturatedConductivity(layer, liquid, inPlane, field);
  const r: RetentionInput | undefined = layer.retention;
  if (r === null || typeof r !== 'object') {
    throw new DomainError('invalid-input', `${field}.retention is missing.`, `${field}.retention`);
  }
  switch (r.kind) {
    case 'van-genuchten': {
      const alpha = requirePositive(`${field}.retention.alpha`, r.alpha);
      const n = requireInRange(`${field}.retention.n`, r.n, 1, 50, { min: true });
      const l =
        r.poreConnectivity === undefined ? 0.5 : requireInRange(`${field}.retention.poreConnectivity`, r.poreConnectivity, -5, 10);
      return new VanGenuchtenMualem(thetaS, thetaR, alpha * rhoG, n, ks, l);
    }
    case 'brooks-corey': {
      const pb = requirePositive(`${field}.retention.entryPressure`, r.entryPressure);
      const lambda = requireInRange(`${field}.retention.lambda`, r.lambda, 0, 100, { min: true });
      return new BrooksCoreyBurdine(thetaS, thetaR, pb / rhoG, lambda, ks);
    }
    case 'pore-size': {
      if (liquid.surfaceTension === undefined) {
        throw new DomainError(
          'insufficient-data',
          'A pore-size retention curve needs the liquid surface tension (liquid.surfaceTension, N/m).',
          'liquid.surfaceTension',
        );
      }
      if (!Array.isArray(r.diameters) || !Array.isArray(r.fractions)) {
        throw new DomainError('invalid-input', `${field}.retention needs diameters and fractions arrays.`, `${field}.retention`);
      }
      const fit = fitPoreSizeRetention({
        diameters: r.diameters,
        fractions: r.fractions,
        form: r.form,
        surfaceTension: liquid.surfaceTension,
        contactAngle: r.contactAngle ?? 0,
      });
      const name = layer.name ?? field;
      for (const wn of fit.warnings) warnings.push({ code: wn.code, message: `${name}: ${wn.message}` });
      return new VanGenuchtenMualem(thetaS, thetaR, fit.alpha * rhoG, fit.n, ks, 0.5);
    }
    default:
      throw new DomainError(
        'invalid-input',
        `${field}.retention.kind must be 'van-genuchten', 'brooks-corey' or 'pore-size'.`,
        `${field}.retention.kind`,
      );
  }
}

/** Ks = k ρ g / η, or the conductivity given directly (m/s). */
function saturatedConductivity(layer: StackLayerInput, liquid: CheckedLiquid, inPlane: boolean, field: string): number {
  const hasK = layer.permeability !== undefined;
  const hasKs = layer.conductivity !== undefined;
  if (hasK === hasKs) {
    throw new DomainError(
      'invalid-input',
      `${field}: give either the permeability (m²) or the saturated conductivity (m/s), not ${hasK ? 'both' : 'neither'}.`,
      `${field}.permeability`,
    );
  }
  const rhoGOverEta = (liquid.density * STANDARD_GRAVITY) / liquid.viscosity;
  if (layer.inPlanePermeability !== undefined) {
    const kIn = requirePositive(`${field}.inPlanePermeability`, layer.inPlanePermeability);
    if (inPlane) return kIn * rhoGOverEta;
  }
  if (hasK) return requirePositive(`${field}.permeability`, layer.permeability as number) * rhoGOverEta;
  const ks = requirePositive(`${field}.conductivity`, layer.conductivity as number);
  return requireFinite(`${field}.conductivity`, ks);
}
