import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isDomainError } from 'wick-core';
import type { ApiErrorBody } from 'wick-core';

/** The one error type routes and services throw; the handler turns it into `{ error: {...} }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError(404, 'not-found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

/** Last middleware: JSON errors only, never a stack trace or an internal message. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  let status = 500;
  let body: ApiErrorBody['error'] = { code: 'internal', message: 'Something went wrong on the server. It has been logged.' };
  if (err instanceof AppError) {
    status = err.status;
    body = { code: err.code, message: err.message, details: err.details };
  } else if (isDomainError(err)) {
    status = 422;
    body = { code: err.code, message: err.message, details: { field: err.field, ...err.details } };
  } else if (isHttpError(err)) {
    // body-parser and friends: malformed JSON, payload too large …
    status = err.status;
    body = { code: err.type ?? 'bad-request', message: err.expose ? err.message : 'The request could not be read.' };
  }
  if (status >= 500) {
    console.error(`[${new Date().toISOString()}] ${req.method} ${req.originalUrl}:`, err);
  }
  if (res.headersSent) return;
  res.status(status).json({ error: body } satisfies ApiErrorBody);
};

function isHttpError(e: unknown): e is { status: number; expose?: boolean; message: string; type?: string } {
  return (
    typeof e === 'object' &&
    e !== null &&
    typeof (e as { status?: unknown }).status === 'number' &&
    (e as { status: number }).status >= 400 &&
    (e as { status: number }).status < 500
  );
}
