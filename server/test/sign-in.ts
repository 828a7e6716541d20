import type { Express } from 'express';
import request, { type Response } from 'supertest';
import { isRole, type Role } from 'wick-core';
import type { DemoAccount } from '../../idp-fake/src/accounts';
import { CSRF_COOKIE, CSRF_HEADER, SESSION_COOKIE } from '../src/auth/auth-config';
import { TEST_ACCOUNTS, testIdp } from './idp';

export type Agent = ReturnType<typeof request.agent>;

/** A signed-in browser stand-in: a supertest agent with the session cookie that sends the CSRF header by itself. */
export interface SignedIn {
  readonly agent: Agent;
  readonly account: DemoAccount;
  /** `wick.sid=…` exactly as the app set it (to replay, tamper with or inspect). */
  readonly sessionCookie: string;
  /** The session id inside the signed cookie (the `sessions.sid` row). */
  readonly sessionId: string;
  readonly csrfToken: string;
  /** Where the app sent the browser after the callback. */
  readonly landedOn: string;
}

/** The demo account with exactly this one role, or the account with this username. */
export function accountFor(who: Role | string): DemoAccount {
  const account = isRole(who)
    ? TEST_ACCOUNTS.find((a) => a.roles.length === 1 && a.roles[0] === who)
    : TEST_ACCOUNTS.find((a) => a.username === who);
  if (!account) throw new Error(`No test account for "${who}"`);
  return account;
}

/** `name=value` of a cookie in a response's Set-Cookie headers, or undefined. */
export function cookieFrom(res: Response, name: string): string | undefined {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  const line = raw?.find((c) => c.startsWith(`${name}=`));
  return line?.split(';')[0];
}

/** The full Set-Cookie line (with its attributes) for a cookie. */
export function setCookieLine(res: Response, name: string): string | undefined {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith(`${name}=`));
}

/** Path and query of an absolute URL (supertest talks to the app in-process, whatever host the URL names). */
function local(url: string): string {
  const u = new URL(url);
  return u.pathname + u.search;
}

export interface SignInSteps {
  /** The app's answer to `/auth/login` (sets the pre-sign-in session cookie). */
  readonly login: Response;
  /** The app's answer to the provider's redirect back (`/auth/callback?code=…&state=…`). */
  readonly callback: Response;
}

/**
 * The real authorization-code flow, step by step, as a browser makes it: app `/auth/login` → provider
 * `/auth` → our login page → POST username/password → provider resumes → app `/auth/callback`.
 * `agent` carries the app's cookies; the provider's cookies live in their own jar.
 */
export async function signInThroughProvider(
  agent: Agent,
  account: Pick<DemoAccount, 'username' | 'password'>,
  options: { returnTo?: string } = {},
): Promise<SignInSteps> {
  const idp = await testIdp();
  const browserAtIdp = request.agent(idp.issuer);
  const login = await agent.get('/auth/login').query(options.returnTo ? { returnTo: options.returnTo } : {});
  if (login.status !== 303 && login.status !== 302) throw new Error(`/auth/login answered ${login.status}: ${login.text}`);
  const authorize = await browserAtIdp.get(local(login.headers['location']!));
  const interaction = authorize.headers['location'];
  if (!interaction?.startsWith('/interaction/')) throw new Error(`provider answered ${authorize.status}: ${authorize.text.slice(0, 300)}`);
  const page = await browserAtIdp.get(interaction).expect(200);
  const action = /action="(\/interaction\/[^"]+\/login)"/.exec(page.text)?.[1];
  if (!action) throw new Error('provider login page has no form');
  const posted = await browserAtIdp.post(action).type('form').send({ username: account.username, password: account.password });
  if (posted.status !== 303) throw new Error(`provider refused the sign-in (${posted.status})`);
  const resumed = await browserAtIdp.get(local(new URL(posted.headers['location']!, idp.issuer).toString()));
  const back = resumed.headers['location'];
  if (!back?.includes('/auth/callback')) throw new Error(`provider did not return to the app (${resumed.status}): ${resumed.text.slice(0, 300)}`);
  const callback = await agent.get(local(back));
  return { login, callback };
}

/**
 * Signs in through the in-process provider as the demo account holding exactly `who` (a role) or with username
 * `who`, and returns an agent whose later requests are that person's. Reusable by every feature's specs:
 *
 * ```ts
 * const { agent } = await signInAs(app, 'materials-scientist');
 * await agent.post('/api/…').send({ … }).expect(201);   // CSRF header already set
 * ```
 */
export async function signInAs(app: Express, who: Role | string, options: { returnTo?: string } = {}): Promise<SignedIn> {
  const account = accountFor(who);
  const agent = request.agent(app);
  const { callback } = await signInThroughProvider(agent, account, options);
  const sessionCookie = cookieFrom(callback, SESSION_COOKIE);
  const csrf = cookieFrom(callback, CSRF_COOKIE);
  if (callback.status !== 303 || !sessionCookie || !csrf || callback.headers['location']!.startsWith('/sign-in')) {
    throw new Error(`sign-in as ${account.username} failed: ${callback.status} → ${callback.headers['location']}`);
  }
  const csrfToken = decodeURIComponent(csrf.slice(CSRF_COOKIE.length + 1));
  agent.set(CSRF_HEADER, csrfToken);
  return { agent, account, sessionCookie, sessionId: sessionIdOf(sessionCookie), csrfToken, landedOn: callback.headers['location']! };
}

/** `wick.sid=s%3A<id>.<signature>` → `<id>`. */
export function sessionIdOf(cookie: string): string {
  const value = decodeURIComponent(cookie.slice(cookie.indexOf('=') + 1));
  return value.replace(/^s:/, '').replace(/\.[^.]*$/, '');
}
