import { Router } from 'express';
import type { HealthResponse } from 'wick-core';
import type { AppDeps } from '../app';
import { defineRoutes } from './route-table';

/** `GET /api/health`: 200 when the database answers, 503 otherwise. Public (load balancers call it). */
export function healthRouter({ sequelize, config }: AppDeps): Router {
  return defineRoutes(Router(), '/api/health', [
    {
      method: 'get',
      path: '/',
      access: 'public',
      handlers: [
        async (_req, res) => {
          let db: HealthResponse['db'] = 'up';
          try {
            await sequelize.query('SELECT 1');
          } catch {
            db = 'down';
          }
          const body: HealthResponse = { status: db === 'up' ? 'ok' : 'degraded', db, version: config.version };
          res.status(db === 'up' ? 200 : 503).json(body);
        },
      ],
    },
  ]);
}
