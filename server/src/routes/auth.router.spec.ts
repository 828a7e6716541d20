import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { CSRF_COOKIE, SESSION_COOKIE } from '../auth/auth-config';
import { authModels } from '../models';
import { testApp, testSequelize } from '../../test/test-app';
import { testIdp } from '../../test/idp';
import { accountFor, cookieFrom, sessionIdOf, setCookieLine, signInAs, signInThroughProvider } from '../../test/sign-in';
import { safeReturnTo } from './auth.router';

async function sessionRow(sid: string): Promise<{ sess: Record<string, unknown>; expire: Date } | undefined> {
  const rows = await testSequelize().query<{ sess: Record<string, unknown>; expire: Date }>(
    'SELECT sess, expire FROM sessions WHERE sid = :sid',
    { replacements: { sid }, type: QueryTypes.SELECT },
  );
  return rows[0];
}

describe('sign-in through the OpenID Connect provider', () => {
  it('when a person signs in with the real code flow, then they land where they started with a hardened session cookie', async () => {
    const app = testApp();
    const { agent, landedOn, sessionId } = await signInAs(app, 'engineer', { returnTo: '/designs?tab=stack' });
    expect(landedOn).toBe('/designs?tab=stack');
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.name).toBe(accountFor('engineer').name);
    expect(me.body.roles).toEqual(['engineer']);
    expect(await sessionRow(sessionId)).toBeDefined();
  });

  it('when signing in, then the session cookie is httpOnly, SameSite=Lax, not Secure on http, and the CSRF cookie is readable', async () => {
    const app = testApp();
    const agent = request.agent(app);
    const { callback } = await signInThroughProvider(agent, accountFor('reviewer'));
    const session = setCookieLine(callback, SESSION_COOKIE)!;
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(session).not.toMatch(/;\s*Secure/i);
    expect(session).toMatch(/Expires=/i);
    const csrf = setCookieLine(callback, CSRF_COOKIE)!;
    expect(csrf).not.toMatch(/HttpOnly/i);
    expect(csrf).toMatch(/SameSite=Lax/i);
  });

  it('when the app is served over https, then its cookies are Secure', async () => {
    const app = testApp({ config: { publicUrl: 'https://wick.example' } });
    const res = await request(app).get('/auth/login').set('X-Forwarded-Proto', 'https').expect(302);
    expect(setCookieLine(res, SESSION_COOKIE)).toMatch(/;\s*Secure/i);
    expect(res.headers['location']).toContain(encodeURIComponent('https://wick.example/auth/callback'));
  });

  it('when the provider redirects, then the request carries state, nonce, our client id and the code flow, but no secret', async () => {
    const res = await request(testApp()).get('/auth/login').expect(302);
    const url = new URL(res.headers['location']!);
    expect(url.origin).toBe(new URL((await testIdp()).issuer).origin);
    expect(url.searchParams.get('response_type')).toBe('code');
    expect(url.searchParams.get('client_id')).toBe('wickwright');
    expect(url.searchParams.get('scope')!.split(' ')).toEqual(jasmine.arrayContaining(['openid', 'roles']));
    expect(url.searchParams.get('state')!.length).toBeGreaterThanOrEqual(20);
    expect(url.searchParams.get('nonce')!.length).toBeGreaterThanOrEqual(20);
    expect(url.searchParams.has('client_secret')).toBeFalse();
  });

  it('when a person signs in, then their record is upserted with the roles claim and the sign-in is audited', async () => {
    const app = testApp();
    const { agent } = await signInAs(app, 'lena');
    const me = (await agent.get('/api/me').expect(200)).body;
    expect(me.roles).toEqual(['materials-scientist', 'reviewer']);
    const { User, AuditLog } = authModels(testSequelize());
    const before = await User.findByPk(me.id);
    await signInAs(app, 'lena');
    const after = await User.findByPk(me.id);
    expect(await User.count({ where: { subject: accountFor('lena').sub, issuer: (await testIdp()).issuer } })).toBe(1);
    expect(after!.lastSignInAt!.getTime()).toBeGreaterThan(before!.lastSignInAt!.getTime());
    expect(after!.idpRoles).toEqual(['materials-scientist', 'reviewer']);
    const rows = await AuditLog.findAll({ where: { actorId: me.id, action: 'sign-in' } });
    expect(rows.length).toBeGreaterThanOrEqual(2);
    expect(rows[0].entityType).toBe('user');
  });

  it('when the callback state does not match the one in the session, then sign-in fails and nobody is signed in', async () => {
    const app = testApp();
    const agent = request.agent(app);
    await agent.get('/auth/login').expect(302);
    const res = await agent.get('/auth/callback').query({ code: 'stolen-code', state: 'not-the-state' }).expect(303);
    expect(res.headers['location']).toMatch(/^\/sign-in\?error=failed/);
    await agent.get('/api/me').expect(401);
  });

  it('when the person cancels at the provider, then the app says so on its sign-in page', async () => {
    const app = testApp();
    const agent = request.agent(app);
    const idp = request.agent((await testIdp()).issuer);
    const login = await agent.get('/auth/login').expect(302);
    const interaction = (await idp.get(new URL(login.headers['location']!).pathname + new URL(login.headers['location']!).search)).headers['location']!;
    const aborted = await idp.get(`${interaction}/abort`).expect(303);
    const resumed = await idp.get(new URL(aborted.headers['location']!, 'http://x').pathname);
    const back = new URL(resumed.headers['location']!);
    expect(back.searchParams.get('error')).toBe('access_denied');
    const res = await agent.get(back.pathname + back.search).expect(303);
    expect(res.headers['location']).toMatch(/^\/sign-in\?error=cancelled/);
  });

  it('when the password is wrong, then the provider shows its page again and issues no code', async () => {
    const app = testApp();
    await expectAsync(signInThroughProvider(request.agent(app), { username: 'priya', password: 'guess' })).toBeRejectedWithError(
      /refused the sign-in \(401\)/,
    );
  });

  it('when the person holds no Wickwright role, then /api/me answers 403 no-role', async () => {
    const { agent } = await signInAs(testApp(), 'visitor');
    const res = await agent.get('/api/me').expect(403);
    expect(res.body.error.code).toBe('no-role');
  });
});

