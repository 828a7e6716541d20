import { Router, type Request, type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { AppDeps } from '../app';
import type { AuthRuntime } from '../auth';
import { newCsrfToken } from '../auth/csrf';
import { STRATEGY, type VerifiedSignIn } from '../auth/passport';
import { clearAuthCookies, setCsrfCookie } from '../auth/session';
import { AppError } from '../errors';
import { audit } from '../services/audit';
import { defineRoutes } from './route-table';

/**
 * Only paths of this app, never another site (open redirect): one leading slash, no backslash or control
 * characters, not the sign-in routes themselves.
 */
export function safeReturnTo(value: unknown): string {
  if (typeof value !== 'string' || value.length > 2000) return '/';
  if (!value.startsWith('/') || value.startsWith('//') || /[\\\u0000-\u001f]/.test(value)) return '/';
  if (value === '/auth' || value.startsWith('/auth/') || value.startsWith('/api/')) return '/';
  return value;
}

/** Sign-in problems go to the UI's sign-in page, which explains them. */
function problem(reason: 'unavailable' | 'failed' | 'cancelled', returnTo = '/'): string {
  return `/sign-in?error=${reason}&returnTo=${encodeURIComponent(returnTo)}`;
}

function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => (req.session ? req.session.destroy((e) => (e ? reject(e) : resolve())) : resolve()));
}

/**
 * `/auth/login` (→ provider), `/auth/callback` (← provider), `/auth/logout`. Sign-in endpoints are rate limited.
 */
export function authRouter({ sequelize }: AppDeps, { config, oidc, signIn }: AuthRuntime): Router {
  const limiter = rateLimit({
    windowMs: config.signInRateLimit.windowMs,
    limit: config.signInRateLimit.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'too-many-requests', 'Too many sign-in attempts from this address. Wait a few minutes and try again.')),
  });

  const login: RequestHandler = async (req, res, next) => {
    const returnTo = safeReturnTo(req.query['returnTo']);
    try {
      await signIn.ready();
    } catch (e) {
      console.error('[sign-in] provider unavailable:', e instanceof Error ? e.message : e);
      return res.redirect(303, problem('unavailable', returnTo));
    }
    // The strategy keeps state, nonce and our returnTo in the (pre-sign-in) session.
    signIn.passport.authenticate(STRATEGY, { state: returnTo })(req, res, next);
  };

  const callback: RequestHandler = async (req, res, next) => {
    try {
      await signIn.ready();
    } catch {
      return res.redirect(303, problem('unavailable'));
    }
    signIn.passport.authenticate(STRATEGY, (err: unknown, user: VerifiedSignIn | false, info?: { message?: string; state?: string }) => {
      if (err) {
        console.error('[sign-in] callback failed:', err instanceof Error ? err.message : err);
        return res.redirect(303, problem('failed'));
      }
      if (!user) {
        if (info?.message) console.warn(`[sign-in] refused: ${info.message}`);
        return res.redirect(303, problem(req.query['error'] === 'access_denied' ? 'cancelled' : 'failed'));
      }
      const returnTo = safeReturnTo(info?.state);
      // passport regenerates the session here: a session id planted before sign-in is worthless after it.
      req.logIn(user, (loginErr) => {
        if (loginErr) return next(loginErr);
        const token = newCsrfToken();
        req.session.signedInAt = Date.now();
        req.session.csrfToken = token;
        req.session.idToken = user.idToken;
        setCsrfCookie(res, token, config);
        res.redirect(303, returnTo);
      });
    })(req, res, next);
  };

  const logout: RequestHandler = async (req, res) => {
    const user = res.locals['user'] as { id: number } | undefined;
    let redirectTo = '/';
    if (user) {
      const idToken = req.session.idToken;
      await sequelize.transaction((tx) => audit(tx, { actorId: user.id, action: 'sign-out', entityType: 'user', entityId: user.id }));
      redirectTo = (await oidc.endSessionUrl(idToken)) ?? '/';
    }
    await destroySession(req);
    clearAuthCookies(res, config);
    res.json({ redirectTo });
  };

  return defineRoutes(Router(), '/auth', [
    { method: 'get', path: '/login', access: 'public', handlers: [limiter, login] },
    { method: 'get', path: '/callback', access: 'public', handlers: [limiter, callback] },
    { method: 'post', path: '/logout', access: 'public', handlers: [logout] },
  ]);
}
