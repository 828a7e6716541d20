import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from '../config';
import { loadAuthConfig, type AuthConfig } from './auth-config';
import { csrfProtection } from './csrf';
import { OidcProvider } from './oidc';
import { createSignIn, type SignIn } from './passport';
import { sessionMiddleware, sessionUser } from './session';

export type { SessionUser } from './authorize';

/** Everything the sign-in routes need, built once per app. */
export interface AuthRuntime {
  readonly config: AuthConfig;
  readonly oidc: OidcProvider;
  readonly signIn: SignIn;
}

/** Paths that carry a session. Static files of the UI never touch the session store. */
const SESSION_PATHS = ['/api', '/auth'];

/**
 * Sessions (PostgreSQL), passport, the absolute timeout, `res.locals.user` and CSRF protection, in that order,
 * on `/api` and `/auth`. Routers mounted after this see `res.locals.user` (a {@link SessionUser}) when signed in.
 */
export function installAuth(
  app: Express,
  deps: { readonly config: AppConfig; readonly sequelize: Sequelize },
  overrides: Partial<AuthConfig> = {},
): AuthRuntime {
  const config: AuthConfig = { ...loadAuthConfig(deps.config), ...overrides };
  const oidc = new OidcProvider(config);
  const signIn = createSignIn(deps.sequelize, config, oidc);
  app.use(SESSION_PATHS, sessionMiddleware(deps.config.databaseUrl, config));
  app.use(SESSION_PATHS, signIn.passport.initialize(), signIn.passport.session());
  app.use(SESSION_PATHS, sessionUser(config));
  app.use(SESSION_PATHS, csrfProtection(deps.config.publicUrl));
  return { config, oidc, signIn };
}
