/**
 * Wire types of the material and liquid library: entries (fibres, webs, liquids) with numbered revisions that
 * go draft → in review → approved | returned, their property values (SI + the unit typed + source), uploads and
 * review mail. The server validates the same shapes with zod schemas checked against these types.
 */

/** The three kinds of library entry. */
export const LIBRARY_KINDS = ['fibre', 'web', 'liquid'] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];

/** URL segment of each kind: `/api/library/fibres`, `/api/library/webs`, `/api/library/liquids`. */
export const LIBRARY_COLLECTION: Readonly<Record<LibraryKind, string>> = { fibre: 'fibres', web: 'webs', liquid: 'liquids' };

/**
 * Revision states. `draft` and `returned` are editable by a materials scientist; `in-review` waits for a
 * reviewer; `approved` is immutable (editing starts a new draft, and a newer approval supersedes it).
 */
export const REVISION_STATES = ['draft', 'in-review', 'approved', 'returned'] as const;
export type RevisionState = (typeof REVISION_STATES)[number];

export const REVISION_STATE_LABELS: Readonly<Record<RevisionState, string>> = {
  draft: 'Draft',
  'in-review': 'In review',
  approved: 'Approved',
  returned: 'Returned',
};

/** Where a number comes from. */
export const PROPERTY_SOURCES = ['measured', 'supplier-datasheet', 'handbook', 'estimate'] as const;
export type PropertySource = (typeof PROPERTY_SOURCES)[number];

export const PROPERTY_SOURCE_LABELS: Readonly<Record<PropertySource, string>> = {
  measured: 'Measured',
  'supplier-datasheet': 'Supplier datasheet',
  handbook: 'Handbook',
  estimate: 'Estimate',
};

/**
 * One numeric property: the SI value, the unit it was typed in (as the units module writes it, e.g. 'dtex',
 * 'g/m^2', 'um'), where it comes from, and optionally its standard uncertainty (SI, same dimension, ≥ 0).
 */
export interface PropertyValue {
  readonly si: number;
  readonly unit: string;
  readonly source: PropertySource;
  readonly uncertainty?: number;
  /** Method, standard, datasheet reference … */
  readonly note?: string;
}

// ——— fibres ———

/** An advancing contact angle of a named liquid on the fibre (angle in rad). */
export interface ContactAngle {
  readonly liquid: string;
  readonly angle: PropertyValue;
  /** e.g. "Wilhelmy, single fibre". */
  readonly method: string;
}

export interface FibreData {
  /** Polymer or material: "polypropylene", "PET", "PE/PP bicomponent", "viscose", "fluff pulp" … */
  readonly polymer: string;
  /** Fibre density, kg/m³. */
  readonly density: PropertyValue;
  /** Linear density, kg/m (typed in dtex or denier). Give this or `diameter`. */
  readonly linearDensity?: PropertyValue;
  /** Equivalent round diameter, m. */
  readonly diameter?: PropertyValue;
  /** Cross-section perimeter ratio χ ≥ 1 (1 = round). */
  readonly shapeFactor?: PropertyValue;
  /** Hydrophilic finish or none: "durable hydrophilic", "none (hydrophobic)" … */
  readonly finish?: string;
  readonly contactAngles: readonly ContactAngle[];
}

// ——— webs ———

export const WEB_KINDS = [
  'spunbond',
  'meltblown',
  'sms',
  'carded-thermal-bonded',
  'carded-through-air-bonded',
  'spunlace',
  'needlepunched',
  'airlaid',
  'wet-laid',
  'fluff-sap-core',
  'woven',
  'knit',
  'other',
] as const;
export type WebKind = (typeof WEB_KINDS)[number];

export const WEB_KIND_LABELS: Readonly<Record<WebKind, string>> = {
  spunbond: 'Spunbond',
  meltblown: 'Meltblown',
  sms: 'SMS laminate',
  'carded-thermal-bonded': 'Carded, thermal (calender) bonded',
  'carded-through-air-bonded': 'Carded, through-air bonded',
  spunlace: 'Spunlace (hydroentangled)',
  needlepunched: 'Needlepunched',
  airlaid: 'Airlaid',
  'wet-laid': 'Wet-laid',
  'fluff-sap-core': 'Fluff / superabsorbent core',
  woven: 'Woven',
  knit: 'Knit',
  other: 'Other',
};

/** A fibre of the blend by mass fraction (0–1); `fibreId` links a library fibre when there is one. */
export interface BlendPart {
  readonly fibreId?: number;
  readonly fibreName: string;
  readonly massFraction: number;
}

