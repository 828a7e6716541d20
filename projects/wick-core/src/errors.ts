/**
 * Typed errors and warnings shared by every model.
 *
 * A model never returns NaN or Infinity: invalid input throws a {@link DomainError} whose
 * message is written for the person who typed the value, and whose `code` lets callers
 * (server, UI) react without parsing text.
 */

/** Machine-readable reasons a model refuses its input. */
export type DomainErrorCode =
  | 'not-finite'
  | 'not-positive'
  | 'negative'
  | 'out-of-range'
  | 'wrong-dimension'
  | 'unknown-unit'
  | 'unparsable'
  | 'unknown-model'
  | 'unknown-liquid'
  | 'insufficient-data'
  | 'no-convergence'
  | 'invalid-input';

export class DomainError extends Error {
  override readonly name = 'DomainError';

  constructor(
    readonly code: DomainErrorCode,
    message: string,
    /** The input field the error is about, when there is one (e.g. `radius`). */
    readonly field?: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

/** A validity remark attached to a result: the number is given, but read it with care. */
export interface ModelWarning {
  readonly code: string;
  readonly message: string;
}

export function isDomainError(e: unknown): e is DomainError {
  return e instanceof DomainError;
}
