/**
 * zod schemas of the library API: one source for request validation, the OpenAPI document (/api/docs) and —
 * through `satisfies` against wick-core's wire types — the TypeScript the UI uses.
 */
import { z } from 'zod';
import {
  type BlendPart,
  type ContactAngle,
  CURVE_MEASUREMENTS,
  type Dimension,
  dimensionInfo,
  type DiffChange,
  type EntryActions,
  type EntryDetail,
  type EntryFigure,
  type EntrySummary,
  type FibreData,
  type FileRef,
  type LabCurve,
  LIBRARY_KINDS,
  type LibraryKind,
  type LiquidData,
  type LiquidPropertyData,
  type ListQuery,
  type MailboxMessage,
  PERMEABILITY_CORRELATIONS,
  type PermeabilityData,
  type PoreSizeDistributionData,
  PROPERTY_SOURCES,
  type PropertyValue,
  PSD_FORMS,
  type ReturnRequest,
  REVISION_STATES,
  type RevisionDiff,
  type RevisionSummary,
  type SapData,
  type TransitionRequest,
  type UploadCommitRequest,
  type UploadCommitResult,
  type UploadIssue,
  type UploadPreview,
  unitFits,
  WEB_KINDS,
  type WebData,
} from 'wick-core';

type Ctx = z.core.$RefinementCtx;

function issue(ctx: Ctx, path: (string | number)[], rule: string, message: string): void {
  ctx.addIssue({ code: 'custom', path, message, params: { rule } });
}

interface Limits {
  /** Smallest allowed SI value (inclusive unless `exclusiveMin`). */
  readonly min: number;
  readonly max: number;
  readonly exclusiveMin?: boolean;
  readonly exclusiveMax?: boolean;
}

/** Is `si` inside the plausible range? Adds a `range` issue at `path` if not. */
function checkRange(ctx: Ctx, path: (string | number)[], si: number, dimension: Dimension, limits: Limits, unitHint: string): void {
  const low = limits.exclusiveMin ? si <= limits.min : si < limits.min;
  const high = limits.exclusiveMax ? si >= limits.max : si > limits.max;
  if (low || high) {
    issue(
      ctx,
      path,
      'range',
      `${dimensionInfo(dimension).words} of ${si} (SI) is outside the plausible range ${limits.min}${limits.exclusiveMin ? ' (excl.)' : ''} … ` +
        `${limits.max}${limits.exclusiveMax ? ' (excl.)' : ''} ${dimensionInfo(dimension).si}; check the number and its unit (${unitHint}).`,
    );
  }
}

const unitText = z.string().trim().min(1).max(40);
const shortText = (max: number) => z.string().trim().max(max);

/** A numeric property of `dimension`: SI value, the unit typed, source and optional uncertainty. */
export function propertyValue(dimension: Dimension, limits: Limits) {
  return z
    .object({
      si: z.number(),
      unit: unitText,
      source: z.enum(PROPERTY_SOURCES),
      uncertainty: z.number().nonnegative().optional(),
      note: shortText(500).optional(),
    })
    .superRefine((v, ctx) => {
      if (!unitFits(v.unit, dimension)) {
        issue(ctx, ['unit'], 'unit-dimension', `"${v.unit}" is not a unit of ${dimensionInfo(dimension).words} (e.g. ${dimensionInfo(dimension).example}).`);
        return;
      }
      checkRange(ctx, ['si'], v.si, dimension, limits, v.unit);
    }) satisfies z.ZodType<PropertyValue>;
}

// Plausible ranges (SI). Wide on purpose: they catch unit slips (g/m² typed as kg/m²), not unusual materials.
const RANGES = {
  fibreDensity: { min: 100, max: 5000 },
  linearDensity: { min: 1e-9, max: 1e-3 },
  fibreDiameter: { min: 1e-8, max: 2e-3 },
  shapeFactor: { min: 1, max: 20 },
  angle: { min: 0, max: Math.PI },
  basisWeight: { min: 1e-3, max: 10, exclusiveMin: false },
  thickness: { min: 1e-6, max: 0.2 },
  pressure: { min: 0, max: 1e7, exclusiveMin: true },
  openFraction: { min: 0, max: 1, exclusiveMin: true, exclusiveMax: true },
  fraction: { min: 0, max: 1 },
  poreSize: { min: 1e-9, max: 1e-2 },
  permeability: { min: 1e-20, max: 1e-5 },
  capacity: { min: 0, max: 2000 },
  surfaceTension: { min: 1e-3, max: 1 },
  viscosity: { min: 1e-6, max: 1e5 },
  liquidDensity: { min: 100, max: 25000 },
  temperature: { min: 150, max: 700 },
} satisfies Record<string, Limits>;

