/**
 * Wire types of lab data: measured wicking runs (an uploaded curve with its specimen, liquid and conditions),
 * replicate sets, their fits (wick-core's fitting family), the reference-liquid contact angle, prediction versus
 * measurement for a design variant, and proposals of fitted values to the library. SI units throughout.
 */
import type { ModelWarning } from '../errors';
import type { ReferenceLiquidResult } from '../fitting/contact-angle';
import type { FitSettings, ReplicateFigure, RunAnalysis, RunFigures } from '../fitting/lab-run';
import type { PredictionErrorResult } from '../fitting/metrics';
import type { VariantConfiguration } from '../design/variant';
import type { LiquidProperties } from '../liquids/liquid-at';
import type { CurveMeasurement, FileRef, UserRef } from './library';
import type { Plain } from './plain';

/** How the strip met the liquid. Horizontal runs have no gravity term (Washburn slope only). */
export const RUN_ORIENTATIONS = ['vertical', 'inclined', 'horizontal'] as const;
export type RunOrientation = (typeof RUN_ORIENTATIONS)[number];

export const RUN_ORIENTATION_LABELS: Readonly<Record<RunOrientation, string>> = {
  vertical: 'Vertical',
  inclined: 'Inclined',
  horizontal: 'Horizontal',
};

/** The variant configuration that models a run of each orientation (for prediction matching). */
export const ORIENTATION_CONFIGURATION: Readonly<Record<RunOrientation, VariantConfiguration>> = {
  vertical: 'vertical-strip',
  inclined: 'inclined-strip',
  horizontal: 'horizontal-strip',
};

/** A lab run needs at least this many readings (the automatic Washburn window keeps five). */
export const MIN_RUN_POINTS = 5;

/** Which liquid a run used: a built-in wick-core liquid, or a library liquid at one revision. */
export type RunLiquidChoice = { readonly builtInId: string } | { readonly entryId: number; readonly revision?: number };

/** The liquid as used by the fits: its identity and its properties at the run temperature (SI). */
export interface RunLiquid {
  readonly source: 'built-in' | 'library';
  readonly builtInId: string | null;
  readonly entryId: number | null;
  readonly revision: number | null;
  readonly name: string;
  /** N/m */
  readonly surfaceTension: number;
  /** Pa·s */
  readonly viscosity: number;
  /** kg/m³ */
  readonly density: number;
  readonly flammable: boolean;
  readonly sources: Readonly<Record<'surfaceTension' | 'viscosity' | 'density', string>>;
  /** Validity remarks from the liquid model at this temperature. */
  readonly remarks: readonly string[];
}

/** A run's liquid from wick-core's properties at the run temperature and the liquid's identity. */
export function runLiquidOf(p: LiquidProperties, identity: Pick<RunLiquid, 'source' | 'builtInId' | 'entryId' | 'revision'>): RunLiquid {
  return {
    ...identity,
    name: p.name,
    surfaceTension: p.surfaceTension,
    viscosity: p.viscosity,
    density: p.density,
    flammable: p.flammable ?? false,
    sources: { ...p.sources },
    remarks: [...new Set(p.warnings.map((w) => w.message))],
  };
}

/** The web a run's specimen was cut from, pinned at a revision. */
export interface RunWeb {
  readonly entryId: number;
  readonly revision: number;
  readonly name: string;
  /** Review state of that revision when the run was saved. */
  readonly state: string;
  /** Porosity of that revision (for permeability), null when the library has none. */
  readonly porosity: number | null;
}

/** Metadata of a new run (the multipart field `meta`, JSON); the CSV comes in the field `file`. */
export interface LabRunCreate {
  readonly name: string;
  /** An existing set of replicates, or a new set by name. */
  readonly setId?: number;
  readonly newSetName?: string;
  readonly webId: number;
  /** Default: the approved revision in force, else the newest. */
  readonly webRevision?: number;
  readonly liquid: RunLiquidChoice;
  /** K */
  readonly temperature: number;
  readonly orientation: RunOrientation;
  /** Tilt from horizontal, rad; required for 'inclined' (0 < α < π/2). */
  readonly tilt?: number;
  /** Specimen width and thickness, m. */
  readonly width?: number;
  readonly thickness?: number;
  /** Default: from the second column's unit. */
  readonly measurement?: CurveMeasurement;
  readonly conditions?: string;
  readonly notes?: string;
  /** ISO date of the test. */
  readonly measuredAt?: string;
}

/** `PUT /api/lab-data/runs/:id`. */
export interface LabRunUpdate {
  readonly version: number;
  readonly name: string;
  readonly conditions: string;
  readonly notes: string;
  readonly fit: FitSettings;
}

export interface LabSetRef {
  readonly id: number;
  readonly name: string;
}