describe('session security', () => {
  it('when a session id is planted before sign-in (fixation), then sign-in issues a new id and the old one is worthless', async () => {
    const app = testApp();
    const agent = request.agent(app);
    const { login, callback } = await signInThroughProvider(agent, accountFor('program-manager'));
    const planted = cookieFrom(login, SESSION_COOKIE)!;
    const issued = cookieFrom(callback, SESSION_COOKIE)!;
    expect(planted).toBeDefined();
    expect(sessionIdOf(issued)).not.toBe(sessionIdOf(planted));
    expect(await sessionRow(sessionIdOf(planted))).toBeUndefined();
    await request(app).get('/api/me').set('Cookie', planted).expect(401);
    await request(app).get('/api/me').set('Cookie', issued).expect(200);
  });

  it('when a signed-in request that changes data lacks the CSRF token, then 403 csrf-failed and nothing changes', async () => {
    const app = testApp();
    const admin = await signInAs(app, 'admin');
    const target = (await signInAs(app, 'engineer')).agent;
    const targetId = (await target.get('/api/me')).body.id as number;
    const body = { granted: ['reviewer'], revoked: [] };
    const missing = await request(app).put(`/api/admin/users/${targetId}/roles`).set('Cookie', admin.sessionCookie).send(body).expect(403);
    expect(missing.body.error.code).toBe('csrf-failed');
    const wrong = await request(app)
      .put(`/api/admin/users/${targetId}/roles`)
      .set('Cookie', admin.sessionCookie)
      .set('X-CSRF-Token', admin.csrfToken.replace(/^./, (c) => (c === 'a' ? 'b' : 'a')))
      .send(body)
      .expect(403);
    expect(wrong.body.error.code).toBe('csrf-failed');
    expect((await target.get('/api/me')).body.roles).toEqual(['engineer']);
    const logout = await request(app).post('/auth/logout').set('Cookie', admin.sessionCookie).expect(403);
    expect(logout.body.error.code).toBe('csrf-failed');
    await admin.agent.get('/api/me').expect(200);
  });

  it('when a request that changes data comes from another origin, then 403 even with the token', async () => {
    const app = testApp();
    const { agent } = await signInAs(app, 'engineer');
    const res = await agent.post('/auth/logout').set('Origin', 'https://attacker.example').expect(403);
    expect(res.body.error.code).toBe('cross-origin');
    await agent.get('/api/me').expect(200);
  });

  it('when the session cookie is tampered with, then the request is anonymous (401)', async () => {
    const app = testApp();
    const { sessionCookie } = await signInAs(app, 'reviewer');
    await request(app).get('/api/me').set('Cookie', sessionCookie).expect(200);
    const [name, value] = sessionCookie.split('=');
    const decoded = decodeURIComponent(value);
    const flip = (s: string, i: number) => s.slice(0, i) + (s[i] === 'A' ? 'B' : 'A') + s.slice(i + 1);
    // A changed signature, and a changed id under the old signature.
    const badSignature = `${name}=${encodeURIComponent(flip(decoded, decoded.length - 2))}`;
    const badId = `${name}=${encodeURIComponent(flip(decoded, 3))}`;
    for (const cookie of [badSignature, badId]) {
      const res = await request(app).get('/api/me').set('Cookie', cookie).expect(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });

  it('when the session has been idle past its expiry, then it is rejected (401)', async () => {
    const app = testApp();
    const { agent, sessionId } = await signInAs(app, 'engineer');
    await testSequelize().query(`UPDATE sessions SET expire = now() - interval '1 second' WHERE sid = :sid`, { replacements: { sid: sessionId } });
    await agent.get('/api/me').expect(401);
  });

  it('when the session is older than the absolute timeout, then it is rejected (401) and deleted, however active', async () => {
    const app = testApp();
    const { agent, sessionId } = await signInAs(app, 'engineer');
    const row = (await sessionRow(sessionId))!;
    const sess = { ...row.sess, signedInAt: Date.now() - 13 * 3600 * 1000 };
    await testSequelize().query('UPDATE sessions SET sess = :sess WHERE sid = :sid', {
      replacements: { sess: JSON.stringify(sess), sid: sessionId },
    });
    const res = await agent.get('/api/me').expect(401);
    expect(setCookieLine(res, SESSION_COOKIE)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect(await sessionRow(sessionId)).toBeUndefined();
  });

  it('when each request comes in, then the idle expiry slides forward (rolling session)', async () => {
    const app = testApp();
    const { agent, sessionId } = await signInAs(app, 'engineer');
    await testSequelize().query(`UPDATE sessions SET expire = now() + interval '1 minute' WHERE sid = :sid`, { replacements: { sid: sessionId } });
    await agent.get('/api/me').expect(200);
    const row = (await sessionRow(sessionId))!;
    expect(row.expire.getTime()).toBeGreaterThan(Date.now() + 60 * 60 * 1000);
  });

  it('when the server restarts, then the session survives (it lives in PostgreSQL)', async () => {
    const { sessionCookie, csrfToken } = await signInAs(testApp(), 'program-manager');
    const restarted = testApp();
    const me = await request(restarted).get('/api/me').set('Cookie', sessionCookie).expect(200);
    expect(me.body.roles).toEqual(['program-manager']);
    await request(restarted).post('/auth/logout').set('Cookie', sessionCookie).set('X-CSRF-Token', csrfToken).expect(200);
  });
});

describe('sign-out', () => {
  it('when a person signs out, then the session is destroyed, cookies cleared, the sign-out audited and the provider’s end-session URL returned', async () => {
    const app = testApp();
    const { agent, sessionId, sessionCookie } = await signInAs(app, 'admin');
    const me = (await agent.get('/api/me')).body;
    const res = await agent.post('/auth/logout').expect(200);
    const url = new URL(res.body.redirectTo);
    expect(url.origin).toBe(new URL((await testIdp()).issuer).origin);
    expect(url.searchParams.get('post_logout_redirect_uri')).toMatch(/\/$/);
    expect(url.searchParams.get('id_token_hint')!.split('.').length).toBe(3);
    expect(setCookieLine(res, SESSION_COOKIE)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect(setCookieLine(res, CSRF_COOKIE)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect(await sessionRow(sessionId)).toBeUndefined();
    await request(app).get('/api/me').set('Cookie', sessionCookie).expect(401);
    const { AuditLog } = authModels(testSequelize());
    expect(await AuditLog.count({ where: { actorId: me.id, action: 'sign-out' } })).toBeGreaterThanOrEqual(1);
  });

  it('when the provider’s end-session page is followed, then it returns to the app', async () => {
    const app = testApp();
    const idp = await testIdp();
    const agent = request.agent(app);
    const browserAtIdp = request.agent(idp.issuer);
    // Sign in with the provider's jar so its session exists, then sign out through it.
    const login = await agent.get('/auth/login').expect(302);
    const at = (u: string) => new URL(u, idp.issuer);
    const interaction = (await browserAtIdp.get(at(login.headers['location']!).pathname + at(login.headers['location']!).search)).headers['location']!;
    const page = await browserAtIdp.get(interaction);
    const action = /action="([^"]+\/login)"/.exec(page.text)![1];
    const posted = await browserAtIdp.post(action).type('form').send({ username: 'martin', password: 'brightwell-demo' });
    const resumed = await browserAtIdp.get(at(posted.headers['location']!).pathname);
    const back = new URL(resumed.headers['location']!);
    const callback = await agent.get(back.pathname + back.search).expect(303);
    agent.set('X-CSRF-Token', decodeURIComponent(cookieFrom(callback, CSRF_COOKIE)!.split('=')[1]));
    const { redirectTo } = (await agent.post('/auth/logout').expect(200)).body as { redirectTo: string };
    const endSession = await browserAtIdp.get(at(redirectTo).pathname + at(redirectTo).search).expect(200);
    expect(endSession.text).toContain('op.logoutForm');
    expect(endSession.headers['content-security-policy']).toContain("default-src 'none'");
    const xsrf = /name="xsrf" value="([^"]+)"/.exec(endSession.text)![1];
    const action2 = /<form[^>]*action="([^"]+)"/.exec(endSession.text)![1];
    const done = await browserAtIdp.post(at(action2).pathname).type('form').send({ xsrf, logout: 'yes' }).expect(303);
    expect(done.headers['location']).toBe(`${new URL(redirectTo).searchParams.get('post_logout_redirect_uri')}`);
  });

  it('when nobody is signed in, then sign-out is harmless and answers where to go', async () => {
    const res = await request(testApp()).post('/auth/logout').expect(200);
    expect(res.body).toEqual({ redirectTo: '/' });
  });
});

