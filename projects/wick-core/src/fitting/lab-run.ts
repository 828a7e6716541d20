import type { ModelWarning } from '../errors';
import { isDomainError } from '../errors';
import type { Plain } from '../api/plain';
import { toPlain } from '../api/plain';
import { WICK_CORE_VERSION } from '../version';
import { fitGravityWashburn, type GravityFitResult } from './gravity-fit';
import { replicateStatistics, type ReplicateResult } from './replicates';
import { fitWashburnSlope, type WashburnSlopeResult } from './washburn-slope';

/**
 * The fits of one lab run, as the lab-data screens and the server show them: the Washburn slope over the chosen
 * window and, for vertical and inclined runs, the gravity-restrained fit with the liquid and layer data (radii,
 * permeability and capillary pressure from heights only). Also the spread of each fitted figure over replicate
 * runs with outliers flagged. Pure bookkeeping around fitWashburnSlope, fitGravityWashburn and
 * replicateStatistics (see their TSDoc for equations and sources); nothing new is computed here.
 */

/** 'auto' (the suggested window), 'all', or explicit times in s (inclusive). */
export type FitWindow = 'auto' | 'all' | { readonly start?: number; readonly end?: number };

/** How a run is fitted; kept with the run. */
export interface FitSettings {
  readonly window: FitWindow;
  /** Washburn slope with an intercept (time-zero offset, contact jump). */
  readonly intercept: boolean;
  /** Contact angle for the effective radii, rad; null: cos θ = 1 (radii are then r·cos θ). */
  readonly contactAngle: number | null;
}

export const DEFAULT_FIT_SETTINGS: FitSettings = { window: 'auto', intercept: false, contactAngle: null };

/** What the fits of one run read (SI). */
export interface LabRunFitInput {
  /** s */
  readonly times: readonly number[];
  /** m (heights) or kg (masses) */
  readonly readings: readonly number[];
  readonly measurement: 'height' | 'mass';
  readonly orientation: 'vertical' | 'inclined' | 'horizontal';
  /** rad from horizontal */
  readonly tilt: number;
  /** Liquid at the run temperature: N/m, Pa·s, kg/m³. */
  readonly liquid: { readonly surfaceTension: number; readonly viscosity: number; readonly density: number };
  /** Layer porosity, null when unknown (no permeability then). */
  readonly porosity: number | null;
  readonly fit: FitSettings;
}

/** Why a fit could not be made (the other fit of the run still shows). */
export interface FitFailure {
  readonly code: string;
  readonly message: string;
}

export type WireWashburnFit = Plain<Omit<WashburnSlopeResult, 'inputs' | 'fit'>>;
export type WireGravityFit = Plain<Omit<GravityFitResult, 'inputs'>>;

/** Both fits of one run, in plain (JSON) form. */
export interface RunAnalysis {
  readonly coreVersion: string;
  readonly washburn: WireWashburnFit | null;
  readonly washburnError: FitFailure | null;
  /** Null for horizontal runs (no gravity term) or when the fit fails. */
  readonly gravity: WireGravityFit | null;
  readonly gravityError: FitFailure | null;
}

/** Key figures of a run for lists (SI; null when not available). */
export interface RunFigures {
  /** K, m²/s (kg²/s for masses). */
  readonly washburnSlope: number | null;
  readonly rSquared: number | null;
  /** h_eq, m (kg for masses). */
  readonly equilibrium: number | null;
  /** k, m². */
  readonly permeability: number | null;
  readonly warnings: number;
}

function failure(e: unknown): FitFailure {
  if (isDomainError(e)) return { code: e.code, message: e.message };
  throw e;
}

/** The Washburn slope of a run with its saved window; throws DomainError on data no fit can use. */
export function labRunWashburnFit(run: LabRunFitInput): WashburnSlopeResult {
  return fitWashburnSlope({
    time: run.times,
    values: run.readings,
    quantity: run.measurement,
    window: run.fit.window,
    intercept: run.fit.intercept,
  });
}

/** Both fits of a run. A fit that cannot be made is reported as a failure; the other still shows. */
export function analyseLabRun(run: LabRunFitInput): RunAnalysis {
  let washburn: WireWashburnFit | null = null;
  let washburnError: FitFailure | null = null;
  try {
    const { inputs: _i, fit: _f, ...rest } = labRunWashburnFit(run);
    washburn = toPlain(rest);
  } catch (e) {
    washburnError = failure(e);
  }
  let gravity: WireGravityFit | null = null;
  let gravityError: FitFailure | null = null;
  if (run.orientation === 'horizontal') {
    gravityError = { code: 'no-gravity-term', message: 'A horizontal run has no gravity term: the Washburn slope describes it.' };
  } else {
    try {
      const heights = run.measurement === 'height';
      const { inputs: _i, ...rest } = fitGravityWashburn({
        time: run.times,
        values: run.readings,
        quantity: run.measurement,
        tilt: run.tilt,
        ...(heights
          ? {
              surfaceTension: run.liquid.surfaceTension,
              density: run.liquid.density,
              viscosity: run.liquid.viscosity,
              ...(run.fit.contactAngle !== null ? { contactAngle: run.fit.contactAngle } : {}),
              ...(run.porosity !== null ? { porosity: run.porosity } : {}),
            }
          : {}),
      });
      gravity = toPlain(rest);
    } catch (e) {
      gravityError = failure(e);
    }
  }
  return { coreVersion: WICK_CORE_VERSION, washburn, washburnError, gravity, gravityError };
}