// ——— fibres ———

export const contactAngleSchema = z.object({
  liquid: shortText(120).min(1),
  angle: propertyValue('angle', RANGES.angle),
  method: shortText(200).min(1),
}) satisfies z.ZodType<ContactAngle>;

export const fibreDataSchema = z
  .object({
    polymer: shortText(120).min(1),
    density: propertyValue('density', RANGES.fibreDensity),
    linearDensity: propertyValue('linearDensity', RANGES.linearDensity).optional(),
    diameter: propertyValue('length', RANGES.fibreDiameter).optional(),
    shapeFactor: propertyValue('dimensionless', RANGES.shapeFactor).optional(),
    finish: shortText(200).optional(),
    contactAngles: z.array(contactAngleSchema).max(20).default([]),
  })
  .superRefine((f, ctx) => {
    if (!f.linearDensity && !f.diameter) {
      issue(ctx, ['linearDensity'], 'size-required', 'Give the linear density (dtex, denier) or the fibre diameter.');
    }
  })
  .meta({ id: 'FibreData' }) satisfies z.ZodType<FibreData>;

// ——— webs ———

export const blendPartSchema = z.object({
  fibreId: z.number().int().positive().optional(),
  fibreName: shortText(200).min(1),
  massFraction: z.number().gt(0).lte(1),
}) satisfies z.ZodType<BlendPart>;

export const fileRefSchema = z.object({
  fileId: z.number().int().positive(),
  fileName: z.string().max(255),
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
}) satisfies z.ZodType<FileRef>;

const increasing = (values: readonly number[]) => values.every((v, i) => i === 0 || v > values[i - 1]);

export const psdSchema = z
  .object({
    form: z.enum(PSD_FORMS),
    diameterUnit: unitText,
    diameters: z.array(z.number().positive()).min(2).max(2000),
    fractions: z.array(z.number().min(0).max(1)).min(2).max(2000),
    source: z.enum(PROPERTY_SOURCES),
    file: fileRefSchema.optional(),
  })
  .superRefine((p, ctx) => {
    if (p.diameters.length !== p.fractions.length) {
      issue(ctx, ['fractions'], 'same-length', `There are ${p.diameters.length} diameters but ${p.fractions.length} fractions.`);
    }
    if (!increasing(p.diameters)) issue(ctx, ['diameters'], 'increasing', 'Class diameters must increase strictly.');
    if (!unitFits(p.diameterUnit, 'length')) issue(ctx, ['diameterUnit'], 'unit-dimension', `"${p.diameterUnit}" is not a unit of length.`);
  })
  .meta({ id: 'PoreSizeDistribution' }) satisfies z.ZodType<PoreSizeDistributionData>;

export const permeabilitySchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('measured'), value: propertyValue('permeability', RANGES.permeability) }),
  z.object({ mode: z.literal('correlation'), correlation: z.enum(PERMEABILITY_CORRELATIONS) }),
]) satisfies z.ZodType<PermeabilityData>;

export const sapSchema = z.object({
  content: propertyValue('fraction', RANGES.fraction),
  freeSwellCapacity: propertyValue('massPerMass', RANGES.capacity).optional(),
  centrifugeRetentionCapacity: propertyValue('massPerMass', RANGES.capacity).optional(),
  absorbencyUnderLoad: propertyValue('massPerMass', RANGES.capacity).optional(),
  absorbencyUnderLoadPressure: propertyValue('pressure', RANGES.pressure).optional(),
  testLiquid: shortText(120).optional(),
}) satisfies z.ZodType<SapData>;

