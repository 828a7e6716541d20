import { levenbergMarquardt } from 'ml-levenberg-marquardt';

import type { ResultBase } from '../api/model-spec';
import { STANDARD_GRAVITY } from '../constants';
import { DomainError, type ModelWarning } from '../errors';
import { requireContactAngle, requireFraction, requireInRange, requirePositive } from '../validate';
import { gravityHeight } from '../washburn/gravity';
import { gravityHeightDerivatives } from './gravity-jacobian';
import { integralGravityEstimate } from './integral-estimate';
import { checkUptakeSeries } from './series';
import { studentTQuantile } from './student-t';

/**
 * Gravity-restrained Washburn fit: the two parameters of dh/dt = a/h − b, h(0) = 0, fitted to
 * measured (t, h) by nonlinear least squares.
 *
 * Model: h(t) = (a/b)[1 + W₀(−exp(−1 − t b²/a))] (Fries & Dreyer, J. Colloid Interface Sci. 320
 * (2008) 259), evaluated by the washburn module. Minimiser: Levenberg–Marquardt from the package
 * ml-levenberg-marquardt (K. Levenberg, Q. Appl. Math. 2 (1944) 164; D. W. Marquardt, J. SIAM 11
 * (1963) 431) with the analytic Jacobian of ./gravity-jacobian, on data scaled to O(1); starting
 * values from the linear integral estimate (./integral-estimate).
 * Uncertainty: Cov = s² (JᵀJ)⁻¹ with s² = SSE/(n − 2), J the Jacobian at the optimum; 95 %
 * intervals ± t_{0.975, n−2}·√diag (linearised, G. A. F. Seber & C. J. Wild, *Nonlinear
 * Regression*, Wiley 1989). Derived figures use first-order error propagation.
 * Derived, given liquid data:
 *   capillary picture: static radius r_s = 2γcosθ/(ρ g sinα h_eq) (Jurin), dynamic radius
 *   r_d = 4ηa/(γ cosθ) (from a = γ r cosθ/(4η));
 *   porous layer (Darcy, saturated behind the front): a = k Pc/(εη), b = kρg sinα/(εη) ⇒
 *   k = ε η b/(ρ g sinα), Pc = ρ g sinα h_eq.
 * Symbols: h m, t s, a m²/s, b m/s, h_eq = a/b m, t* = a/b² s, γ N/m, θ rad, ρ kg/m³, η Pa·s,
 * ε porosity, α tilt from horizontal, k m², Pc Pa.
 * Assumptions: h(0) = 0 at t = 0 (shift the time axis first), constant contact angle, no
 * swelling or evaporation, viscous regime.
 */
export interface GravityFitInput {
  /** Times, s (≥ 0, strictly increasing). */
  readonly time: ArrayLike<number>;
  /** Wetted heights, m (or masses, kg, with quantity 'mass'). */
  readonly values: ArrayLike<number>;
  /** Default 'height'. Derived radii, permeability and Pc need heights. */
  readonly quantity?: 'height' | 'mass';
  /** Optional liquid data for the derived figures (SI). */
  readonly surfaceTension?: number;
  /** rad; taken as 0 (cos θ = 1) when omitted, with a warning. */
  readonly contactAngle?: number;
  readonly density?: number;
  readonly viscosity?: number;
  /** Layer porosity ε for permeability and capillary pressure. */
  readonly porosity?: number;
  /** m/s², default 9.80665. */
  readonly gravity?: number;
  /** Tilt from horizontal, rad, default π/2 (vertical). Must be > 0. */
  readonly tilt?: number;
}

/** An estimate with its standard error and 95 % confidence interval. */
export interface Estimate {
  readonly value: number;
  readonly stdError: number;
  readonly ci95: readonly [number, number];
}

export interface GravityFitResult extends ResultBase<GravityFitInput> {
  /** a, m²/s (kg²/s for masses). */
  readonly a: Estimate;
  /** b, m/s (kg/s for masses). */
  readonly b: Estimate;
  /** Correlation of the a and b estimates. */
  readonly correlation: number;
  /** Equilibrium h_eq = a/b (null when no slowing is detected, b ≈ 0). */
  readonly equilibrium: Estimate | null;
  /** Washburn coefficient 2a of the early law h² = 2at. */
  readonly washburnCoefficient: Estimate;
  /** t* = a/b², s (null with b ≈ 0). */
  readonly characteristicTime: number | null;
  readonly capillary: { readonly staticRadius: Estimate | null; readonly dynamicRadius: Estimate } | null;
  readonly porousLayer: { readonly permeability: Estimate; readonly capillaryPressure: Estimate } | null;
  readonly rSquared: number;
  readonly rmse: number;
  readonly residuals: Float64Array;
  readonly fitted: Float64Array;
  readonly degreesOfFreedom: number;
  readonly iterations: number;
  /** Last measured value / fitted equilibrium (null with b ≈ 0). */
  readonly approachToEquilibrium: number | null;
}

/** Below this share of h_eq reached by the last point, the static figures are extrapolations. */
export const EQUILIBRIUM_APPROACH_WARNING = 0.6;

