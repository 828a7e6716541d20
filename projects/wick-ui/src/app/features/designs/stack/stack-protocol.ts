import type { EvaluateStackOptions, StackVariantResults } from 'wick-core';

/** What the page sends the stack worker: one run. `cancelFlag` (a shared Int32Array buffer) exists only when the page is cross-origin isolated. */
export interface StackWorkerRequest {
  readonly id: number;
  /** StackVariantInputs, checked again in the worker (untrusted like any input). */
  readonly inputs: unknown;
  readonly options: EvaluateStackOptions;
  readonly cancelFlag?: SharedArrayBuffer;
}

/** What the stack worker answers: progress, then the results or the reason there are none. */
export type StackWorkerMessage =
  | { readonly id: number; readonly kind: 'progress'; readonly fraction: number }
  | { readonly id: number; readonly kind: 'done'; readonly results: StackVariantResults; readonly computeMs: number }
  | { readonly id: number; readonly kind: 'invalid'; readonly message: string; readonly field: string | null; readonly computeMs: number }
  | { readonly id: number; readonly kind: 'failed'; readonly message: string };
