import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from '../errors';
import { CSRF_HEADER } from './auth-config';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function newCsrfToken(): string {
  return randomBytes(32).toString('base64url');
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * CSRF protection for state-changing requests (docs/security.md): a synchronizer token kept in the server-side
 * session and sent back by the UI in the `X-CSRF-Token` header, plus an origin check. SameSite=Lax on the session
 * cookie already keeps cross-site POSTs cookie-less in current browsers; the token and the origin check do not
 * rely on that.
 *
 * - Any unsafe request whose `Origin` is not the app's own, or that the browser marks `Sec-Fetch-Site: cross-site`,
 *   is refused (403 `cross-origin`).
 * - A signed-in unsafe request must carry the session's token (403 `csrf-failed`). Anonymous requests carry no
 *   authority to abuse; the routes answer them 401.
 */
export function csrfProtection(publicUrl: string): RequestHandler {
  const ownOrigin = new URL(publicUrl).origin;
  return (req, res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get('origin');
    if ((origin && origin !== ownOrigin) || req.get('sec-fetch-site') === 'cross-site') {
      return next(new AppError(403, 'cross-origin', 'Requests that change data must come from Wickwright itself.'));
    }
    if (!res.locals['user']) return next();
    const expected = req.session?.csrfToken;
    const sent = req.get(CSRF_HEADER);
    if (!expected || !sent || !sameToken(sent, expected)) {
      return next(new AppError(403, 'csrf-failed', 'The request lacks this page’s security token. Reload the page and try again.'));
    }
    next();
  };
}
