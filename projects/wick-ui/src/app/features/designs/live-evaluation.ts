import { evaluateVariant, isDomainError, variantField, type VariantInputs, type VariantResults } from 'wick-core';

/** What the results panel shows after each recompute. */
export type LiveResult =
  | { readonly kind: 'results'; readonly results: VariantResults; readonly computeMs: number; readonly source: 'browser' | 'server' }
  | { readonly kind: 'invalid'; readonly message: string; readonly field: string | null; readonly label: string | null; readonly computeMs: number };

/**
 * Evaluates the variant in the browser with wick-core (the same code the server records with) and turns an
 * invalid input into a message naming the field, instead of a result.
 */
export function evaluateLive(inputs: VariantInputs, options: { curvePoints: number; samples: number; seed: number }): LiveResult {
  const t0 = performance.now();
  try {
    const results = evaluateVariant(inputs, options);
    return { kind: 'results', results, computeMs: performance.now() - t0, source: 'browser' };
  } catch (e) {
    if (!isDomainError(e)) throw e;
    const field = e.field ?? null;
    return { kind: 'invalid', message: e.message, field, label: field ? (variantField(field)?.label ?? null) : null, computeMs: performance.now() - t0 };
  }
}