export function fitGravityWashburn(input: GravityFitInput): GravityFitResult {
  const quantity = input.quantity ?? 'height';
  if (quantity !== 'height' && quantity !== 'mass') {
    throw new DomainError('invalid-input', `quantity must be "height" or "mass" (got "${String(quantity)}").`, 'quantity');
  }
  // Two parameters plus at least two residual degrees of freedom.
  const { t, y } = checkUptakeSeries(input.time, input.values, 4, quantity);
  const n = t.length;
  const warnings: ModelWarning[] = [];

  let ys = 0;
  for (let i = 0; i < n; i++) ys = Math.max(ys, y[i]);
  const ts = t[n - 1];
  const T = new Float64Array(n);
  const Y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    T[i] = t[i] / ts;
    Y[i] = y[i] / ys;
  }

  const est = integralGravityEstimate(T, Y);
  let A0 = est.a;
  let B0 = est.b;
  if (!(A0 > 0)) {
    const k = n - 1;
    A0 = (Y[k] * Y[k]) / (2 * T[k]);
  }
  if (!(B0 > 0)) B0 = 1e-3 * A0;
  const model = ([A, B]: number[]) => (x: number) => gravityHeight(A, B, x);
  const jac = ([A, B]: number[]) => (x: number) => gravityHeightDerivatives(A, B, gravityHeight(A, B, x));
  // The package stops only at an absolute error level or an iteration cap, so it is run in
  // chunks until the parameters stop moving (relative change < 1e-10) or 400 iterations.
  let params = [A0, B0];
  let iterations = 0;
  let converged = false;
  try {
    for (let chunk = 0; chunk < 20 && !converged; chunk++) {
      const lm = levenbergMarquardt({ x: T, y: Y }, model, {
        initialValues: params,
        jacobianFunction: jac,
        minValues: [1e-12 * A0, 0],
        maxValues: [1e6 * A0, 1e6 * Math.max(A0, B0)],
        damping: 1e-3,
        maxIterations: 20,
        errorTolerance: 1e-30,
      });
      iterations += lm.iterations;
      const [pa, pb] = lm.parameterValues;
      const scale = Math.max(Math.abs(pa), Math.abs(pb));
      converged = Math.abs(pa - params[0]) <= 1e-10 * scale && Math.abs(pb - params[1]) <= 1e-10 * scale;
      params = lm.parameterValues;
    }
  } catch (e) {
    throw new DomainError('no-convergence', `The gravity-restrained fit failed: ${(e as Error).message}`);
  }
  if (!converged) {
    warnings.push({
      code: 'not-converged',
      message: 'The fit stopped at the iteration limit before the parameters settled; treat the results with care.',
    });
  }
  const [A, B] = params;
  if (!(A > 0) || !(B >= 0) || !Number.isFinite(A) || !Number.isFinite(B)) {
    throw new DomainError('no-convergence', 'The gravity-restrained fit did not converge; check the data.');
  }

  // Covariance in scaled units from J at the optimum.
  const fitted = new Float64Array(n);
  const residuals = new Float64Array(n);
  let jaa = 0;
  let jab = 0;
  let jbb = 0;
  let sse = 0;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += y[i];
  mean /= n;
  let sst = 0;
  for (let i = 0; i < n; i++) {
    const h = gravityHeight(A, B, T[i]);
    const [da, db] = gravityHeightDerivatives(A, B, h);
    jaa += da * da;
    jab += da * db;
    jbb += db * db;
    fitted[i] = h * ys;
    residuals[i] = y[i] - fitted[i];
    sse += residuals[i] * residuals[i];
    sst += (y[i] - mean) ** 2;
  }
  const dof = n - 2;
  const s2 = sse / ys / ys / dof;
  const det = jaa * jbb - jab * jab;
  if (!(det > 0)) {
    throw new DomainError('no-convergence', 'The data cannot separate the capillary and gravity terms (singular fit).');
  }
  const varA = (s2 * jbb) / det;
  const varB = (s2 * jaa) / det;
  const covAB = (-s2 * jab) / det;
  // Back to physical units: a = A·ys²/ts, b = B·ys/ts.
  const ka = (ys * ys) / ts;
  const kb = ys / ts;
  const a = A * ka;
  const b = B * kb;
  const sa = Math.sqrt(varA) * ka;
  const sb = Math.sqrt(varB) * kb;
  const cab = covAB * ka * kb;
  const tq = studentTQuantile(0.975, dof);
  const estimate = (value: number, se: number): Estimate => ({ value, stdError: se, ci95: [value - tq * se, value + tq * se] });
  const correlation = sa > 0 && sb > 0 ? cab / (sa * sb) : 0;

  // b indistinguishable from zero: no equilibrium figure.
  const gravitySeen = b > 0 && b > tq * sb;
  let equilibrium: Estimate | null = null;
  let characteristicTime: number | null = null;
  let approach: number | null = null;
  if (gravitySeen) {
    const heq = a / b;
    // δh_eq² = (1/b)² σa² + (a/b²)² σb² − 2 (a/b³) cov(a, b).
    const v = (sa / b) ** 2 + ((a / (b * b)) * sb) ** 2 - 2 * (a / b ** 3) * cab;
    equilibrium = estimate(heq, Math.sqrt(Math.max(v, 0)));
    characteristicTime = a / (b * b);
    approach = y[n - 1] / heq;
    if (approach < EQUILIBRIUM_APPROACH_WARNING) {
      warnings.push({
        code: 'equilibrium-not-approached',
        message:
          `The last reading is ${(approach * 100).toFixed(0)} % of the fitted equilibrium ${quantity}; below ` +
          `${EQUILIBRIUM_APPROACH_WARNING * 100} % the equilibrium and the figures derived from it (static radius, ` +
          'capillary pressure) are extrapolations and poorly determined. Record longer.',
      });
    }
  } else {
    warnings.push({
      code: 'no-gravity-slowing',
      message:
        'No significant slowing by gravity is seen (b is not distinguishable from 0): the record stays in the ' +
        'Washburn regime, so no equilibrium can be estimated. Use the Washburn slope or record longer.',
    });
  }
  const rSquared = sst > 0 ? 1 - sse / sst : 1;
  if (rSquared < 0.98) {
    warnings.push({
      code: 'poor-fit',
      message: `The gravity-restrained model fits poorly (R² = ${rSquared.toFixed(3)}): check for swelling, evaporation, a wetting delay or a time-zero offset.`,
    });
  }

  const derived = deriveFigures(input, quantity, a, b, sa, sb, equilibrium, estimate, warnings);
  return {
    inputs: input,
    warnings,
    a: estimate(a, sa),
    b: estimate(b, sb),
    correlation,
    equilibrium,
    washburnCoefficient: estimate(2 * a, 2 * sa),
    characteristicTime,
    capillary: derived.capillary,
    porousLayer: derived.porousLayer,
    rSquared,
    rmse: Math.sqrt(sse / n),
    residuals,
    fitted,
    degreesOfFreedom: dof,
    iterations,
    approachToEquilibrium: approach,
  };
}

