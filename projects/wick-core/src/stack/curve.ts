import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireInRange, requireNonNegative } from '../validate';
import { checkLiquid, layerHydraulics } from './materials';
import { VanGenuchtenMualem } from './retention';
import type { StackLayerInput, StackLiquidInput } from './types';

export interface RetentionCurveInput {
  /** The layer (porosity, residual content, retention, permeability or conductivity). */
  readonly layer: StackLayerInput;
  readonly liquid: StackLiquidInput;
  /** Capillary pressures to evaluate, Pa (≥ 0); a log-spaced range around the curve when omitted. */
  readonly pressures?: readonly number[];
  /** Number of log-spaced points when `pressures` is omitted (2…2000); 60 when omitted. */
  readonly points?: number;
}

export interface RetentionCurveResult extends ResultBase<RetentionCurveInput> {
  /** Capillary pressure Pc, Pa. */
  readonly pressures: Float64Array;
  /** Saturation S = θ/θs. */
  readonly saturation: Float64Array;
  /** Effective saturation Se = (θ − θr)/(θs − θr). */
  readonly effectiveSaturation: Float64Array;
  /** Relative permeability kr(Se). */
  readonly relativePermeability: Float64Array;
  /** Hydraulic conductivity K = Ks kr for the liquid, m/s. */
  readonly conductivity: Float64Array;
  /** The van Genuchten parameters used (fitted for a pore-size layer), α in 1/Pa; null for Brooks–Corey. */
  readonly vanGenuchten: { readonly alpha: number; readonly n: number } | null;
}

/**
 * Retention and relative-permeability curves of one layer, as the stack model uses them.
 *
 * S(Pc) = [θr + (θs − θr) Se(Pc)]/θs with Se from van Genuchten (1980), Brooks & Corey (1964) or the
 * capillary-bundle fit of a pore-size distribution; kr from Mualem (1976) or Burdine (Brooks & Corey
 * 1964); K = Ks kr with Ks = k ρ g/η. Pc in Pa (Pc = −p, p the liquid gauge pressure).
 * Validity: as the stack model (rigid pores, one wetting branch, no hysteresis).
 */
export function stackRetentionCurve(input: RetentionCurveInput): RetentionCurveResult {
  if (input === null || typeof input !== 'object') {
    throw new DomainError('invalid-input', 'Give a layer and a liquid.', 'input');
  }
  const warnings: ModelWarning[] = [];
  const liquid = checkLiquid(input.liquid);
  const m = layerHydraulics(input.layer, liquid, false, 'layer', warnings);
  const rhoG = liquid.density * STANDARD_GRAVITY;
  let pressures: Float64Array;
  if (input.pressures !== undefined) {
    if (!Array.isArray(input.pressures) || input.pressures.length === 0) {
      throw new DomainError('invalid-input', 'pressures must be a non-empty list of capillary pressures (Pa).', 'pressures');
    }
    pressures = Float64Array.from(input.pressures, (p, i) => requireNonNegative(`pressures[${i}]`, p));
  } else {
    const count = input.points === undefined ? 60 : requireInRange('points', input.points, 2, 2000);
    if (!Number.isInteger(count)) throw new DomainError('invalid-input', 'points must be a whole number.', 'points');
    // Two decades either side of the characteristic pressure (1/α or the entry pressure).
    const pChar = -m.headAtEffectiveSaturation(0.5) * rhoG;
    const lo = Math.log10(pChar) - 2;
    const hi = Math.log10(pChar) + 2;
    pressures = new Float64Array(count);
    for (let k = 0; k < count; k++) pressures[k] = Math.pow(10, lo + ((hi - lo) * k) / (count - 1));
  }
  const n = pressures.length;
  const saturation = new Float64Array(n);
  const effectiveSaturation = new Float64Array(n);
  const relativePermeability = new Float64Array(n);
  const conductivity = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const psi = -pressures[k] / rhoG;
    const se = m.effectiveSaturation(psi);
    effectiveSaturation[k] = se;
    saturation[k] = m.theta(psi) / m.thetaS;
    conductivity[k] = m.conductivity(psi);
    relativePermeability[k] = conductivity[k] / m.ks;
  }
  const vanGenuchten = m instanceof VanGenuchtenMualem ? { alpha: m.alpha / rhoG, n: m.n } : null;
  return { inputs: input, warnings, pressures, saturation, effectiveSaturation, relativePermeability, conductivity, vanGenuchten };
}
