import request from 'supertest';
import { PERMISSIONS, ROLES, type CurrentUser, type Permission } from 'wick-core';
import { CSRF_COOKIE } from '../auth/auth-config';
import { testApp } from '../../test/test-app';
import { accountFor, setCookieLine, signInAs } from '../../test/sign-in';

describe('GET /api/me', () => {
  it('when nobody is signed in, then 401 in the JSON error envelope', async () => {
    const res = await request(testApp()).get('/api/me').expect(401).expect('Content-Type', /json/);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  for (const role of ROLES) {
    it(`when the ${role} demo account is signed in, then the person, the role and exactly the table's permissions`, async () => {
      const { agent } = await signInAs(testApp(), role);
      const me = (await agent.get('/api/me').expect(200)).body as CurrentUser;
      const account = accountFor(role);
      expect(me).toEqual(jasmine.objectContaining({ subject: account.sub, name: account.name, email: account.email, roles: [role] }));
      // The permission table (wick-core) read the other way round: every permission listing the role.
      const expected = (Object.keys(PERMISSIONS) as Permission[]).filter((p) => (PERMISSIONS[p] as readonly string[]).includes(role));
      expect(me.permissions).toEqual(expected);
    });
  }

  it('when a person holds two roles, then both, and the union of their permissions', async () => {
    const { agent } = await signInAs(testApp(), 'lena');
    const me = (await agent.get('/api/me').expect(200)).body as CurrentUser;
    expect(me.roles).toEqual(['materials-scientist', 'reviewer']);
    expect(me.permissions).toContain('library:edit');
    expect(me.permissions).toContain('library:review');
    expect(me.permissions).not.toContain('designs:edit');
  });

  it('when asked, then the answer is not cached and the CSRF cookie is re-issued', async () => {
    const { agent } = await signInAs(testApp(), 'engineer');
    const res = await agent.get('/api/me').expect(200);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(setCookieLine(res, CSRF_COOKIE)).toBeDefined();
  });

  it('when the session is gone but the CSRF cookie is still there, then the stale cookie is cleared', async () => {
    const res = await request(testApp()).get('/api/me').set('Cookie', `${CSRF_COOKIE}=stale`).expect(401);
    expect(setCookieLine(res, CSRF_COOKIE)).toMatch(/Expires=Thu, 01 Jan 1970/);
  });
});
