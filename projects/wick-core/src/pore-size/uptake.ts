import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireFinite, requireFraction, requireInRange, requireNonNegative, requirePositive } from '../validate';
import { preparePoreSizeDistribution, type PoreSizeDistribution } from './distribution';
import { capillaryLengthWarning, wettingTension, type PoreLiquidFields, type PsdFields } from './equilibrium';
import { accumulateGravityCurve } from './gravity-table';

export interface PoreSizeUptakeInput extends PsdFields, PoreLiquidFields {
  /** Dynamic viscosity η, Pa·s. */
  readonly viscosity: number;
  /** Layer porosity ε, 0 < ε < 1. */
  readonly porosity: number;
  /** Layer thickness δ, m (for the mass per unit width). */
  readonly thickness: number;
  /** Tilt of the strip from horizontal α, rad, 0 … π/2 (default π/2: vertical). */
  readonly tilt?: number;
  /** Times, s (≥ 0, any order). */
  readonly times: ArrayLike<number>;
  /** Also return every class's wetted length (classes × times). Default false. */
  readonly includeClassHeights?: boolean;
}

export interface PoreSizeUptakeResult extends ResultBase<PoreSizeUptakeInput> {
  readonly distribution: PoreSizeDistribution;
  /** Per class: a = γ(D/2)cosθ/(4η), m²/s, and b = ρg(D/2)² sinα/(8η), m/s. */
  readonly classA: Float64Array;
  readonly classB: Float64Array;
  /** Per class equilibrium length along the strip a/b, m (Infinity-free: null when horizontal). */
  readonly classEquilibriumLength: Float64Array | null;
  /** Leading front: the longest wetted length over all classes, m, per time. */
  readonly frontLength: Float64Array;
  /** Σ fᵢ hᵢ(t), m: liquid volume per unit PORE cross-section, per time. */
  readonly meanFilledLength: Float64Array;
  /**
   * Average saturation of the wetted zone Σ fᵢ hᵢ / maxᵢ hᵢ (0 … 1), per time. At t = 0 its limit
   * Σ fᵢ √(Dᵢ/D_max) (all classes still in the √t regime).
   */
  readonly saturation: Float64Array;
  /** ρ ε Σ fᵢ hᵢ, kg per m² of layer cross-section (thickness × width), per time. */
  readonly massPerCrossSection: Float64Array;
  /** ρ ε δ Σ fᵢ hᵢ, kg per m of strip width, per time. */
  readonly massPerWidth: Float64Array;
  /** Class wetted lengths, class-major (index i·nTimes + j), only with includeClassHeights. */
  readonly classHeights?: Float64Array;
}

/**
 * Uptake of a layer described as a bundle of INDEPENDENT capillaries (no interconnection: each pore
 * class fills at its own rate, liquid does not cross between classes). Class i of diameter Dᵢ and
 * pore-volume fraction fᵢ follows the gravity-restrained Lucas–Washburn equation
 *   dhᵢ/dt = aᵢ/hᵢ − bᵢ,  aᵢ = γ (Dᵢ/2) cosθ/(4η),  bᵢ = ρ g (Dᵢ/2)² sinα/(8η)
 * (Washburn, Phys. Rev. 17 (1921) 273; solution of Fries & Dreyer, J. Colloid Interface Sci. 320
 * (2008) 259, from the washburn module). Layer liquid volume per unit cross-section = ε Σ fᵢ hᵢ.
 * Symbols: γ N/m, θ rad, η Pa·s, ρ kg/m³, g m/s², α tilt rad, ε porosity, δ thickness m, h m, t s.
 * Validity: as the single-capillary law (viscous regime, constant θ, pores well below the capillary
 * length); real fibrous layers are interconnected, so large pores are fed from small ones and the
 * bundle overstates the spread of fronts. Strip assumed longer than any class's rise.
 */
export function poreSizeUptake(input: PoreSizeUptakeInput): PoreSizeUptakeResult {
  const warnings: ModelWarning[] = [];
  const psd = preparePoreSizeDistribution(input, warnings);
  const cosGamma = wettingTension(input.surfaceTension, input.contactAngle);
  const gamma = input.surfaceTension;
  const cosTheta = cosGamma / gamma;
  const density = requirePositive('density', input.density);
  const viscosity = requirePositive('viscosity', input.viscosity);
  const porosity = requireFraction('porosity', input.porosity);
  const thickness = requirePositive('thickness', input.thickness);
  const gravity = requireNonNegative('gravity', input.gravity ?? STANDARD_GRAVITY);
  const tilt = requireInRange('tilt', input.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12);
  const times = input.times;
  if (!times || times.length < 1) throw new DomainError('insufficient-data', 'Give at least one time.', 'times');
  const m = times.length;
  for (let j = 0; j < m; j++) {
    const t = times[j];
    if (!(t >= 0) || !Number.isFinite(t)) {
      requireFinite(`times[${j}]`, t);
      requireNonNegative(`times[${j}]`, t);
    }
  }
  const w = capillaryLengthWarning(psd.diameters[psd.diameters.length - 1], gamma, density, gravity);
  if (w) warnings.push(w);

  const nc = psd.diameters.length;
  // sin α exact at the ends users type (0° and 90°).
  const s = tilt === 0 ? 0 : Math.abs(tilt - Math.PI / 2) < 1e-12 ? 1 : Math.sin(tilt);
  const classA = new Float64Array(nc);
  const classB = new Float64Array(nc);
  const sum = new Float64Array(m);
  const front = new Float64Array(m);
  const classHeights = input.includeClassHeights ? new Float64Array(nc * m) : undefined;
  let horizontal = true;
  for (let i = 0; i < nc; i++) {
    const r = psd.diameters[i] / 2;
    const a = (gamma * r * cosTheta) / (4 * viscosity);
    const b = (density * gravity * r * r * s) / (8 * viscosity);
    classA[i] = a;
    classB[i] = b;
    if (b > 0) horizontal = false;
    accumulateGravityCurve(a, b, times, psd.fractions[i], sum, front, classHeights?.subarray(i * m, (i + 1) * m));
  }
  let classEquilibriumLength: Float64Array | null = null;
  if (!horizontal) {
    classEquilibriumLength = new Float64Array(nc);
    for (let i = 0; i < nc; i++) classEquilibriumLength[i] = classA[i] / classB[i];
  }
  // t → 0 limit of the wetted-zone saturation: hᵢ ∝ √Dᵢ for all classes.
  const dMax = psd.diameters[nc - 1];
  let s0 = 0;
  for (let i = 0; i < nc; i++) s0 += psd.fractions[i] * Math.sqrt(psd.diameters[i] / dMax);

  const saturation = new Float64Array(m);
  const massPerCrossSection = new Float64Array(m);
  const massPerWidth = new Float64Array(m);
  const k = density * porosity;
  for (let j = 0; j < m; j++) {
    saturation[j] = front[j] > 0 ? Math.min(sum[j] / front[j], 1) : s0;
    massPerCrossSection[j] = k * sum[j];
    massPerWidth[j] = k * thickness * sum[j];
  }
  const result: PoreSizeUptakeResult = {
    inputs: input,
    warnings,
    distribution: psd,
    classA,
    classB,
    classEquilibriumLength,
    frontLength: front,
    meanFilledLength: sum,
    saturation,
    massPerCrossSection,
    massPerWidth,
  };
  return classHeights ? { ...result, classHeights } : result;
}
