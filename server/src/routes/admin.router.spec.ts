import type { AdminUser, AuditPage } from 'wick-core';
import { testApp, testSequelize } from '../../test/test-app';
import { signInAs } from '../../test/sign-in';
import { authModels } from '../models';
import { audit } from '../services/audit';

describe('administration: people and role overrides', () => {
  it('when the admin lists people, then everyone who signed in, with provider roles, overrides and effective roles', async () => {
    const app = testApp();
    await signInAs(app, 'reviewer');
    const { agent } = await signInAs(app, 'admin');
    const users = (await agent.get('/api/admin/users').expect(200)).body as AdminUser[];
    const grace = users.find((u) => u.name === 'Grace Adebayo')!;
    expect(grace).toEqual(jasmine.objectContaining({ idpRoles: ['reviewer'], grantedRoles: [], revokedRoles: [], roles: ['reviewer'] }));
    expect(Date.parse(grace.lastSignInAt!)).not.toBeNaN();
  });

  it('when the admin grants and revokes roles, then they apply on the next request and the change is audited', async () => {
    const app = testApp();
    const engineer = await signInAs(app, 'engineer');
    const id = (await engineer.agent.get('/api/me')).body.id as number;
    await engineer.agent.get('/api/admin/users').expect(403);
    const { agent } = await signInAs(app, 'admin');

    const granted = (await agent.put(`/api/admin/users/${id}/roles`).send({ granted: ['reviewer'], revoked: [] }).expect(200)).body as AdminUser;
    expect(granted.roles).toEqual(['engineer', 'reviewer']);
    expect((await engineer.agent.get('/api/me')).body.roles).toEqual(['engineer', 'reviewer']);

    const revoked = (await agent.put(`/api/admin/users/${id}/roles`).send({ granted: [], revoked: ['engineer'] }).expect(200)).body as AdminUser;
    expect(revoked.roles).toEqual([]);
    expect((await engineer.agent.get('/api/me').expect(403)).body.error.code).toBe('no-role');

    const log = (await agent.get('/api/admin/audit').query({ entityType: 'user', entityId: String(id), action: 'update' }).expect(200)).body as AuditPage;
    expect(log.entries.length).toBe(2);
    expect(log.entries[0].details).toEqual(jasmine.objectContaining({ after: { granted: [], revoked: ['engineer'], roles: [] } }));

    // Clearing the overrides leaves the provider's roles.
    await agent.put(`/api/admin/users/${id}/roles`).send({ granted: [], revoked: [] }).expect(200);
    expect((await engineer.agent.get('/api/me')).body.roles).toEqual(['engineer']);
  });

  it('when an admin would revoke their own admin role, then 409 and nothing changes', async () => {
    const { agent } = await signInAs(testApp(), 'admin');
    const id = (await agent.get('/api/me')).body.id as number;
    const res = await agent.put(`/api/admin/users/${id}/roles`).send({ granted: [], revoked: ['admin'] }).expect(409);
    expect(res.body.error.code).toBe('self-lockout');
    expect((await agent.get('/api/me')).body.roles).toEqual(['admin']);
  });

  it('when the body is not a valid override, then 422 validation-failed', async () => {
    const { agent } = await signInAs(testApp(), 'admin');
    for (const body of [{}, { granted: ['superuser'], revoked: [] }, { granted: ['reviewer'], revoked: ['reviewer'] }, { granted: [], revoked: [], extra: 1 }]) {
      const res = await agent.put('/api/admin/users/1/roles').send(body).expect(422);
      expect(res.body.error.code).withContext(JSON.stringify(body)).toBe('validation-failed');
    }
    await agent.put('/api/admin/users/999999/roles').send({ granted: [], revoked: [] }).expect(404);
    await agent.put('/api/admin/users/abc/roles').send({ granted: [], revoked: [] }).expect(422);
  });
});

describe('administration: audit log', () => {
  it('when filtered by action, person, record and dates, then only matching rows, newest first, paged', async () => {
    const sequelize = testSequelize();
    const { User } = authModels(sequelize);
    const app = testApp();
    const { agent } = await signInAs(app, 'admin');
    const adminId = (await agent.get('/api/me')).body.id as number;
    const other = await User.create({ issuer: 'test://audit', subject: `audit-${Date.now()}`, name: 'Otto Auditee' });
    const entity = `spec-${Date.now()}`;
    await sequelize.transaction(async (tx) => {
      for (let i = 1; i <= 5; i++) {
        await audit(tx, { actorId: i % 2 ? adminId : other.id, action: i === 5 ? 'approve' : 'update', entityType: entity, entityId: i, details: { step: i } });
      }
    });

    const all = (await agent.get('/api/admin/audit').query({ entityType: entity }).expect(200)).body as AuditPage;
    expect(all.total).toBe(5);
    expect(all.entries.map((e) => e.entityId)).toEqual(['5', '4', '3', '2', '1']);
    expect(all.entityTypes).toContain(entity);
    expect(all.entries[0].actor).toEqual({ id: adminId, name: 'Ada Whitfield' });

    const approve = (await agent.get('/api/admin/audit').query({ entityType: entity, action: 'approve' })).body as AuditPage;
    expect(approve.entries.map((e) => e.entityId)).toEqual(['5']);
    const byOther = (await agent.get('/api/admin/audit').query({ entityType: entity, actorId: other.id })).body as AuditPage;
    expect(byOther.entries.map((e) => e.entityId)).toEqual(['4', '2']);
    const page2 = (await agent.get('/api/admin/audit').query({ entityType: entity, limit: 2, offset: 2 })).body as AuditPage;
    expect(page2.entries.map((e) => e.entityId)).toEqual(['3', '2']);
    expect(page2.total).toBe(5);

    const today = new Date().toISOString().slice(0, 10);
    const tomorrow = new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
    expect(((await agent.get('/api/admin/audit').query({ entityType: entity, from: today, to: today })).body as AuditPage).total).toBe(5);
    expect(((await agent.get('/api/admin/audit').query({ entityType: entity, from: tomorrow })).body as AuditPage).total).toBe(0);
  });

  it('when the filter is malformed, then 422', async () => {
    const { agent } = await signInAs(testApp(), 'admin');
    for (const q of [{ action: 'dance' }, { from: 'yesterday' }, { limit: '100000' }, { unknown: 'x' }]) {
      await agent.get('/api/admin/audit').query(q).expect(422);
    }
  });
});