/** Key figures of an analysis for lists. */
export function labRunFigures(a: RunAnalysis): RunFigures {
  return {
    washburnSlope: a.washburn?.slope ?? null,
    rSquared: a.washburn?.rSquared ?? null,
    equilibrium: a.gravity?.equilibrium?.value ?? null,
    permeability: a.gravity?.porousLayer?.permeability.value ?? null,
    warnings: (a.washburn?.warnings.length ?? 0) + (a.gravity?.warnings.length ?? 0),
  };
}

/** Fitted figures summarised over replicate runs. */
export const REPLICATE_FIGURES = ['washburnSlope', 'a', 'b', 'equilibrium', 'staticRadius', 'dynamicRadius', 'permeability', 'capillaryPressure'] as const;
export type ReplicateFigureKey = (typeof REPLICATE_FIGURES)[number];

/** A fitted value across the runs of a set: per-run values, mean and spread, outliers flagged. */
export interface ReplicateFigure {
  readonly key: ReplicateFigureKey;
  readonly label: string;
  /** SI unit of the values. */
  readonly unit: string;
  /** Runs that gave a value, in the order of `values`. */
  readonly runIds: readonly number[];
  readonly values: readonly number[];
  /** Runs flagged as outliers for this figure. */
  readonly outlierRunIds: readonly number[];
  readonly statistics: Plain<Omit<ReplicateResult, 'inputs'>>;
}

const FIGURES: readonly {
  readonly key: ReplicateFigureKey;
  readonly label: string;
  readonly unit: (m: 'height' | 'mass') => string;
  readonly pick: (a: RunAnalysis) => number | null | undefined;
}[] = [
  { key: 'washburnSlope', label: 'Washburn slope K', unit: (m) => (m === 'height' ? 'm^2/s' : 'kg^2/s'), pick: (a) => a.washburn?.slope },
  { key: 'a', label: 'Capillary term a', unit: (m) => (m === 'height' ? 'm^2/s' : 'kg^2/s'), pick: (a) => a.gravity?.a.value },
  { key: 'b', label: 'Gravity term b', unit: (m) => (m === 'height' ? 'm/s' : 'kg/s'), pick: (a) => a.gravity?.b.value },
  { key: 'equilibrium', label: 'Equilibrium height h_eq', unit: (m) => (m === 'height' ? 'm' : 'kg'), pick: (a) => a.gravity?.equilibrium?.value },
  { key: 'staticRadius', label: 'Static effective radius', unit: () => 'm', pick: (a) => a.gravity?.capillary?.staticRadius?.value },
  { key: 'dynamicRadius', label: 'Dynamic effective radius', unit: () => 'm', pick: (a) => a.gravity?.capillary?.dynamicRadius.value },
  { key: 'permeability', label: 'Permeability (in-plane)', unit: () => 'm^2', pick: (a) => a.gravity?.porousLayer?.permeability.value },
  { key: 'capillaryPressure', label: 'Capillary pressure', unit: () => 'Pa', pick: (a) => a.gravity?.porousLayer?.capillaryPressure.value },
];

/** Mean, spread and outlier runs (modified z-score, see replicates.ts) of every figure at least one run gives. */
export function replicateFigures(
  runs: readonly { readonly id: number; readonly name: string; readonly analysis: RunAnalysis }[],
  measurement: 'height' | 'mass',
): { readonly figures: ReplicateFigure[]; readonly warnings: ModelWarning[] } {
  const figures: ReplicateFigure[] = [];
  const warnings: ModelWarning[] = [];
  for (const f of FIGURES) {
    const have = runs.flatMap((r) => {
      const v = f.pick(r.analysis);
      return typeof v === 'number' && Number.isFinite(v) ? [{ id: r.id, name: r.name, v }] : [];
    });
    if (have.length === 0) continue;
    const { inputs: _i, ...stats } = replicateStatistics({ values: have.map((h) => h.v), labels: have.map((h) => `Run "${h.name}"`) });
    for (const w of stats.warnings) {
      if (w.code === 'outlier-run') warnings.push({ code: w.code, message: `${f.label}: ${w.message}` });
      // The same "too few runs" remark would otherwise repeat for every figure.
      else if (!warnings.some((x) => x.code === w.code)) warnings.push(w);
    }
    figures.push({
      key: f.key,
      label: f.label,
      unit: f.unit(measurement),
      runIds: have.map((h) => h.id),
      values: have.map((h) => h.v),
      outlierRunIds: stats.outliers.map((i) => have[i].id),
      statistics: toPlain(stats),
    });
  }
  return { figures, warnings };
}
