import { Router } from 'express';
import type { AppDeps } from '../app';
import { openApiDocument } from '../openapi/documented-routes';
import { defineRoutes } from './route-table';

/** `GET /api/docs`: the OpenAPI 3.1 document, generated from the zod schemas the routes validate with. */
export function docsRouter({ config }: AppDeps): Router {
  return defineRoutes(Router(), '/api/docs', [
    {
      method: 'get',
      path: '/',
      access: 'public',
      handlers: [
        (_req, res) => {
          res.setHeader('Cache-Control', 'no-cache');
          res.json(openApiDocument({ version: config.version, publicUrl: config.publicUrl }));
        },
      ],
    },
  ]);
}
