import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import type { RequestHandler, Router } from 'express';
import type { z } from 'zod';
import type { Access } from 'wick-core';
import { defineRoutes, type Method } from '../routes/route-table';
import { validate } from '../routes/validate';
import { errorSchema } from '../schemas/common';

/** The one registry behind `/api/docs`; routes are added by {@link documentedRoutes} as routers are built. */
const registry = new OpenAPIRegistry();
const documented = new Set<string>();

registry.registerComponent('securitySchemes', 'session', {
  type: 'apiKey',
  in: 'cookie',
  name: 'wick.sid',
  description: 'Session cookie set by the sign-in at /auth/login. Changing requests also send the X-CSRF-Token header.',
});

export interface DocumentedRoute {
  readonly method: Method;
  /** Relative to the mount path, Express syntax (`/:id/revisions/:number`). */
  readonly path: string;
  readonly access: Access;
  readonly summary: string;
  readonly description?: string;
  readonly tags: readonly string[];
  readonly params?: z.ZodObject;
  readonly query?: z.ZodObject;
  readonly body?: z.ZodType;
  /** A multipart body (uploads): its fields, documented only; the handlers read it. */
  readonly multipart?: z.ZodObject;
  /** Handlers that run before validation (multer for uploads). */
  readonly before?: readonly RequestHandler[];
  readonly responses: Readonly<Record<number, { readonly description: string; readonly schema?: z.ZodType; readonly contentType?: string }>>;
  readonly handler: RequestHandler;
}

const ERROR_RESPONSES: Record<number, string> = {
  401: 'Not signed in.',
  403: 'Signed in without the permission this route needs.',
  422: 'Invalid input: `details.issues` lists each field, the rule it broke and a message.',
};

function openApiPath(path: string): string {
  return path.replace(/:([A-Za-z_]+)/g, '{$1}');
}

/**
 * Registers routes through {@link defineRoutes} (so each declares its access) with zod validation in front —
 * parsed params, query and body land in `res.locals` — and documents the same schemas in the OpenAPI registry.
 */
export function documentedRoutes(router: Router, mountPath: string, routes: readonly DocumentedRoute[]): Router {
  defineRoutes(
    router,
    mountPath,
    routes.map((r) => ({
      method: r.method,
      path: r.path,
      access: r.access,
      handlers: [
        ...(r.before ?? []),
        ...(r.params ? [validate('params', r.params)] : []),
        ...(r.query ? [validate('query', r.query)] : []),
        ...(r.body ? [validate('body', r.body)] : []),
        r.handler,
      ],
    })),
  );
  for (const r of routes) {
    const path = openApiPath(mountPath + (r.path === '/' ? '' : r.path));
    const key = `${r.method} ${path}`;
    if (documented.has(key)) continue;
    documented.add(key);
    const responses: RouteConfig['responses'] = {};
    for (const [status, res] of Object.entries(r.responses)) {
      responses[status] = res.schema
        ? { description: res.description, content: { [res.contentType ?? 'application/json']: { schema: res.schema } } }
        : { description: res.description };
    }
    for (const [status, description] of Object.entries(ERROR_RESPONSES)) {
      if (r.access === 'public' && status !== '422') continue;
      responses[status] ??= { description, content: { 'application/json': { schema: errorSchema } } };
    }
    const access = r.access === 'public' ? 'Open to anyone.' : r.access === 'signed-in' ? 'Needs a signed-in person.' : `Needs the permission \`${r.access}\`.`;
    registry.registerPath({
      method: r.method,
      path,
      summary: r.summary,
      description: [r.description, access].filter(Boolean).join('\n\n'),
      tags: [...r.tags],
      ...(r.access === 'public' ? {} : { security: [{ session: [] }] }),
      request: {
        ...(r.params ? { params: r.params } : {}),
        ...(r.query ? { query: r.query } : {}),
        ...(r.body ? { body: { content: { 'application/json': { schema: r.body } }, required: true } } : {}),
        ...(r.multipart ? { body: { content: { 'multipart/form-data': { schema: r.multipart } }, required: true } } : {}),
      },
      responses,
    });
  }
  return router;
}

/** The OpenAPI 3.1 document of every documented route. */
export function openApiDocument(info: { version: string; publicUrl: string }): object {
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Wickwright API',
      version: info.version,
      description:
        'JSON API of Wickwright. Errors answer `{ error: { code, message, details } }`. Generated from the zod schemas the server validates with.',
    },
    servers: [{ url: info.publicUrl }],
  });
}
