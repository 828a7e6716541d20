import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler, Response } from 'express';
import session from 'express-session';
import pg from 'pg';
import { CSRF_COOKIE, SESSION_COOKIE, type AuthConfig } from './auth-config';
import type { SessionUser } from './authorize';

declare module 'express-session' {
  interface SessionData {
    /** Epoch ms of the sign-in: the absolute timeout counts from here. */
    signedInAt: number;
    /** Synchronizer token for state-changing requests (also mirrored in the readable CSRF cookie). */
    csrfToken: string;
    /** The provider's ID token, kept only as `id_token_hint` for sign-out. */
    idToken: string;
  }
}

const pools = new Map<string, pg.Pool>();

/** One small pool per database for the session store (shared by every app instance in a process). */
function sessionPool(databaseUrl: string): pg.Pool {
  let pool = pools.get(databaseUrl);
  if (!pool) {
    pool = new pg.Pool({ connectionString: databaseUrl, max: 4, idleTimeoutMillis: 10_000, allowExitOnIdle: true });
    pool.on('error', (e) => console.error('[session store] idle client error:', e.message));
    pools.set(databaseUrl, pool);
  }
  return pool;
}

/**
 * Cookie sessions stored in PostgreSQL (table `sessions`, created by migration 0002 — never by the library).
 * The cookie is httpOnly, SameSite=Lax, Secure over https, named `wick.sid`; its life slides with each request
 * (idle timeout) and the row's `expire` follows it, so an idle session is gone server-side too.
 */
export function sessionMiddleware(databaseUrl: string, auth: AuthConfig): RequestHandler {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool: sessionPool(databaseUrl),
    tableName: 'sessions',
    createTableIfMissing: false,
    pruneSessionInterval: auth.pruneSessions ? 15 * 60 : false,
    errorLog: (...args: unknown[]) => console.error('[session store]', ...args),
  });
  return session({
    name: SESSION_COOKIE,
    secret: auth.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    unset: 'destroy',
    cookie: { httpOnly: true, sameSite: 'lax', secure: auth.secureCookies, maxAge: auth.idleTimeoutMs, path: '/' },
  });
}

export function setCsrfCookie(res: Response, token: string, auth: AuthConfig): void {
  // Readable by the page's script on purpose (that is how the token reaches the header); useless to other sites.
  res.cookie(CSRF_COOKIE, token, { httpOnly: false, sameSite: 'lax', secure: auth.secureCookies, path: '/' });
}

export function clearAuthCookies(res: Response, auth: AuthConfig): void {
  res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: auth.secureCookies });
  res.clearCookie(CSRF_COOKIE, { path: '/', sameSite: 'lax', secure: auth.secureCookies });
}

/**
 * After passport has restored `req.user`: enforces the absolute timeout (the session is destroyed and the request
 * goes on anonymous) and publishes the person as `res.locals.user` — the one place routes read it from.
 */
export function sessionUser(auth: AuthConfig): RequestHandler {
  return (req, res, next) => {
    const user = req.user as SessionUser | undefined;
    if (user && req.session) {
      const signedInAt = req.session.signedInAt ?? 0;
      if (Date.now() - signedInAt > auth.absoluteTimeoutMs) {
        req.session.destroy((err) => {
          if (err) return next(err);
          req.user = undefined;
          clearAuthCookies(res, auth);
          next();
        });
        return;
      }
      res.locals['user'] = user;
    } else if (req.headers.cookie?.includes(`${CSRF_COOKIE}=`)) {
      // The session is gone (expired, signed out elsewhere): drop the stale token so the UI knows.
      res.clearCookie(CSRF_COOKIE, { path: '/', sameSite: 'lax', secure: auth.secureCookies });
    }
    next();
  };
}
