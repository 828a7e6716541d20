import { HttpErrorResponse } from '@angular/common/http';
import type { ApiErrorBody } from 'wick-core';

export interface ApiProblem {
  readonly status: number;
  readonly code: string;
  readonly message: string;
  readonly details?: unknown;
}

/** The server's `{ error: { code, message, details } }`, or a plain description of what went wrong on the way. */
export function apiProblem(e: unknown): ApiProblem {
  if (e instanceof HttpErrorResponse) {
    const body = e.error as Partial<ApiErrorBody> | null;
    if (body && typeof body === 'object' && body.error) return { status: e.status, ...body.error };
    if (e.status === 0) return { status: 0, code: 'offline', message: 'The server could not be reached. Check the connection and try again.' };
    return { status: e.status, code: 'http', message: `The server answered ${e.status} ${e.statusText}.` };
  }
  return { status: 0, code: 'client', message: e instanceof Error ? e.message : String(e) };
}

/** `details.issues` of a 422: each with a field path and a message. */
export function fieldIssues(problem: ApiProblem): { field: string; rule?: string; message: string }[] {
  const issues = (problem.details as { issues?: unknown } | undefined)?.issues;
  return Array.isArray(issues) ? (issues as { field: string; rule?: string; message: string }[]).filter((i) => typeof i?.message === 'string') : [];
}
