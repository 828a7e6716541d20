import type { RequestHandler } from 'express';
import { rolesAllow, type Access } from 'wick-core';
import { AppError } from '../errors';

/** The signed-in person as the session middleware leaves it on `res.locals.user` (sign-in fills it). */
export interface SessionUser {
  readonly id: number;
  readonly roles: readonly string[];
}

/** 401 when a route needs a signed-in person and there is none; 403 when the roles lack the permission. */
export function authorize(access: Access): RequestHandler {
  return (_req, res, next) => {
    if (access === 'public') return next();
    const user = res.locals['user'] as SessionUser | undefined;
    if (!user) return next(new AppError(401, 'unauthenticated', 'Sign in to continue.'));
    if (access !== 'signed-in' && !rolesAllow(user.roles, access)) {
      return next(new AppError(403, 'forbidden', `This needs the permission "${access}".`, { permission: access }));
    }
    next();
  };
}
