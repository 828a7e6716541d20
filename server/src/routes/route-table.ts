import type { RequestHandler, Router } from 'express';
import type { Access } from 'wick-core';
import { authorize } from '../auth/authorize';

export type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteDef {
  readonly method: Method;
  /** Path relative to the router's mount point, Express syntax (`/:id`). */
  readonly path: string;
  /** What the caller needs. Every route declares it; the authorization matrix test reads this table. */
  readonly access: Access;
  readonly handlers: readonly RequestHandler[];
}

export interface RegisteredRoute {
  readonly method: Method;
  /** Full path, e.g. `/api/materials/:id`. */
  readonly path: string;
  readonly access: Access;
}

/** Every API route of the running app, filled as routers are mounted. */
export const ROUTE_TABLE: RegisteredRoute[] = [];

/**
 * Registers routes on a router with their access rule in front, and records them in {@link ROUTE_TABLE}.
 * The only way routes are added, so none can exist without a declared permission.
 */
export function defineRoutes(router: Router, mountPath: string, defs: readonly RouteDef[]): Router {
  for (const def of defs) {
    router[def.method](def.path, authorize(def.access), ...def.handlers);
    const path = (mountPath + (def.path === '/' ? '' : def.path)) || '/';
    if (!ROUTE_TABLE.some((r) => r.method === def.method && r.path === path)) {
      ROUTE_TABLE.push({ method: def.method, path, access: def.access });
    }
  }
  return router;
}
