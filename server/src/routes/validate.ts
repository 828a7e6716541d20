import type { RequestHandler } from 'express';
import { z } from 'zod';
import { AppError } from '../errors';

/** One validation problem: the field's dotted path, the rule it broke and a sentence for people. */
export interface FieldIssue {
  readonly field: string;
  readonly rule: string;
  readonly message: string;
}

/** zod issues → `{ field, rule, message }`; custom refinements name their rule in `params.rule`. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => {
    const field = issue.path.map(String).join('.') || '(body)';
    let rule: string = issue.code;
    if (issue.code === 'custom' && typeof issue.params?.['rule'] === 'string') rule = issue.params['rule'];
    else if (issue.code === 'too_small' || issue.code === 'too_big') rule = `${issue.code}:${issue.origin}`;
    else if (issue.code === 'invalid_format') rule = `invalid_format:${issue.format}`;
    return { field, rule, message: issue.message };
  });
}

export function validationError(error: z.ZodError, where: 'body' | 'query' | 'params'): AppError {
  const issues = fieldIssues(error);
  const first = issues[0];
  const message =
    issues.length === 1
      ? `Invalid ${where}: ${first.field} — ${first.message}`
      : `Invalid ${where}: ${issues.length} problems, the first: ${first.field} — ${first.message}`;
  return new AppError(422, 'validation-failed', message, { issues });
}

/** Parses `req[where]` with `schema` into `res.locals[where]` (Express 5 `req.query` is a getter: never reassigned). */
export function validate<T extends z.ZodType>(where: 'body' | 'query' | 'params', schema: T): RequestHandler {
  return (req, res, next) => {
    const result = schema.safeParse(req[where] ?? {});
    if (!result.success) return next(validationError(result.error, where));
    res.locals[where] = result.data;
    next();
  };
}

/** Parses a value or throws the 422 `validation-failed` error. */
export function parseOr422<T extends z.ZodType>(schema: T, value: unknown, where: 'body' | 'query' | 'params' = 'body'): z.output<T> {
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error, where);
  return result.data;
}
