import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireInRange, requireNonNegative, requirePositive } from '../validate';
import { gravityCurve, gravityTime } from '../washburn/gravity';
import type { Tolerance } from './distributions';
import {
  monteCarlo,
  monteCarloCurve,
  type CurveModel,
  type MonteCarloCurveResult,
  type MonteCarloResult,
  type ScalarModel,
} from './monte-carlo';
import { tornado, type TornadoResult } from './sensitivity';

/**
 * Tolerance studies of capillary uptake in a round capillary (Lucas–Washburn with gravity:
 * dh/dt = a/h − b, a = γ r cosθ/(4η), b = ρ g r² sinα/(8η); Washburn 1921, Fries & Dreyer 2008 —
 * solution from the washburn module). The uncertain inputs are r (m), γ (N/m), θ (rad), η (Pa·s)
 * and ρ (kg/m³); tilt α and g are fixed.
 *
 * Physical bounds are applied to every normal tolerance that does not set its own: r, γ, η, ρ > 0
 * and θ ≥ 0 (truncation). Samples with θ ≥ 90° or a target height at or beyond equilibrium are not
 * truncated away but counted as outside validity (DomainError), so the user sees how often they occur.
 */
export type CapillaryInput = 'radius' | 'surfaceTension' | 'contactAngle' | 'viscosity' | 'density';

export interface CapillaryToleranceInput {
  readonly radius: number;
  readonly surfaceTension: number;
  readonly contactAngle: number;
  readonly viscosity: number;
  readonly density: number;
  /** rad, 0 … π/2, default π/2 (vertical). */
  readonly tilt?: number;
  /** m/s², default 9.80665. */
  readonly gravity?: number;
  /** Tolerances per uncertain input, in SI (angles in rad). */
  readonly tolerances: Readonly<Partial<Record<CapillaryInput, Tolerance>>>;
  readonly samples?: number;
  readonly seed?: number;
}

const LOWER_BOUNDS: Record<CapillaryInput, number> = {
  radius: 0,
  surfaceTension: 0,
  contactAngle: 0,
  viscosity: 0,
  density: 0,
};

/** Give every normal tolerance the physical lower bound of its input unless it has one. */
export function withPhysicalBounds(
  tolerances: Readonly<Partial<Record<CapillaryInput, Tolerance>>>,
): Partial<Record<CapillaryInput, Tolerance>> {
  const out: Partial<Record<CapillaryInput, Tolerance>> = {};
  for (const key of Object.keys(tolerances) as CapillaryInput[]) {
    const tol = tolerances[key];
    if (tol === undefined) continue;
    if (!(key in LOWER_BOUNDS)) {
      throw new DomainError('invalid-input', `No uncertain input called "${key}".`, 'tolerances');
    }
    out[key] = tol.kind === 'normal' && tol.lower === undefined ? { ...tol, lower: LOWER_BOUNDS[key] } : tol;
  }
  return out;
}

/** sin α, exact at the ends users type (0° and 90°). */
function sinTilt(tilt: number): number {
  return tilt === 0 ? 0 : Math.abs(tilt - Math.PI / 2) < 1e-12 ? 1 : Math.sin(tilt);
}

/** a = γ r cosθ/(4η), b = ρ g r² sinα/(8η) (Washburn 1921); DomainError outside validity. */
function coefficients(v: Readonly<Record<CapillaryInput, number>>, g: number, s: number): { a: number; b: number } {
  const cos = Math.cos(v.contactAngle);
  if (!(cos > 1e-9)) {
    throw new DomainError('out-of-range', 'contact angle of 90° or more: no spontaneous uptake', 'contactAngle');
  }
  if (!(v.radius > 0 && v.surfaceTension > 0 && v.viscosity > 0 && v.density > 0)) {
    throw new DomainError('not-positive', 'radius, surface tension, viscosity and density must be positive');
  }
  return {
    a: (v.surfaceTension * v.radius * cos) / (4 * v.viscosity),
    b: (v.density * g * v.radius * v.radius * s) / (8 * v.viscosity),
  };
}

