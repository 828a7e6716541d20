import type { Express } from 'express';
import { Sequelize } from 'sequelize';
import { createApp, type AppDeps } from '../src/app';
import type { AuthConfig } from '../src/auth/auth-config';
import { loadConfig, type AppConfig } from '../src/config';
import { createSequelize } from '../src/db';

let shared: Sequelize | undefined;

/** The test database (created and migrated fresh by `npm test`). */
export function testSequelize(): Sequelize {
  shared ??= createSequelize(process.env['DATABASE_URL']!);
  return shared;
}

/**
 * The real app, in-process, against the real test database; no port is opened. Sign-in goes to the in-process
 * provider that `server/test/setup.ts` starts (its issuer is in `WICK_OIDC_ISSUER` by the time specs run).
 */
export function testApp(overrides: { config?: Partial<AppConfig>; auth?: Partial<AuthConfig> } = {}): Express {
  const deps: AppDeps = {
    config: { ...loadConfig(), env: 'test', logRequests: false, uiDir: null, ...overrides.config },
    sequelize: testSequelize(),
    auth: overrides.auth,
  };
  return createApp(deps);
}
