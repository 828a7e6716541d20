import type { Express, Router } from 'express';
import request from 'supertest';
import { rolesAllow, type Access } from 'wick-core';
import { ACCESS } from '../auth/authorize';
import { TEST_ACCOUNTS } from '../../test/idp';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp } from '../../test/test-app';
import { ROUTE_TABLE, type RegisteredRoute } from './route-table';

/**
 * Every API route × anonymous and every test account (one per role, one with two roles, one with none), generated
 * from ROUTE_TABLE: a route added later is covered without touching this file, and a route added without
 * defineRoutes (so without a declared access) fails the first spec.
 */

type Outcome = 401 | 403 | 'allowed';

/** What the permission table says a subject gets: roles `null` = anonymous. */
function expectedOutcome(access: Access, roles: readonly string[] | null): Outcome {
  if (access === 'public') return 'allowed';
  if (roles === null) return 401;
  if (roles.length === 0) return 403;
  if (access === 'signed-in') return 'allowed';
  return rolesAllow(roles, access) ? 'allowed' : 403;
}

/** A concrete URL for a route pattern: ids become a number no row has, optional parts are dropped. */
function concretePath(pattern: string): string {
  return pattern
    .replace(/\{[^}]*\}/g, '')
    .replace(/:(\w+)/g, '999999')
    .replace(/\*(\w+)/g, 'x');
}

interface WalkedRoute {
  readonly methods: string[];
  readonly path: string;
  readonly access: Access | undefined;
}

/** Every route layer of the app, however deep in mounted routers (Express 5 / router 2 internals). */
function walk(stack: unknown[]): WalkedRoute[] {
  const found: WalkedRoute[] = [];
  for (const layer of stack as { route?: { path: string; methods: Record<string, boolean>; stack: { handle: unknown }[] }; handle?: Router }[]) {
    if (layer.route) {
      const first = layer.route.stack[0]?.handle as { [ACCESS]?: Access } | undefined;
      found.push({ methods: Object.keys(layer.route.methods), path: layer.route.path, access: first?.[ACCESS] });
    } else if (layer.handle && Array.isArray((layer.handle as { stack?: unknown[] }).stack)) {
      found.push(...walk((layer.handle as unknown as { stack: unknown[] }).stack));
    }
  }
  return found;
}

const SUBJECTS: readonly { label: string; username: string | null; roles: readonly string[] | null }[] = [
  { label: 'anonymous', username: null, roles: null },
  ...TEST_ACCOUNTS.map((a) => ({ label: `${a.username} (${a.roles.join(' + ') || 'no role'})`, username: a.username, roles: a.roles })),
];

describe('authorization matrix over every route in ROUTE_TABLE', () => {
  // Building one app registers every router's routes; the table is read now so each route gets its own specs.
  const probe = testApp();
  const routes: RegisteredRoute[] = [...ROUTE_TABLE];
  let app: Express;
  const agents = new Map<string, Agent>();

  async function agentFor(username: string | null): Promise<Agent> {
    if (username === null) return request.agent(app);
    let agent = agents.get(username);
    if (!agent) {
      agent = (await signInAs(app, username)).agent;
      agents.set(username, agent);
    }
    return agent;
  }

  beforeAll(async () => {
    app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
    for (const s of SUBJECTS) await agentFor(s.username);
  });

  it('when the app is built, then every route it serves declares its access through defineRoutes', () => {
    const served = walk((probe as unknown as { router: { stack: unknown[] } }).router.stack);
    expect(served.length).toBeGreaterThan(0);
    for (const r of served) {
      expect(r.access).withContext(`${r.methods.join(',')} ${r.path} has no authorize() guard in front`).toBeDefined();
    }
    const declared = routes.length;
    const servedCount = served.reduce((n, r) => n + r.methods.length, 0);
    expect(servedCount).withContext('routes served vs routes in ROUTE_TABLE').toBe(declared);
  });

  it('when the table is read, then it covers the sign-in, me and admin routes', () => {
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    for (const k of ['get /auth/login', 'get /auth/callback', 'post /auth/logout', 'get /api/me', 'get /api/admin/users', 'put /api/admin/users/:id/roles', 'get /api/admin/audit']) {
      expect(keys).toContain(k);
    }
  });

  for (const route of routes) {
    describe(`${route.method.toUpperCase()} ${route.path} [${route.access}]`, () => {
      for (const subject of SUBJECTS) {
        const outcome = expectedOutcome(route.access, subject.roles);
        it(`when ${subject.label}, then ${outcome === 'allowed' ? 'allowed (not 401/403, no crash)' : outcome}`, async () => {
          const agent = await agentFor(subject.username);
          const path = concretePath(route.path);
          const req = agent[route.method](path);
          const res = route.method === 'get' ? await req : await req.send({});
          const context = `${route.method.toUpperCase()} ${path} as ${subject.label} → ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`;
          if (outcome === 'allowed') {
            expect([401, 403]).withContext(context).not.toContain(res.status);
            // 500 = a crash on input the route should have refused; 502/503 (a dependency down) is not our business here.
            expect(res.status).withContext(context).not.toBe(500);
          } else {
            expect(res.status).withContext(context).toBe(outcome);
            expect(res.body?.error?.code).withContext(context).toEqual(outcome === 401 ? 'unauthenticated' : jasmine.stringMatching(/^(forbidden|no-role)$/));
          }
          // A route may end the session (sign-out): sign that person in again for the next route.
          if (subject.username && route.method !== 'get' && (await agent.get('/api/me')).status === 401) agents.delete(subject.username);
        });
      }
    });
  }
});