/** Forms of a pore-size distribution, as wick-core's pore-size module reads them. */
export const PSD_FORMS = ['differential', 'cumulative-finer', 'cumulative-coarser'] as const;
export type PsdForm = (typeof PSD_FORMS)[number];

/** An uploaded file kept for traceability: its id, name and SHA-256 of the original bytes. */
export interface FileRef {
  readonly fileId: number;
  readonly fileName: string;
  readonly sha256: string;
}

/** Pore-size distribution: class diameters (m, increasing) and volume fractions (0–1) in `form`. */
export interface PoreSizeDistributionData {
  readonly form: PsdForm;
  /** Unit the diameters were given in (for display). */
  readonly diameterUnit: string;
  readonly diameters: readonly number[];
  readonly fractions: readonly number[];
  readonly source: PropertySource;
  readonly file?: FileRef;
}

/** Permeability: a measured value, or which of wick-core's permeability correlations estimates it. */
export const PERMEABILITY_CORRELATIONS = ['kozeny-carman', 'davies', 'happel', 'jackson-james', 'gebart', 'tomadakis-robertson'] as const;
export type PermeabilityCorrelation = (typeof PERMEABILITY_CORRELATIONS)[number];

export const PERMEABILITY_CORRELATION_LABELS: Readonly<Record<PermeabilityCorrelation, string>> = {
  'kozeny-carman': 'Kozeny–Carman',
  davies: 'Davies',
  happel: 'Happel cell model',
  'jackson-james': 'Jackson–James',
  gebart: 'Gebart',
  'tomadakis-robertson': 'Tomadakis–Robertson',
};

export type PermeabilityData =
  | { readonly mode: 'measured'; readonly value: PropertyValue }
  | { readonly mode: 'correlation'; readonly correlation: PermeabilityCorrelation };

/** Superabsorbent figures (for cores): content by mass and the usual capacity tests, all in kg/kg = g/g. */
export interface SapData {
  /** Mass fraction of superabsorbent in the layer, 0–1. */
  readonly content: PropertyValue;
  readonly freeSwellCapacity?: PropertyValue;
  readonly centrifugeRetentionCapacity?: PropertyValue;
  readonly absorbencyUnderLoad?: PropertyValue;
  /** Load of the absorbency-under-load test, Pa. */
  readonly absorbencyUnderLoadPressure?: PropertyValue;
  /** Test liquid of the capacity figures, e.g. "0.9 % NaCl saline". */
  readonly testLiquid?: string;
}

/** A lab curve attached to a web: times (s) and heights (m) or masses (kg). */
export const CURVE_MEASUREMENTS = ['height', 'mass'] as const;
export type CurveMeasurement = (typeof CURVE_MEASUREMENTS)[number];

export interface LabCurve {
  /** Stable key within the revision (copied to later revisions). */
  readonly key: string;
  readonly name: string;
  readonly measurement: CurveMeasurement;
  readonly liquid?: string;
  readonly timeUnit: string;
  readonly valueUnit: string;
  readonly times: readonly number[];
  readonly values: readonly number[];
  readonly file?: FileRef;
}

export interface WebData {
  readonly webKind: WebKind;
  readonly blend: readonly BlendPart[];
  /** kg/m². */
  readonly basisWeight: PropertyValue;
  /** m, measured under `thicknessPressure`. */
  readonly thickness?: PropertyValue;
  /** Pa; required with a thickness. */
  readonly thicknessPressure?: PropertyValue;
  /**
   * `measured`: `porosity` as given. `computed`: the server computes ε = 1 − BW/(ρf t) from basis weight,
   * thickness and the blend's fibre density (wick-core fibre-bed), stored with source `estimate`.
   */
  readonly porosityMode: 'measured' | 'computed';
  readonly porosity?: PropertyValue;
  readonly meanFlowPoreSize?: PropertyValue;
  readonly poreSizeDistribution?: PoreSizeDistributionData;
  readonly permeabilityInPlane?: PermeabilityData;
  readonly permeabilityThroughPlane?: PermeabilityData;
  readonly sap?: SapData;
  readonly curves: readonly LabCurve[];
}

// ——— liquids ———

export const LIQUID_PROPERTIES = ['surfaceTension', 'viscosity', 'density'] as const;
export type LiquidPropertyName = (typeof LIQUID_PROPERTIES)[number];

/** A property as one constant (at a stated temperature, K) or a table over temperature (K → SI value). */
export type LiquidPropertyData =
  | { readonly mode: 'constant'; readonly value: PropertyValue; readonly temperature: PropertyValue }
  | {
      readonly mode: 'table';
      readonly unit: string;
      readonly temperatureUnit: string;
      readonly source: PropertySource;
      readonly note?: string;
      readonly points: readonly { readonly temperature: number; readonly value: number }[];
    };

