import type { RequestHandler } from 'express';
import { ROLE_LABELS, rolesAllow, rolesWith, type Access } from 'wick-core';
import { AppError } from '../errors';

/** The signed-in person as the session middleware leaves it on `res.locals.user` (auth/session.ts fills it). */
export interface SessionUser {
  readonly id: number;
  /** Effective roles now (provider's roles with the administrator's overrides). */
  readonly roles: readonly string[];
}

/** Marks the guard `authorize()` puts first on every route, so a test can find routes that were added without it. */
export const ACCESS = Symbol('wick.access');

/**
 * 401 when a route needs a signed-in person and there is none; 403 when the roles lack the permission, or when
 * the person holds no Wickwright role at all (signed in at the provider, but not a user of this product yet).
 */
export function authorize(access: Access): RequestHandler {
  const guard: RequestHandler = (_req, res, next) => {
    if (access === 'public') return next();
    const user = res.locals['user'] as SessionUser | undefined;
    if (!user) return next(new AppError(401, 'unauthenticated', 'Sign in to continue.'));
    if (user.roles.length === 0) {
      return next(
        new AppError(403, 'no-role', 'Your account has no Wickwright role yet. Ask an administrator to give you one.', { roles: [] }),
      );
    }
    if (access !== 'signed-in' && !rolesAllow(user.roles, access)) {
      const needed = rolesWith(access);
      return next(
        new AppError(403, 'forbidden', `This needs the ${needed.map((r) => ROLE_LABELS[r]).join(' or ')} role.`, {
          permission: access,
          roles: needed,
        }),
      );
    }
    next();
  };
  return Object.assign(guard, { [ACCESS]: access });
}
