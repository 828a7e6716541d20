import { type AppConfig, persistentSecret } from '../config';

/** Sign-in and session settings. Every value comes from the environment (docs/configuration.md). */
export interface AuthConfig {
  /** OpenID Connect issuer identifier; must match the provider's `iss` exactly (no trailing slash drift). */
  readonly issuer: string;
  readonly clientId: string;
  readonly clientSecret: string;
  /** Scopes asked for; `roles` is the custom scope that releases the roles claim. */
  readonly scope: string;
  /** Name of the claim (userinfo first, then ID token) that lists the person's Wickwright roles. */
  readonly rolesClaim: string;
  /** `<public URL>/auth/callback`, registered at the provider. */
  readonly redirectUri: string;
  /** Where the provider sends the browser after sign-out: `<public URL>/`. */
  readonly postLogoutRedirectUri: string;
  readonly sessionSecret: string;
  /** Session ends after this long without a request… */
  readonly idleTimeoutMs: number;
  /** …and this long after sign-in, whatever the activity. */
  readonly absoluteTimeoutMs: number;
  /** `Secure` cookies: on whenever the public URL is https. */
  readonly secureCookies: boolean;
  /** Sign-in endpoints: at most `limit` requests per `windowMs` from one address. */
  readonly signInRateLimit: { readonly windowMs: number; readonly limit: number };
  /** Delete expired sessions from the table now and then (off in tests: no timers). */
  readonly pruneSessions: boolean;
}

/** The app's session cookie; its own name so it never collides with the provider's cookies on the same host. */
export const SESSION_COOKIE = 'wick.sid';
/** Readable cookie carrying the CSRF token to the UI (Angular's XSRF support sends it back as a header). */
export const CSRF_COOKIE = 'wick.xsrf';
export const CSRF_HEADER = 'X-CSRF-Token';

function positive(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isFinite(n) || n <= 0) throw new Error(`${name} must be a positive number (got "${raw}")`);
  return n;
}

export function loadAuthConfig(config: AppConfig, env: NodeJS.ProcessEnv = process.env): AuthConfig {
  const idpPort = env['WICK_IDP_PORT'] ? Number(env['WICK_IDP_PORT']) : config.port + 1;
  const minute = 60_000;
  return {
    issuer: env['WICK_OIDC_ISSUER'] || `http://127.0.0.1:${idpPort}`,
    clientId: env['WICK_OIDC_CLIENT_ID'] || 'wickwright',
    // Shared with idp-fake through the state folder when unset; a real provider issues its own.
    clientSecret: persistentSecret('WICK_OIDC_CLIENT_SECRET', 'oidc-client-secret'),
    scope: env['WICK_OIDC_SCOPE'] || 'openid profile email roles',
    rolesClaim: env['WICK_OIDC_ROLES_CLAIM'] || 'roles',
    redirectUri: `${config.publicUrl}/auth/callback`,
    postLogoutRedirectUri: `${config.publicUrl}/`,
    sessionSecret: persistentSecret('WICK_SESSION_SECRET', 'session-secret'),
    idleTimeoutMs: positive(env, 'WICK_SESSION_IDLE_MINUTES', 120) * minute,
    absoluteTimeoutMs: positive(env, 'WICK_SESSION_MAX_HOURS', 12) * 60 * minute,
    secureCookies: config.publicUrl.startsWith('https:'),
    signInRateLimit: { windowMs: 15 * minute, limit: positive(env, 'WICK_SIGNIN_RATE_LIMIT', 100) },
    pruneSessions: config.env !== 'test',
  };
}
