import type { ResultBase } from '../api/model-spec';
import { DomainError, type ModelWarning } from '../errors';
import { requirePositive } from '../validate';
import { spread, type SpreadSummary } from './replicates';

/**
 * Contact angle by the reference-liquid (Washburn) method.
 *
 * For a packed powder or fibrous sample the mass uptake obeys
 *   m² = C ρ² γ cosθ t / η            (Washburn, Phys. Rev. 17 (1921) 273; mass form used for powders,
 *                                     e.g. B. Chibowski & L. Holysz, Langmuir 8 (1992) 710 — from memory)
 * with C (m⁵) a constant of the sample geometry (for a capillary bundle C = (εA)² r_eff/2). The
 * Washburn slope K = dm²/dt (kg²/s) of a fully wetting reference liquid (cos θ = 1, usually
 * n-hexane) gives C = K_ref η_ref / (ρ_ref² γ_ref); a test liquid's slope then gives
 *   cos θ = K η / (C ρ² γ).
 * Symbols: γ N/m, ρ kg/m³, η Pa·s, K kg²/s, C m⁵, θ rad.
 *
 * Height form (`quantity: 'height'`, strips read by the position of the front): h² = γ r cosθ t/(2η)
 * (Washburn 1921) has no density, so K = dh²/dt (m²/s) of the reference gives C_h = K_ref η_ref/γ_ref (m;
 * r_eff/2 for a capillary bundle) and cos θ = K η/(C_h γ). Same pooling and uncertainty as the mass form.
 * Assumptions: reference and test samples are packed identically (same C), the reference wets
 * completely, no swelling, dissolution or evaporation, viscous regime.
 *
 * Replicates are pooled: C from the mean of the reference runs; cos θ per test run with that C,
 * reported as mean, sd and n. `uncertainty` is the first-order standard uncertainty of the mean
 * cos θ combining both sets: u = cos θ̄ · √((s_K/K̄)²/n_test + (s_C/C̄)²/n_ref) (JCGM 100:2008, GUM, §5.1).
 * cos θ > 1 (test liquid faster than a perfect wetter) is clamped to 1 with a warning.
 */
export interface LiquidRuns {
  /** Surface tension γ, N/m. */
  readonly surfaceTension: number;
  /** Density ρ, kg/m³. Needed for the mass form only. */
  readonly density?: number;
  /** Viscosity η, Pa·s. */
  readonly viscosity: number;
  /**
   * Washburn slopes of each replicate run: K = dm²/dt in kg²/s (mass form), or K = dh²/dt in m²/s (height form),
   * e.g. from fitWashburnSlope.
   */
  readonly slopes: readonly number[];
}

export interface ReferenceLiquidInput {
  /** Fully wetting reference liquid (cos θ taken as 1). */
  readonly reference: LiquidRuns;
  readonly test: LiquidRuns;
  /** What the slopes were fitted to. Default 'mass'. */
  readonly quantity?: 'mass' | 'height';
}

export interface ReferenceLiquidResult extends ResultBase<ReferenceLiquidInput> {
  /** Material constant per reference run, pooled: C in m⁵ (mass form) or C_h in m (height form). */
  readonly materialConstant: SpreadSummary & { readonly values: readonly number[] };
  /** cos θ per test run (unclamped), pooled. */
  readonly cosTheta: SpreadSummary & { readonly values: readonly number[]; readonly uncertainty: number };
  /** θ from the pooled cos θ, clamped to [0, 1], rad. */
  readonly contactAngle: number;
  /** θ at cos θ̄ ± u (clamped), rad: [lower, upper]. */
  readonly contactAngleRange: readonly [number, number];
  /** Safety note on reference solvents, to show with the result. */
  readonly caution: string;
}

/** Shown wherever the reference-liquid method is offered. */
export const REFERENCE_LIQUID_CAUTION =
  'Reference liquids such as n-hexane are highly flammable and harmful by inhalation: handle them in a fume ' +
  'hood, keep ignition sources and static discharge away, wear suitable gloves and eye protection, and follow ' +
  'the supplier’s safety data sheet and local regulations for storage and disposal. The contact angle is an ' +
  'engineering estimate; confirm decisions on skin-contact products with standard tests and qualified review.';

function checkRuns(field: string, runs: LiquidRuns, quantity: 'mass' | 'height'): void {
  requirePositive(`${field}.surfaceTension`, runs.surfaceTension);
  if (quantity === 'mass') requirePositive(`${field}.density`, runs.density as number);
  requirePositive(`${field}.viscosity`, runs.viscosity);
  if (!Array.isArray(runs.slopes) || runs.slopes.length < 1) {
    throw new DomainError('insufficient-data', `Give at least one ${field} slope.`, `${field}.slopes`);
  }
  runs.slopes.forEach((k, i) => requirePositive(`${field}.slopes[${i}]`, k));
}

export function referenceLiquidContactAngle(input: ReferenceLiquidInput): ReferenceLiquidResult {
  const { reference: ref, test } = input;
  const quantity = input.quantity ?? 'mass';
  if (quantity !== 'mass' && quantity !== 'height') {
    throw new DomainError('invalid-input', `quantity must be "mass" or "height" (got "${String(quantity)}").`, 'quantity');
  }
  checkRuns('reference', ref, quantity);
  checkRuns('test', test, quantity);
  const warnings: ModelWarning[] = [];

  // ρ² appears in the mass form only (m = ρ ε A h).
  const rho2 = (runs: LiquidRuns): number => (quantity === 'mass' ? (runs.density as number) ** 2 : 1);
  const cValues = ref.slopes.map((k) => (k * ref.viscosity) / (rho2(ref) * ref.surfaceTension));
  const c = spread(cValues);
  const cosValues = test.slopes.map((k) => (k * test.viscosity) / (c.mean * rho2(test) * test.surfaceTension));
  const cos = spread(cosValues);
  const k = spread(test.slopes);
  const relK = k.n > 0 && k.mean > 0 ? k.sd / k.mean : 0;
  const relC = c.sd / c.mean;
  const uncertainty = cos.mean * Math.sqrt((relK * relK) / k.n + (relC * relC) / c.n);

  if (ref.slopes.length < 2 || test.slopes.length < 2) {
    warnings.push({
      code: 'single-run',
      message: 'With a single run of either liquid the spread, and so the uncertainty, is not estimated; run replicates (3 or more is common practice).',
    });
  }
  let cosUsed = cos.mean;
  if (cosUsed > 1) {
    warnings.push({
      code: 'cos-clamped',
      message:
        `The test liquid wicks faster than the fully wetting reference predicts (cos θ = ${cos.mean.toFixed(3)} > 1); ` +
        'θ is reported as 0°. Check packing reproducibility, the reference liquid and the liquid data.',
    });
    cosUsed = 1;
  }
  const clampCos = (x: number): number => Math.min(1, Math.max(0, x));
  const acos = (x: number): number => Math.acos(clampCos(x));
  return {
    inputs: input,
    warnings,
    materialConstant: { ...c, values: cValues },
    cosTheta: { ...cos, values: cosValues, uncertainty },
    contactAngle: acos(cosUsed),
    contactAngleRange: [acos(cos.mean + uncertainty), acos(cos.mean - uncertainty)],
    caution: REFERENCE_LIQUID_CAUTION,
  };
}