describe('sign-in endpoints', () => {
  it('when too many sign-in requests come from one address, then 429 in the error envelope', async () => {
    const app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 2 } } });
    await request(app).get('/auth/login').expect(302);
    await request(app).get('/auth/login').expect(302);
    const res = await request(app).get('/auth/login').expect(429);
    expect(res.body.error.code).toBe('too-many-requests');
  });

  it('when the provider cannot be reached, then sign-in sends the person to the sign-in page with a reason', async () => {
    const app = testApp({ auth: { issuer: 'http://127.0.0.1:9' } });
    const res = await request(app).get('/auth/login').query({ returnTo: '/lab-data' }).expect(303);
    expect(res.headers['location']).toBe(`/sign-in?error=unavailable&returnTo=${encodeURIComponent('/lab-data')}`);
  });

  it('when returnTo points anywhere but a page of this app, then it becomes "/" (no open redirect)', () => {
    // Open-redirect shapes: scheme-relative, backslash tricks, absolute URLs, control characters, API paths.
    for (const bad of ['//evil.example', '/\\evil.example', 'https://evil.example/', 'javascript:alert(1)', '/a\nb', '/auth/login', '/api/me', 42]) {
      expect(safeReturnTo(bad)).withContext(String(bad)).toBe('/');
    }
    for (const good of ['/', '/materials', '/designs/12?tab=stack#plot']) expect(safeReturnTo(good)).toBe(good);
  });
});