export interface LiquidData {
  readonly surfaceTension: LiquidPropertyData;
  readonly viscosity: LiquidPropertyData;
  readonly density: LiquidPropertyData;
  readonly flammable: boolean;
  /** Composition, e.g. "9 g/L NaCl in deionised water". */
  readonly composition?: string;
}

export interface LibraryDataByKind {
  readonly fibre: FibreData;
  readonly web: WebData;
  readonly liquid: LiquidData;
}
export type LibraryData = FibreData | WebData | LiquidData;

// ——— entries and revisions ———

export interface UserRef {
  readonly id: number;
  readonly name: string;
}

export interface SupplierRef {
  readonly id: number;
  readonly name: string;
}

/** What create and update send: the entry's name, supplier, notes and the kind's data. */
export interface RevisionInput<D = LibraryData> {
  readonly name: string;
  readonly supplierId: number | null;
  readonly notes: string;
  readonly data: D;
}

/** Update: the input plus the entry version the edit is based on (optimistic locking). */
export interface RevisionUpdate<D = LibraryData> extends RevisionInput<D> {
  readonly version: number;
}

export interface RevisionSummary {
  readonly number: number;
  readonly state: RevisionState;
  readonly name: string;
  /** An approved revision that a later approval replaced. */
  readonly superseded: boolean;
  readonly createdBy: UserRef;
  readonly createdAt: string;
  readonly updatedBy: UserRef;
  readonly updatedAt: string;
  readonly submittedBy: UserRef | null;
  readonly submittedAt: string | null;
  readonly reviewedBy: UserRef | null;
  readonly reviewedAt: string | null;
  /** The reviewer's comment on approval or return. */
  readonly reviewComment: string | null;
}

export interface Revision<D = LibraryData> extends RevisionSummary {
  readonly supplier: SupplierRef | null;
  readonly notes: string;
  readonly data: D;
}

/** Key figures of an entry for table columns: SI value and the unit typed, or a text. */
export type EntryFigure = { readonly si: number; readonly unit: string } | { readonly text: string };

export interface EntrySummary {
  readonly id: number;
  readonly kind: LibraryKind;
  readonly version: number;
  /** Name, supplier, state and figures of the newest revision. */
  readonly name: string;
  readonly supplier: SupplierRef | null;
  readonly state: RevisionState;
  readonly headRevision: number;
  /** Number of the approved revision in force, if any. */
  readonly approvedRevision: number | null;
  readonly updatedAt: string;
  readonly updatedBy: UserRef;
  readonly submittedBy: UserRef | null;
  readonly figures: Readonly<Record<string, EntryFigure>>;
}

/** What the signed-in person may do with this entry now (the server enforces the same rules). */
export interface EntryActions {
  readonly edit: boolean;
  readonly submit: boolean;
  readonly approve: boolean;
  readonly return: boolean;
  readonly deleteDraft: boolean;
  /** Why approve/return is not offered (four-eyes), if that is the reason. */
  readonly reviewBlockedReason?: string;
}

export interface EntryDetail<D = LibraryData> {
  readonly id: number;
  readonly kind: LibraryKind;
  readonly version: number;
  /** The newest revision (may be a draft). */
  readonly head: Revision<D>;
  /** The approved revision in force, when it is not the head. */
  readonly approved: Revision<D> | null;
  readonly revisions: readonly RevisionSummary[];
  readonly actions: EntryActions;
}

/** `POST …/submit`, `…/approve`: the entry version the caller saw. */
export interface TransitionRequest {
  readonly version: number;
  readonly comment?: string;
}

/** `POST …/return`: a comment is required. */
export interface ReturnRequest {
  readonly version: number;
  readonly comment: string;
}

export interface Page<T> {
  readonly items: readonly T[];
  readonly total: number;
  readonly page: number;
  readonly pageSize: number;
}

export const LIST_SORTS = ['name', 'updatedAt', 'state', 'supplier'] as const;

/** Query of `GET /api/library/{fibres|webs|liquids}` and `GET /api/library/entries`. */
export interface ListQuery {
  readonly page?: number;
  readonly pageSize?: number;
  /** 'name' | 'updatedAt' | 'state' | 'supplier' | a figure key of the kind. */
  readonly sort?: string;
  readonly dir?: 'asc' | 'desc';
  /** Text in the name or notes. */
  readonly q?: string;
  readonly state?: RevisionState;
  readonly supplierId?: number;
  /** webKind for webs, polymer for fibres. */
  readonly type?: string;
}

/** A change between two revisions: the path of the value and both sides (absent = undefined). */
export interface DiffChange {
  readonly path: string;
  readonly before?: unknown;
  readonly after?: unknown;
}