export interface LabRunSummary {
  readonly id: number;
  readonly version: number;
  readonly name: string;
  readonly set: LabSetRef;
  readonly web: RunWeb;
  readonly liquidName: string;
  /** K */
  readonly temperature: number;
  readonly orientation: RunOrientation;
  readonly measurement: CurveMeasurement;
  readonly points: number;
  readonly measuredAt: string | null;
  readonly createdBy: UserRef;
  readonly createdAt: string;
  readonly figures: RunFigures;
}

export interface LabRunDetail extends LabRunSummary {
  readonly liquid: RunLiquid;
  /** rad from horizontal (π/2 vertical, 0 horizontal). */
  readonly tilt: number;
  readonly width: number | null;
  readonly thickness: number | null;
  readonly conditions: string;
  readonly notes: string;
  /** s */
  readonly times: readonly number[];
  /** m or kg */
  readonly values: readonly number[];
  /** Units of the uploaded file's columns, for display. */
  readonly timeUnit: string;
  readonly valueUnit: string;
  readonly file: FileRef;
  readonly fit: FitSettings;
  readonly analysis: RunAnalysis;
  readonly updatedBy: UserRef;
  readonly updatedAt: string;
  readonly actions: { readonly edit: boolean; readonly delete: boolean };
}

/** A proposal of a set's fitted values to the library: the web revision it created. */
export interface LabProposal {
  readonly entryId: number;
  readonly revision: number;
  readonly webName: string;
  readonly submitted: boolean;
  readonly proposedBy: UserRef;
  readonly proposedAt: string;
  readonly runIds: readonly number[];
  /** The values written into the revision, SI. */
  readonly figures: Readonly<Record<string, number>>;
}

export interface LabSetSummary {
  readonly id: number;
  readonly version: number;
  readonly name: string;
  readonly notes: string;
  readonly webId: number;
  readonly webName: string;
  readonly liquidName: string;
  readonly orientation: RunOrientation;
  readonly measurement: CurveMeasurement;
  readonly runCount: number;
  readonly createdBy: UserRef;
  readonly createdAt: string;
  readonly proposals: readonly LabProposal[];
}

export interface LabSetDetail extends LabSetSummary {
  readonly runs: readonly LabRunSummary[];
  readonly figures: readonly ReplicateFigure[];
  readonly warnings: readonly ModelWarning[];
  readonly actions: { readonly edit: boolean; readonly propose: boolean };
}

/** `PUT /api/lab-data/sets/:id`. */
export interface LabSetUpdate {
  readonly version: number;
  readonly name: string;
  readonly notes: string;
}

/** `GET /api/lab-data/contact-angle?reference=…&test=…`: two sets of the same web. */
export interface ContactAngleAnalysis {
  readonly reference: { readonly set: LabSetRef; readonly liquidName: string; readonly runIds: readonly number[]; readonly slopes: readonly number[] };
  readonly test: { readonly set: LabSetRef; readonly liquidName: string; readonly runIds: readonly number[]; readonly slopes: readonly number[] };
  readonly quantity: CurveMeasurement;
  readonly result: Plain<Omit<ReferenceLiquidResult, 'inputs'>>;
  /** The safety text to show with the result (flammable reference solvents). */
  readonly caution: string;
  readonly warnings: readonly ModelWarning[];
}

/** A saved design variant that uses the run's web and liquid. */
export interface PredictionCandidate {
  readonly variantId: number;
  readonly variantName: string;
  readonly designName: string;
  readonly projectName: string;
  readonly configuration: VariantConfiguration;
  /** Web revision the variant pinned. */
  readonly webRevision: number;
  readonly matches: { readonly configuration: boolean; readonly webRevision: boolean };
}

export interface PredictionComparison {
  readonly candidate: PredictionCandidate;
  readonly quantity: CurveMeasurement;
  readonly measured: { readonly time: readonly number[]; readonly values: readonly number[] };
  /** The variant re-evaluated over the run's duration (no tolerance bands). */
  readonly predicted: { readonly time: readonly number[]; readonly values: readonly number[] };
  readonly metrics: Plain<Omit<PredictionErrorResult, 'inputs'>>;
  readonly warnings: readonly ModelWarning[];
}

/** `POST /api/lab-data/sets/:id/propose`. */
export interface ProposeRequest {
  /** The web entry version the engineer saw (optimistic locking of the library). */
  readonly webVersion: number;
  /** Submit the new revision for review at once (default true); otherwise it stays a draft. */
  readonly submit?: boolean;
  /** Write the in-plane permeability (when the fits give one). Default true. */
  readonly permeability?: boolean;
  /** Attach the runs' curves with their files. Default true. */
  readonly curves?: boolean;
}
