/**
 * Types that cross the wire between the server, the UI and the CLI. Defined once, here.
 */

/** Every error response: `{ error: { code, message, details } }`. */
export interface ApiErrorBody {
  readonly error: {
    readonly code: string;
    readonly message: string;
    readonly details?: unknown;
  };
}

/** `GET /api/health`. */
export interface HealthResponse {
  readonly status: 'ok' | 'degraded';
  readonly db: 'up' | 'down';
  readonly version: string;
}
