/**
 * Wire types of the design workspace API (`/api/projects`, `/api/designs`, `/api/variants`, `/api/compare`,
 * `/api/decisions`), shared by the server and the UI.
 */
import type { ComparedFigure, KeyFigure } from './key-figures';
import type { VariantInputRow } from './describe';
import type {
  EquationUsed,
  EvaluateVariantOptions,
  PinnedMaterial,
  VariantConfiguration,
  VariantInputs,
  VariantResults,
} from './variant';
import type { ModelWarning } from '../errors';

/** Printed on every report and shown beside every result. */
export const SAFETY_NOTE =
  'Every number here is an engineering estimate from idealised models. Products worn on skin by infants and ' +
  'patients, and any work with flammable reference solvents, must be confirmed by the applicable standard test ' +
  'methods, local regulations and qualified review.';

/** Compare takes 2 to 8 variants. */
export const COMPARE_MIN = 2;
export const COMPARE_MAX = 8;

export interface PersonRef {
  readonly id: number;
  readonly name: string;
}

/** A pinned library revision with what the library says about it now. */
export interface MaterialStatus extends PinnedMaterial {
  /** Whether the pinned revision is approved (now; a draft may have been approved since the save). */
  readonly approved: boolean;
  /** Number of a newer approved revision of the same entry, when there is one. */
  readonly newerApprovedRevision: number | null;
  /** False when the entry or revision no longer exists in the library. */
  readonly found: boolean;
}

export interface VariantSummary {
  readonly id: number;
  readonly designId: number;
  readonly name: string;
  readonly configuration: VariantConfiguration;
  readonly status: VariantResults['status'];
  readonly coreVersion: string;
  readonly usesUnapproved: boolean;
  readonly hasNewerMaterials: boolean;
  readonly materials: readonly MaterialStatus[];
  /** A few headline figures for lists. */
  readonly headline: readonly KeyFigure[];
  readonly updatedAt: string;
  readonly updatedBy: PersonRef;
}

export interface DesignSummary {
  readonly id: number;
  readonly projectId: number;
  readonly name: string;
  readonly description: string;
  readonly variants: readonly VariantSummary[];
}

export interface DecisionRecord {
  readonly id: number;
  readonly projectId: number;
  readonly variantIds: readonly number[];
  readonly baselineVariantId: number;
  readonly chosenVariantId: number | null;
  readonly chosenVariantName: string;
  readonly rationale: string;
  readonly decidedBy: PersonRef;
  /** ISO 8601. */
  readonly decidedAt: string;
}

export interface ProjectSummary {
  readonly id: number;
  readonly name: string;
  readonly description: string;
  readonly designCount: number;
  readonly variantCount: number;
  readonly updatedAt: string;
}

export interface ProjectDetail extends ProjectSummary {
  readonly designs: readonly DesignSummary[];
  readonly decisions: readonly DecisionRecord[];
}

export interface ProjectWrite {
  readonly name: string;
  readonly description?: string;
}

export interface DesignWrite {
  readonly name: string;
  readonly description?: string;
}

/** `POST /api/designs/:id/variants`, `PUT /api/variants/:id` (with the version read). */
export interface VariantWrite {
  readonly name: string;
  readonly notes?: string;
  readonly inputs: VariantInputs;
  /** Required on update: the version that was read (a stale one gets 409). */
  readonly version?: number;
}

export interface VariantDetail {
  readonly id: number;
  readonly designId: number;
  readonly designName: string;
  readonly projectId: number;
  readonly projectName: string;
  readonly name: string;
  readonly notes: string;
  readonly inputs: VariantInputs;
  readonly options: Required<EvaluateVariantOptions>;
  /** The server's results snapshot (the record). */
  readonly results: VariantResults;
  /** wick-core version the snapshot was computed with, and the one running now. */
  readonly coreVersion: string;
  readonly currentCoreVersion: string;
  readonly materials: readonly MaterialStatus[];
  readonly usesUnapproved: boolean;
  readonly hasNewerMaterials: boolean;
  readonly version: number;
  readonly createdAt: string;
  readonly updatedAt: string;
  readonly createdBy: PersonRef;
  readonly updatedBy: PersonRef;
}

/** `POST /api/variants/:id/rerun`: recompute with the running wick-core, optionally moving pins to the newest approved revisions. */
export interface RerunRequest {
  readonly version: number;
  readonly repin: boolean;
}

export interface CompareVariant {
  readonly id: number;
  readonly name: string;
  readonly designName: string;
  readonly projectId: number;
  readonly projectName: string;
  readonly configuration: VariantConfiguration;
  readonly status: VariantResults['status'];
  readonly usesUnapproved: boolean;
  readonly materials: readonly MaterialStatus[];
  /** Curve for the overlay plot (time s, height m), null without uptake. */
  readonly curve: { readonly time: readonly number[]; readonly height: readonly number[] } | null;
  /** A layered stack's liquid taken in against time (time s, absorbed and standing on the surface m³); null otherwise. */
  readonly uptake?: { readonly time: readonly number[]; readonly absorbed: readonly number[]; readonly surfaceLiquid: readonly number[] } | null;
}

/** `GET /api/compare?variants=1,2,3&baseline=2`. */
export interface CompareResponse {
  readonly baselineId: number;
  readonly variants: readonly CompareVariant[];
  readonly figures: readonly ComparedFigure[];
  /** Decisions already recorded on exactly this selection's project. */
  readonly decisions: readonly DecisionRecord[];
}

/** `POST /api/decisions`. */
export interface DecisionWrite {
  readonly variantIds: readonly number[];
  readonly baselineVariantId: number;
  readonly chosenVariantId: number;
  readonly rationale: string;
}

/** Everything the printable report of one variant shows. */
export interface VariantReport {
  readonly variant: VariantDetail;
  readonly inputRows: readonly VariantInputRow[];
  readonly keyFigures: readonly KeyFigure[];
  readonly equations: readonly EquationUsed[];
  readonly warnings: readonly ModelWarning[];
  readonly safetyNote: string;
  /** ISO 8601. */
  readonly generatedAt: string;
}

/** The printable report of a comparison. */
export interface ComparisonReport {
  readonly comparison: CompareResponse;
  readonly variants: readonly VariantReport[];
  readonly safetyNote: string;
  readonly generatedAt: string;
}
