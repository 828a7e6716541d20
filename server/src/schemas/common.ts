import { z } from 'zod';
import type { ApiErrorBody } from 'wick-core';

/** The error envelope every route answers with on failure. */
export const errorSchema = z
  .object({ error: z.object({ code: z.string(), message: z.string(), details: z.unknown().optional() }) })
  .meta({ id: 'Error' }) satisfies z.ZodType<ApiErrorBody>;
