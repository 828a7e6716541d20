import type { BandPart, EvaluateVariantOptions } from 'wick-core';

/** What the page asks a band worker for: samples `from`…`to` of a variant's Monte Carlo band. */
export interface BandWorkerRequest {
  readonly id: number;
  /** VariantInputs, checked again in the worker (untrusted like any input). */
  readonly inputs: unknown;
  readonly options: EvaluateVariantOptions;
  readonly from: number;
  readonly to: number;
}

/**
 * The worker's answer: the part (null when the variant has no band), or that it could not compute it; the page
 * then evaluates the variant on its own thread, which gives the error the person should see.
 */
export type BandWorkerMessage =
  /** `ms`: the worker's own computing time, which the page uses to balance the next split. */
  | { readonly id: number; readonly kind: 'part'; readonly part: BandPart | null; readonly ms: number }
  | { readonly id: number; readonly kind: 'failed'; readonly message: string };