export const labCurveSchema = z
  .object({
    key: z.string().regex(/^[a-z0-9-]{1,40}$/),
    name: shortText(200).min(1),
    measurement: z.enum(CURVE_MEASUREMENTS),
    liquid: shortText(120).optional(),
    timeUnit: unitText,
    valueUnit: unitText,
    times: z.array(z.number().min(0)).min(2).max(20000),
    values: z.array(z.number()).min(2).max(20000),
    file: fileRefSchema.optional(),
  })
  .superRefine((c, ctx) => {
    if (c.times.length !== c.values.length) issue(ctx, ['values'], 'same-length', 'Times and values differ in length.');
    if (!increasing(c.times)) issue(ctx, ['times'], 'increasing', 'Times must increase strictly.');
    if (!unitFits(c.timeUnit, 'time')) issue(ctx, ['timeUnit'], 'unit-dimension', `"${c.timeUnit}" is not a unit of time.`);
    const dim = c.measurement === 'height' ? 'length' : 'mass';
    if (!unitFits(c.valueUnit, dim)) issue(ctx, ['valueUnit'], 'unit-dimension', `"${c.valueUnit}" is not a unit of ${dimensionInfo(dim).words}.`);
  }) satisfies z.ZodType<LabCurve>;

/** Mass fractions of a blend add up to 1 within this (rounded percentages). */
export const BLEND_SUM_TOLERANCE = 0.005;

export const webDataSchema = z
  .object({
    webKind: z.enum(WEB_KINDS),
    blend: z.array(blendPartSchema).min(1).max(12),
    basisWeight: propertyValue('basisWeight', RANGES.basisWeight),
    thickness: propertyValue('length', RANGES.thickness).optional(),
    thicknessPressure: propertyValue('pressure', RANGES.pressure).optional(),
    porosityMode: z.enum(['measured', 'computed']),
    porosity: propertyValue('fraction', RANGES.openFraction).optional(),
    meanFlowPoreSize: propertyValue('length', RANGES.poreSize).optional(),
    poreSizeDistribution: psdSchema.optional(),
    permeabilityInPlane: permeabilitySchema.optional(),
    permeabilityThroughPlane: permeabilitySchema.optional(),
    sap: sapSchema.optional(),
    curves: z.array(labCurveSchema).max(50).default([]),
  })
  .superRefine((w, ctx) => {
    const sum = w.blend.reduce((s, p) => s + p.massFraction, 0);
    if (Math.abs(sum - 1) > BLEND_SUM_TOLERANCE) {
      issue(ctx, ['blend'], 'fractions-sum', `Blend mass fractions add up to ${(sum * 100).toFixed(1)} %, not 100 %.`);
    }
    if (w.thickness && !w.thicknessPressure) {
      issue(ctx, ['thicknessPressure'], 'thickness-needs-pressure', 'Give the pressure at which the thickness was measured.');
    }
    if (w.porosityMode === 'measured' && !w.porosity) {
      issue(ctx, ['porosity'], 'porosity-required', 'Give the measured porosity, or choose "computed".');
    }
    if (w.porosityMode === 'computed' && !w.thickness) {
      issue(ctx, ['thickness'], 'thickness-required', 'A computed porosity needs the thickness.');
    }
    const keys = new Set<string>();
    w.curves.forEach((c, i) => {
      if (keys.has(c.key)) issue(ctx, ['curves', i, 'key'], 'unique', `Curve key "${c.key}" is used twice.`);
      keys.add(c.key);
    });
  })
  .meta({ id: 'WebData' }) satisfies z.ZodType<WebData>;

// ——— liquids ———

function liquidProperty(dimension: Dimension, limits: Limits) {
  return z
    .discriminatedUnion('mode', [
      z.object({
        mode: z.literal('constant'),
        value: propertyValue(dimension, limits),
        temperature: propertyValue('temperature', RANGES.temperature),
      }),
      z.object({
        mode: z.literal('table'),
        unit: unitText,
        temperatureUnit: unitText,
        source: z.enum(PROPERTY_SOURCES),
        note: shortText(500).optional(),
        points: z.array(z.object({ temperature: z.number(), value: z.number() })).min(2).max(200),
      }),
    ])
    .superRefine((p, ctx) => {
      if (p.mode !== 'table') return;
      if (!unitFits(p.unit, dimension)) issue(ctx, ['unit'], 'unit-dimension', `"${p.unit}" is not a unit of ${dimensionInfo(dimension).words}.`);
      if (!unitFits(p.temperatureUnit, 'temperature')) issue(ctx, ['temperatureUnit'], 'unit-dimension', `"${p.temperatureUnit}" is not a unit of temperature.`);
      if (!increasing(p.points.map((q) => q.temperature))) issue(ctx, ['points'], 'increasing', 'Table temperatures must increase strictly.');
      p.points.forEach((q, i) => {
        checkRange(ctx, ['points', i, 'temperature'], q.temperature, 'temperature', RANGES.temperature, 'K');
        checkRange(ctx, ['points', i, 'value'], q.value, dimension, limits, dimensionInfo(dimension).si);
      });
    }) satisfies z.ZodType<LiquidPropertyData>;
}

