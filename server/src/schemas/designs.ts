/**
 * zod schemas of the design workspace and compute APIs: request validation and the OpenAPI document. Variant
 * inputs are checked by wick-core's `readVariantInputs` (one source of truth for the physics fields, with their
 * labels and field paths); here they are an object documented by reference.
 */
import { z } from 'zod';
import {
  COMPARE_MAX,
  COMPARE_MIN,
  type BatchComputeRequest,
  type ComputeRequest,
  type DecisionWrite,
  type DesignWrite,
  type ProjectWrite,
  type RerunRequest,
} from 'wick-core';

export const idParamsSchema = z.object({ id: z.coerce.number().int().positive() });

const name = z.string().trim().min(1, 'Give a name.').max(200);
const text = z.string().max(5000);

export const projectWriteSchema = z
  .object({ name, description: text.optional() })
  .meta({ id: 'ProjectWrite' }) satisfies z.ZodType<ProjectWrite>;

export const designWriteSchema = z
  .object({ name, description: text.optional() })
  .meta({ id: 'DesignWrite' }) satisfies z.ZodType<DesignWrite>;

export const variantWriteSchema = z
  .object({
    name,
    notes: text.optional(),
    inputs: z
      .record(z.string(), z.unknown())
      .describe('VariantInputs (wick-core, SI units): configuration, structure or capillary, liquid, dimensions, checkpoints, tolerances, humidity.'),
    version: z.number().int().positive().optional().describe('Required on update: the version you read.'),
  })
  .meta({ id: 'VariantWrite' });

export const rerunSchema = z
  .object({ version: z.number().int().positive(), repin: z.boolean() })
  .meta({ id: 'RerunRequest' }) satisfies z.ZodType<RerunRequest>;

/** `variants=1,2,3` → [1, 2, 3]. */
const idList = z
  .string()
  .regex(/^\d+(,\d+)*$/, 'Give variant ids separated by commas, e.g. 3,7,9.')
  .transform((s) => s.split(',').map(Number))
  .refine((ids) => ids.length >= COMPARE_MIN && ids.length <= COMPARE_MAX, `Compare ${COMPARE_MIN} to ${COMPARE_MAX} variants.`);

export const compareQuerySchema = z.object({
  variants: idList,
  baseline: z.coerce.number().int().positive().optional(),
});

export const variantExportQuerySchema = z.object({ what: z.enum(['summary', 'curve']).default('summary') });

export const decisionWriteSchema = z
  .object({
    variantIds: z.array(z.number().int().positive()).min(COMPARE_MIN).max(COMPARE_MAX),
    baselineVariantId: z.number().int().positive(),
    chosenVariantId: z.number().int().positive(),
    rationale: z.string().trim().min(3, 'Say why, in a sentence or more.').max(5000),
  })
  .meta({ id: 'DecisionWrite' }) satisfies z.ZodType<DecisionWrite>;

export const computeRequestSchema = z
  .object({
    model: z.string().min(1).max(100),
    inputs: z.record(z.string(), z.unknown()),
  })
  .meta({ id: 'ComputeRequest' }) satisfies z.ZodType<ComputeRequest>;

/** Batches up to 500 requests (a JSON body stays under the 1 MB limit for design variants). */
export const batchComputeRequestSchema = z
  .object({ requests: z.array(computeRequestSchema).min(1).max(500) })
  .meta({ id: 'BatchComputeRequest' }) satisfies z.ZodType<BatchComputeRequest>;
