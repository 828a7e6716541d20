import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { DomainError, type ModelWarning } from '../errors';
import { preparePoreSizeDistribution, type DistributionForm } from '../pore-size/distribution';
import { requireInRange, requirePositive } from '../validate';

export interface PoreSizeRetentionFitInput {
  /** Class diameters, m, strictly increasing. */
  readonly diameters: ArrayLike<number>;
  /** Pore-volume fractions in `form` ('differential' when omitted). */
  readonly fractions: ArrayLike<number>;
  readonly form?: DistributionForm;
  /** Surface tension γ of the liquid, N/m. */
  readonly surfaceTension: number;
  /** Contact angle θ on the pore walls, rad, 0 ≤ θ < π/2. */
  readonly contactAngle: number;
}

export interface PoreSizeRetentionFit {
  /** Fitted van Genuchten α, 1/Pa. */
  readonly alpha: number;
  /** Fitted van Genuchten n. */
  readonly n: number;
  /** Root-mean-square misfit in saturation over the fitted points. */
  readonly rmsResidual: number;
  /** The capillary-bundle points that were fitted: Pc (Pa) and effective saturation. */
  readonly pressures: Float64Array;
  readonly saturations: Float64Array;
  readonly warnings: readonly ModelWarning[];
}

/** A misfit above this (in saturation) earns a warning that the smooth curve is a loose summary. */
const RMS_WARNING = 0.03;

/**
 * Retention curve of a capillary bundle, summarised by a van Genuchten curve.
 *
 * Capillary bundle: at capillary pressure Pc every pore with diameter d ≤ 4 γ cos θ / Pc is filled
 * (Young–Laplace for a cylinder), so Se(Pc_j) = F_j, the cumulative pore-volume fraction finer than d_j,
 * at Pc_j = 4 γ cos θ / d_j (F = 1 at the largest class). These points are fitted by least squares in
 * Se with Se = [1 + (α Pc)^n]^(−(1 − 1/n)) over ln Pc
 * (Levenberg–Marquardt, ml-levenberg-marquardt). The fitted (α, n) then give Mualem relative
 * permeability like any van Genuchten layer.
 *
 * Symbols: γ (N/m), θ (rad), d (m), Pc (Pa), α (1/Pa), n (−).
 * Sources: capillary-bundle model and Young–Laplace law (e.g. Bear, Dynamics of Fluids in Porous
 * Media, 1972, §9.2); van Genuchten, Soil Sci. Soc. Am. J. 44 (1980) 892.
 * Validity: at least three classes; a smooth curve only summarises the steps of a class table (the
 * fit's rms misfit is returned, with a warning above 0.03). A bundle ignores pore-throat
 * shielding (ink-bottle) effects, so the curve is a wetting-side estimate at best.
 */
export function fitPoreSizeRetention(input: PoreSizeRetentionFitInput): PoreSizeRetentionFit {
  const warnings: ModelWarning[] = [];
  const gamma = requirePositive('surfaceTension', input.surfaceTension);
  const theta = requireInRange('contactAngle', input.contactAngle, 0, Math.PI / 2, { max: true });
  const psd = preparePoreSizeDistribution(
    { diameters: input.diameters, fractions: input.fractions, form: input.form ?? 'differential' },
    warnings,
  );
  const wettingTension = gamma * Math.cos(theta);
  const pressures: number[] = [];
  const saturations: number[] = [];
  const nClasses = psd.diameters.length;
  let partial = 0;
  for (let j = 0; j < nClasses; j++) {
    const f = psd.cumulativeFiner[j];
    if (f > 1e-9) {
      pressures.push((4 * wettingTension) / psd.diameters[j]);
      saturations.push(f);
      if (f < 1 - 1e-9) partial++;
    }
  }
  if (pressures.length < 3 || partial < 1) {
    throw new DomainError(
      'insufficient-data',
      'A pore-size retention curve needs at least three pore classes, counted from the first with a non-zero fraction.',
      'fractions',
    );
  }
  // Fit in x = ln(Pc/Pref) with parameters a = ln(α·Pref) and n, which keeps both of order one.
  let logSum = 0;
  for (const p of pressures) logSum += Math.log(p);
  const pRef = Math.exp(logSum / pressures.length);
  const x = pressures.map((p) => Math.log(p / pRef));
  const y = saturations;
  // Start: Se ≈ 0.5 near αPc ≈ 1, so a ≈ −x at the point closest to half-filled.
  let iMid = 0;
  for (let j = 1; j < y.length; j++) if (Math.abs(y[j] - 0.5) < Math.abs(y[iMid] - 0.5)) iMid = j;
  // ln(1 + e^z) and e^z/(1 + e^z) written so that neither overflows for large z.
  const softplus = (z: number) => (z > 0 ? z + Math.log1p(Math.exp(-z)) : Math.log1p(Math.exp(z)));
  const logistic = (z: number) => (z > 0 ? 1 / (1 + Math.exp(-z)) : Math.exp(z) / (1 + Math.exp(z)));
  const model = ([a, n]: number[]) => (xi: number) => Math.exp(-(1 - 1 / n) * softplus(n * (a + xi)));
  const jacobian = ([a, n]: number[]) => (xi: number) => {
    const m = 1 - 1 / n;
    const z = n * (a + xi);
    const se = Math.exp(-m * softplus(z));
    const r = logistic(z);
    // ln Se = −m ln(1 + e^z): ∂/∂a = −m n r, ∂/∂n = −ln(1 + e^z)/n² − m (a + x) r.
    return [-m * n * r * se, se * (-softplus(z) / (n * n) - m * (a + xi) * r)];
  };
  const fit = levenbergMarquardt({ x, y }, model, {
    initialValues: [-x[iMid], 2],
    jacobianFunction: jacobian,
    minValues: [-60, 1.01],
    maxValues: [60, 30],
    damping: 1e-2,
    maxIterations: 500,
    errorTolerance: 1e-14,
  });
  const [a, n] = fit.parameterValues;
  const alpha = Math.exp(a) / pRef;
  let ss = 0;
  const f = model([a, n]);
  for (let j = 0; j < x.length; j++) ss += (f(x[j]) - y[j]) ** 2;
  const rmsResidual = Math.sqrt(ss / x.length);
  if (!Number.isFinite(alpha) || !Number.isFinite(n) || !Number.isFinite(rmsResidual)) {
    throw new DomainError('no-convergence', 'The pore-size distribution could not be summarised by a retention curve.', 'fractions');
  }
  if (rmsResidual > RMS_WARNING) {
    warnings.push({
      code: 'psd-fit-loose',
      message:
        `The van Genuchten curve misses the pore-size points by ${rmsResidual.toFixed(3)} in saturation (rms); ` +
        'a bimodal or very narrow distribution is only roughly represented.',
    });
  }
  return {
    alpha,
    n,
    rmsResidual,
    pressures: Float64Array.from(pressures),
    saturations: Float64Array.from(saturations),
    warnings,
  };
}
