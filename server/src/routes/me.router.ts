import { Router } from 'express';
import type { AppDeps } from '../app';
import type { AuthRuntime, SessionUser } from '../auth';
import { setCsrfCookie } from '../auth/session';
import { findUser, toCurrentUser } from '../auth/users';
import { defineRoutes } from './route-table';

/** `GET /api/me`: the signed-in person, roles and permissions (401 anonymous, 403 without any role). */
export function meRouter({ sequelize }: AppDeps, { config }: AuthRuntime): Router {
  return defineRoutes(Router(), '/api/me', [
    {
      method: 'get',
      path: '/',
      access: 'signed-in',
      handlers: [
        async (req, res) => {
          const user = await findUser(sequelize, (res.locals['user'] as SessionUser).id);
          // Re-issue the CSRF cookie in case the browser lost it; the token itself lives in the session.
          if (req.session.csrfToken) setCsrfCookie(res, req.session.csrfToken, config);
          res.setHeader('Cache-Control', 'no-store');
          res.json(toCurrentUser(user));
        },
      ],
    },
  ]);
}
