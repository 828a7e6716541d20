/**
 * zod schemas of the lab-data API: request validation and the OpenAPI document. Curves themselves are read from
 * the uploaded CSV by the library's curve reader and checked by wick-core.
 */
import { z } from 'zod';
import {
  CURVE_MEASUREMENTS,
  type FitSettings,
  type LabRunCreate,
  type LabRunUpdate,
  type LabSetUpdate,
  type ProposeRequest,
  RUN_ORIENTATIONS,
} from 'wick-core';

export const labIdParamsSchema = z.object({ id: z.coerce.number().int().positive() });
export const comparisonParamsSchema = z.object({ id: z.coerce.number().int().positive(), variantId: z.coerce.number().int().positive() });

const name = z.string().trim().min(1, 'Give a name.').max(200);
const text = z.string().max(5000);
const positiveId = z.number().int().positive();

export const fitSettingsSchema = z
  .object({
    window: z.union([
      z.literal('auto'),
      z.literal('all'),
      z
        .object({ start: z.number().min(0).optional(), end: z.number().positive().optional() })
        .refine((w) => w.start === undefined || w.end === undefined || w.end > w.start, { message: 'The window must end after it starts.', params: { rule: 'window-order' } }),
    ]),
    intercept: z.boolean(),
    contactAngle: z
      .number()
      .min(0)
      .max(Math.PI / 2 - 1e-9, 'Radii need a contact angle below 90°.')
      .nullable()
      .describe('rad; null: radii are reported as r·cos θ.'),
  })
  .meta({ id: 'FitSettings' }) satisfies z.ZodType<FitSettings>;

/** The JSON in the multipart field `meta` of a run upload. */
export const runCreateSchema = z
  .object({
    name,
    setId: positiveId.optional(),
    newSetName: name.optional(),
    webId: positiveId,
    webRevision: positiveId.optional(),
    liquid: z.union([z.object({ builtInId: z.string().min(1).max(60) }), z.object({ entryId: positiveId, revision: positiveId.optional() })]),
    temperature: z.number().min(253.15, 'Below −20 °C: check the unit (kelvin).').max(373.15, 'Above 100 °C: check the unit (kelvin).').describe('K'),
    orientation: z.enum(RUN_ORIENTATIONS),
    tilt: z.number().gt(0).lt(Math.PI / 2).optional().describe('rad from horizontal; inclined runs only.'),
    width: z.number().positive().max(1).optional().describe('m'),
    thickness: z.number().positive().max(0.1).optional().describe('m'),
    measurement: z.enum(CURVE_MEASUREMENTS).optional(),
    conditions: text.optional(),
    notes: text.optional(),
    measuredAt: z.iso.date().optional(),
  })
  .superRefine((m, ctx) => {
    if ((m.setId === undefined) === (m.newSetName === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['setId'], message: 'Choose an existing set (setId) or name a new one (newSetName), not both.', params: { rule: 'one-set' } });
    }
    if (m.orientation === 'inclined' && m.tilt === undefined) {
      ctx.addIssue({ code: 'custom', path: ['tilt'], message: 'An inclined run needs its tilt from horizontal.', params: { rule: 'required' } });
    }
  })
  .meta({ id: 'LabRunCreate' }) satisfies z.ZodType<LabRunCreate>;

/** Multipart fields of `POST /api/lab-data/runs` (documentation; the handler parses `meta` with runCreateSchema). */
export const runUploadFieldsSchema = z.object({
  meta: z.string().describe('LabRunCreate as JSON: name, setId or newSetName, webId, liquid, temperature (K), orientation …'),
  file: z.string().meta({ format: 'binary', description: 'CSV: time with its unit, then height or mass with its unit.' }),
});

export const runUpdateSchema = z
  .object({ version: positiveId, name, conditions: text, notes: text, fit: fitSettingsSchema })
  .meta({ id: 'LabRunUpdate' }) satisfies z.ZodType<LabRunUpdate>;

export const setUpdateSchema = z.object({ version: positiveId, name, notes: text }).meta({ id: 'LabSetUpdate' }) satisfies z.ZodType<LabSetUpdate>;

export const runListQuerySchema = z.object({
  setId: z.coerce.number().int().positive().optional(),
  webId: z.coerce.number().int().positive().optional(),
});

export const setListQuerySchema = z.object({ webId: z.coerce.number().int().positive().optional() });

export const versionQuerySchema = z.object({ version: z.coerce.number().int().positive() });

export const contactAngleQuerySchema = z.object({
  reference: z.coerce.number().int().positive().describe('Set measured with the fully wetting reference liquid.'),
  test: z.coerce.number().int().positive().describe('Set measured with the test liquid, same web.'),
});

/** `heights=0.01,0.02` (m) for the time-to-height errors. */
export const comparisonQuerySchema = z.object({
  heights: z
    .string()
    .regex(/^\d*\.?\d+(e-?\d+)?(,\d*\.?\d+(e-?\d+)?){0,9}$/i, 'Give up to 10 heights in m (kg for mass runs), separated by commas.')
    .transform((s) => s.split(',').map(Number))
    .optional(),
});

export const proposeSchema = z
  .object({
    webVersion: positiveId,
    submit: z.boolean().optional(),
    permeability: z.boolean().optional(),
    curves: z.boolean().optional(),
  })
  .meta({ id: 'ProposeRequest' }) satisfies z.ZodType<ProposeRequest>;