export interface RevisionDiff {
  readonly from: number;
  readonly to: number;
  readonly changes: readonly DiffChange[];
}

/** Figure columns per kind: key, label and dimension of the SI value (for the table's unit display). */
export interface FigureColumn {
  readonly key: string;
  readonly label: string;
  /** A units-module dimension name, or 'text'. */
  readonly dimension: string;
}

export const FIGURE_COLUMNS: Readonly<Record<LibraryKind, readonly FigureColumn[]>> = {
  fibre: [
    { key: 'polymer', label: 'Polymer', dimension: 'text' },
    { key: 'linearDensity', label: 'Linear density', dimension: 'linearDensity' },
    { key: 'diameter', label: 'Diameter', dimension: 'length' },
    { key: 'density', label: 'Fibre density', dimension: 'density' },
  ],
  web: [
    { key: 'webKind', label: 'Kind', dimension: 'text' },
    { key: 'basisWeight', label: 'Basis weight', dimension: 'basisWeight' },
    { key: 'thickness', label: 'Thickness', dimension: 'length' },
    { key: 'porosity', label: 'Porosity', dimension: 'fraction' },
    { key: 'meanFlowPoreSize', label: 'Mean-flow pore', dimension: 'length' },
  ],
  liquid: [
    { key: 'surfaceTension', label: 'Surface tension', dimension: 'surfaceTension' },
    { key: 'viscosity', label: 'Viscosity', dimension: 'viscosity' },
    { key: 'density', label: 'Density', dimension: 'density' },
  ],
};

// ——— uploads ———

export const UPLOAD_PURPOSES = ['psd', 'curve', 'web-import'] as const;
export type UploadPurpose = (typeof UPLOAD_PURPOSES)[number];

/** One problem in an uploaded file; `line` is 1-based in the file (the header is line 1 unless preceded by comments). */
export interface UploadIssue {
  readonly line: number | null;
  readonly column?: string;
  readonly message: string;
}

/** What the server detected about a file before parsing it. */
export interface UploadFileInfo {
  readonly fileName: string;
  readonly size: number;
  readonly sha256: string;
  readonly encoding: string;
  readonly delimiter: string;
  readonly rows: number;
}

/** A web row of a bulk import, as it will be created (a draft revision). */
export interface WebImportRow {
  readonly line: number;
  readonly input: RevisionInput<WebData>;
}

export type UploadPreviewData =
  | { readonly purpose: 'psd'; readonly psd: PoreSizeDistributionData }
  | { readonly purpose: 'curve'; readonly curve: LabCurve }
  | { readonly purpose: 'web-import'; readonly webs: readonly WebImportRow[] };

/** 201 answer of an upload: a preview kept on the server until it is committed or discarded. */
export interface UploadPreview {
  readonly uploadId: number;
  readonly entryId: number | null;
  readonly file: UploadFileInfo;
  readonly warnings: readonly UploadIssue[];
  readonly preview: UploadPreviewData;
  readonly expiresAt: string;
}

/** 422 `details` of a rejected upload: every problem found, with its line. */
export interface UploadRejection {
  readonly file?: UploadFileInfo;
  readonly issues: readonly UploadIssue[];
}

/** `POST /api/library/uploads/{id}/commit`: for psd and curve uploads, the entry version the caller saw. */
export interface UploadCommitRequest {
  readonly version?: number;
}

export interface UploadCommitResult {
  readonly purpose: UploadPurpose;
  /** The entry changed (psd, curve) or the entries created (web-import). */
  readonly entryIds: readonly number[];
}

/**
 * A built-in liquid (wick-core's water model and handbook liquids), read-only in the library: its properties at
 * `temperature` (K) in SI, where each comes from, and remarks (range, handling, flammability).
 */
export interface BuiltInLiquidRow {
  readonly id: string;
  readonly name: string;
  readonly flammable: boolean;
  readonly validRange: { readonly min: number; readonly max: number };
  readonly temperature: number;
  readonly surfaceTension: number;
  readonly viscosity: number;
  readonly density: number;
  readonly sources: Readonly<Record<LiquidPropertyName, string>>;
  readonly remarks: readonly string[];
}

// ——— dev mailbox ———

export interface MailboxMessage {
  readonly id: string;
  readonly receivedAt: string;
  readonly from: string;
  readonly to: readonly string[];
  readonly subject: string;
  readonly text: string;
}

/** `GET /api/dev/mailbox`: `available` is false when the local mail fake is not running. */
export interface DevMailbox {
  readonly available: boolean;
  readonly messages: readonly MailboxMessage[];
}