function deriveFigures(
  input: GravityFitInput,
  quantity: 'height' | 'mass',
  a: number,
  b: number,
  sa: number,
  sb: number,
  equilibrium: Estimate | null,
  estimate: (v: number, se: number) => Estimate,
  warnings: ModelWarning[],
): Pick<GravityFitResult, 'capillary' | 'porousLayer'> {
  const { surfaceTension, density, viscosity, porosity } = input;
  const none = { capillary: null, porousLayer: null };
  if (density === undefined || viscosity === undefined) return none;
  if (quantity !== 'height') {
    warnings.push({
      code: 'derived-need-heights',
      message: 'Radii, permeability and capillary pressure are derived from heights only; fit heights for them.',
    });
    return none;
  }
  const rho = requirePositive('density', density);
  const eta = requirePositive('viscosity', viscosity);
  const g = requirePositive('gravity', input.gravity ?? STANDARD_GRAVITY);
  const tilt = requireInRange('tilt', input.tilt ?? Math.PI / 2, 0, Math.PI / 2 + 1e-12, { min: true });
  const sinA = Math.abs(tilt - Math.PI / 2) < 1e-12 ? 1 : Math.sin(tilt);
  const rhoG = rho * g * sinA;

  let capillary: GravityFitResult['capillary'] = null;
  if (surfaceTension !== undefined) {
    const gamma = requirePositive('surfaceTension', surfaceTension);
    let cos = 1;
    if (input.contactAngle === undefined) {
      warnings.push({
        code: 'contact-angle-assumed',
        message: 'No contact angle given: radii are computed with cos θ = 1 (they are then r·cos θ).',
      });
    } else {
      cos = Math.cos(requireContactAngle('contactAngle', input.contactAngle));
      if (!(cos > 1e-9)) throw new DomainError('out-of-range', 'The contact angle must be below 90°.', 'contactAngle');
    }
    // r_d = 4ηa/(γcosθ) is linear in a; r_s = 2γcosθ/(ρ g sinα h_eq) scales as 1/h_eq.
    const rd = (4 * eta * a) / (gamma * cos);
    const staticRadius =
      equilibrium === null
        ? null
        : estimate((2 * gamma * cos) / (rhoG * equilibrium.value), ((2 * gamma * cos) / (rhoG * equilibrium.value)) * (equilibrium.stdError / equilibrium.value));
    capillary = { staticRadius, dynamicRadius: estimate(rd, (rd * sa) / a) };
  }
  let porousLayer: GravityFitResult['porousLayer'] = null;
  if (porosity !== undefined && equilibrium !== null) {
    const eps = requireFraction('porosity', porosity);
    const k = (eps * eta * b) / rhoG;
    const pc = rhoG * equilibrium.value;
    porousLayer = {
      permeability: estimate(k, (k * sb) / b),
      capillaryPressure: estimate(pc, rhoG * equilibrium.stdError),
    };
  }
  return { capillary, porousLayer };
}