export const liquidDataSchema = z
  .object({
    surfaceTension: liquidProperty('surfaceTension', RANGES.surfaceTension),
    viscosity: liquidProperty('viscosity', RANGES.viscosity),
    density: liquidProperty('density', RANGES.liquidDensity),
    flammable: z.boolean(),
    composition: shortText(300).optional(),
  })
  .meta({ id: 'LiquidData' }) satisfies z.ZodType<LiquidData>;

export const DATA_SCHEMAS = { fibre: fibreDataSchema, web: webDataSchema, liquid: liquidDataSchema } as const;

// ——— requests ———

export function revisionInputSchema<K extends LibraryKind>(kind: K) {
  return z.object({
    name: z.string().trim().min(1).max(200),
    supplierId: z.number().int().positive().nullable().default(null),
    notes: z.string().max(5000).default(''),
    data: DATA_SCHEMAS[kind],
  });
}

export function revisionUpdateSchema<K extends LibraryKind>(kind: K) {
  return revisionInputSchema(kind).extend({ version: z.number().int().positive() });
}

export const transitionSchema = z
  .object({ version: z.number().int().positive(), comment: z.string().trim().max(2000).optional() })
  .meta({ id: 'TransitionRequest' }) satisfies z.ZodType<TransitionRequest>;

export const returnSchema = z
  .object({ version: z.number().int().positive(), comment: z.string().trim().min(1, 'Say what needs to change.').max(2000) })
  .meta({ id: 'ReturnRequest' }) satisfies z.ZodType<ReturnRequest>;

export const idParamsSchema = z.object({ id: z.coerce.number().int().positive() });
export const revisionParamsSchema = z.object({ id: z.coerce.number().int().positive(), number: z.coerce.number().int().positive() });

export const listQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sort: z.string().max(40).default('name'),
  dir: z.enum(['asc', 'desc']).default('asc'),
  q: z.string().trim().max(100).optional(),
  state: z.enum(REVISION_STATES).optional(),
  supplierId: z.coerce.number().int().positive().optional(),
  type: z.string().trim().max(60).optional(),
}) satisfies z.ZodType<ListQuery>;

export const allEntriesQuerySchema = listQuerySchema.extend({ kind: z.enum(LIBRARY_KINDS).optional() });

export const diffQuerySchema = z
  .object({ from: z.coerce.number().int().positive(), to: z.coerce.number().int().positive() })
  .refine((q) => q.from !== q.to, { message: 'Choose two different revisions.', path: ['to'], params: { rule: 'different' } });

export const deleteDraftQuerySchema = z.object({ version: z.coerce.number().int().positive() });

export const uploadCommitSchema = z.object({ version: z.number().int().positive().optional() }) satisfies z.ZodType<UploadCommitRequest>;

export const curveUploadFieldsSchema = z.object({
  name: z.string().trim().min(1).max(200),
  measurement: z.enum(CURVE_MEASUREMENTS).optional(),
  liquid: z.string().trim().max(120).optional(),
});

export const psdUploadFieldsSchema = z.object({
  form: z.enum(PSD_FORMS).optional(),
  source: z.enum(PROPERTY_SOURCES).default('measured'),
});

// ——— responses (documentation; the services build these shapes) ———

const userRef = z.object({ id: z.number(), name: z.string() }).meta({ id: 'UserRef' });
const supplierRef = z.object({ id: z.number(), name: z.string() }).meta({ id: 'SupplierRef' });

export const revisionSummarySchema = z
  .object({
    number: z.number(),
    state: z.enum(REVISION_STATES),
    name: z.string(),
    superseded: z.boolean(),
    createdBy: userRef,
    createdAt: z.string(),
    updatedBy: userRef,
    updatedAt: z.string(),
    submittedBy: userRef.nullable(),
    submittedAt: z.string().nullable(),
    reviewedBy: userRef.nullable(),
    reviewedAt: z.string().nullable(),
    reviewComment: z.string().nullable(),
  })
  .meta({ id: 'RevisionSummary' }) satisfies z.ZodType<RevisionSummary>;