/** Scalar model: time (s) to wet the length `height` (m); DomainError when it is never reached. */
export function timeToHeightModel(height: number, tilt = Math.PI / 2, gravity = STANDARD_GRAVITY): ScalarModel<CapillaryInput> {
  const s = sinTilt(tilt);
  return (v) => {
    const { a, b } = coefficients(v, gravity, s);
    const t = gravityTime(a, b, height);
    if (t === null) {
      throw new DomainError('out-of-range', `the height ${height} m lies at or beyond equilibrium (${(a / b).toPrecision(3)} m)`, 'height');
    }
    return t;
  };
}

/** Curve model: wetted length (m) at each of `times` (s). */
export function heightCurveModel(times: ArrayLike<number>, tilt = Math.PI / 2, gravity = STANDARD_GRAVITY): CurveModel<CapillaryInput> {
  const s = sinTilt(tilt);
  return (v, out) => {
    const { a, b } = coefficients(v, gravity, s);
    return gravityCurve(a, b, times, out);
  };
}

function common(input: CapillaryToleranceInput): {
  nominal: Record<CapillaryInput, number>;
  tolerances: Partial<Record<CapillaryInput, Tolerance>>;
  tilt: number;
  gravity: number;
} {
  const nominal: Record<CapillaryInput, number> = {
    radius: requirePositive('radius', input.radius),
    surfaceTension: requirePositive('surfaceTension', input.surfaceTension),
    contactAngle: requireInRange('contactAngle', input.contactAngle, 0, Math.PI),
    viscosity: requirePositive('viscosity', input.viscosity),
    density: requirePositive('density', input.density),
  };
  const tilt = requireInRange('tilt', input.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12);
  const gravity = requireNonNegative('gravity', input.gravity ?? STANDARD_GRAVITY);
  if (!input.tolerances || typeof input.tolerances !== 'object') {
    throw new DomainError('invalid-input', 'Give the tolerances as an object per input.', 'tolerances');
  }
  return { nominal, tolerances: withPhysicalBounds(input.tolerances), tilt, gravity };
}

export interface TimeToHeightToleranceInput extends CapillaryToleranceInput {
  /** Target wetted length along the capillary, m. */
  readonly height: number;
}

export interface TimeToHeightToleranceResult extends ResultBase<TimeToHeightToleranceInput> {
  readonly monteCarlo: MonteCarloResult<CapillaryInput>;
  readonly tornado: TornadoResult<CapillaryInput>;
}

/** P10/P50/P90 of the time to reach a height, with the tornado ranking of the inputs. */
export function timeToHeightTolerance(input: TimeToHeightToleranceInput): TimeToHeightToleranceResult {
  const { nominal, tolerances, tilt, gravity } = common(input);
  const height = requirePositive('height', input.height);
  const fn = timeToHeightModel(height, tilt, gravity);
  const mc = monteCarlo(fn, nominal, tolerances, { samples: input.samples ?? 10_000, seed: input.seed ?? 1 });
  const tor = tornado(fn, nominal, tolerances);
  const warnings: ModelWarning[] = [...mc.warnings, ...tor.warnings];
  return { inputs: input, warnings, monteCarlo: mc, tornado: tor };
}

export interface UptakeBandInput extends CapillaryToleranceInput {
  /** Times, s. */
  readonly times: readonly number[];
}

/** Per-time P10/P50/P90 band of the wetted length. */
export function uptakeBand(input: UptakeBandInput): MonteCarloCurveResult<CapillaryInput> {
  const { nominal, tolerances, tilt, gravity } = common(input);
  if (!Array.isArray(input.times) || input.times.length < 1) {
    throw new DomainError('insufficient-data', 'Give at least one time.', 'times');
  }
  input.times.forEach((t, i) => requireNonNegative(`times[${i}]`, t));
  return monteCarloCurve(heightCurveModel(input.times, tilt, gravity), nominal, tolerances, {
    samples: input.samples ?? 2000,
    seed: input.seed ?? 1,
  });
}
