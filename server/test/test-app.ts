import type { Express } from 'express';
import { Sequelize } from 'sequelize';
import { createApp } from '../src/app';
import { loadConfig } from '../src/config';
import { createSequelize } from '../src/db';

let shared: Sequelize | undefined;

/** The test database (created and migrated fresh by `npm test`). */
export function testSequelize(): Sequelize {
  shared ??= createSequelize(process.env['DATABASE_URL']!);
  return shared;
}

/** The real app, in-process, against the real test database; no port is opened. */
export function testApp(): Express {
  return createApp({ config: { ...loadConfig(), env: 'test', logRequests: false, uiDir: null }, sequelize: testSequelize() });
}