export function revisionSchema<K extends LibraryKind>(kind: K) {
  return revisionSummarySchema.extend({ supplier: supplierRef.nullable(), notes: z.string(), data: DATA_SCHEMAS[kind] });
}

const actionsSchema = z.object({
  edit: z.boolean(),
  submit: z.boolean(),
  approve: z.boolean(),
  return: z.boolean(),
  deleteDraft: z.boolean(),
  reviewBlockedReason: z.string().optional(),
}) satisfies z.ZodType<EntryActions>;

export function entryDetailSchema<K extends LibraryKind>(kind: K) {
  const rev = revisionSchema(kind);
  return z.object({
    id: z.number(),
    kind: z.enum(LIBRARY_KINDS),
    version: z.number(),
    head: rev,
    approved: rev.nullable(),
    revisions: z.array(revisionSummarySchema),
    actions: actionsSchema,
  });
}

// Generic factories are not checked against the wire types by `satisfies`; one concrete instance per kind is.
void (entryDetailSchema('fibre') satisfies z.ZodType<EntryDetail<FibreData>>);
void (entryDetailSchema('web') satisfies z.ZodType<EntryDetail<WebData>>);
void (entryDetailSchema('liquid') satisfies z.ZodType<EntryDetail<LiquidData>>);

const figureSchema = z.union([z.object({ si: z.number(), unit: z.string() }), z.object({ text: z.string() })]) satisfies z.ZodType<EntryFigure>;

export const entrySummarySchema = z
  .object({
    id: z.number(),
    kind: z.enum(LIBRARY_KINDS),
    version: z.number(),
    name: z.string(),
    supplier: supplierRef.nullable(),
    state: z.enum(REVISION_STATES),
    headRevision: z.number(),
    approvedRevision: z.number().nullable(),
    updatedAt: z.string(),
    updatedBy: userRef,
    submittedBy: userRef.nullable(),
    figures: z.record(z.string(), figureSchema),
  })
  .meta({ id: 'EntrySummary' }) satisfies z.ZodType<EntrySummary>;

export const entryPageSchema = z
  .object({ items: z.array(entrySummarySchema), total: z.number(), page: z.number(), pageSize: z.number() })
  .meta({ id: 'EntryPage' });

export const diffSchema = z
  .object({
    from: z.number(),
    to: z.number(),
    changes: z.array(z.object({ path: z.string(), before: z.unknown().optional(), after: z.unknown().optional() }) satisfies z.ZodType<DiffChange>),
  })
  .meta({ id: 'RevisionDiff' }) satisfies z.ZodType<RevisionDiff>;

const uploadIssueSchema = z.object({ line: z.number().nullable(), column: z.string().optional(), message: z.string() }) satisfies z.ZodType<UploadIssue>;

export const uploadPreviewSchema = z
  .object({
    uploadId: z.number(),
    entryId: z.number().nullable(),
    file: z.object({ fileName: z.string(), size: z.number(), sha256: z.string(), encoding: z.string(), delimiter: z.string(), rows: z.number() }),
    warnings: z.array(uploadIssueSchema),
    preview: z.discriminatedUnion('purpose', [
      z.object({ purpose: z.literal('psd'), psd: psdSchema }),
      z.object({ purpose: z.literal('curve'), curve: labCurveSchema }),
      z.object({
        purpose: z.literal('web-import'),
        webs: z.array(z.object({ line: z.number(), input: revisionInputSchema('web') })),
      }),
    ]),
    expiresAt: z.string(),
  })
  .meta({ id: 'UploadPreview' }) satisfies z.ZodType<UploadPreview>;

export const uploadCommitResultSchema = z
  .object({ purpose: z.enum(['psd', 'curve', 'web-import']), entryIds: z.array(z.number()) })
  .meta({ id: 'UploadCommitResult' }) satisfies z.ZodType<UploadCommitResult>;

export const mailboxMessageSchema = z
  .object({ id: z.string(), receivedAt: z.string(), from: z.string(), to: z.array(z.string()), subject: z.string(), text: z.string() })
  .meta({ id: 'MailboxMessage' }) satisfies z.ZodType<MailboxMessage>;
