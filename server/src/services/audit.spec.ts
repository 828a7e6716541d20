import { testSequelize } from '../../test/test-app';
import { authModels } from '../models';
import { audit } from './audit';

describe('audit()', () => {
  it('when the change commits, then its audit row commits with it', async () => {
    const sequelize = testSequelize();
    const { AuditLog } = authModels(sequelize);
    const entityType = `commit-${Date.now()}`;
    await sequelize.transaction((tx) => audit(tx, { actorId: null, action: 'create', entityType, entityId: 7, details: { name: 'SAP core 42' } }));
    const row = await AuditLog.findOne({ where: { entityType } });
    expect(row).toEqual(jasmine.objectContaining({ action: 'create', entityId: '7', actorId: null, details: { name: 'SAP core 42' } }));
    expect(row!.at.getTime()).toBeLessThanOrEqual(Date.now());
  });

  it('when the change rolls back, then no audit row is left behind', async () => {
    const sequelize = testSequelize();
    const { AuditLog } = authModels(sequelize);
    const entityType = `rollback-${Date.now()}`;
    await expectAsync(
      sequelize.transaction(async (tx) => {
        await audit(tx, { actorId: null, action: 'delete', entityType, entityId: 'x' });
        throw new Error('the change failed after the audit call');
      }),
    ).toBeRejectedWithError(/the change failed/);
    expect(await AuditLog.count({ where: { entityType } })).toBe(0);
  });

  it('when the audit row cannot be written, then the whole transaction fails (no unrecorded change)', async () => {
    const sequelize = testSequelize();
    await expectAsync(
      sequelize.transaction((tx) => audit(tx, { actorId: 2_000_000_000, action: 'update', entityType: 'user', entityId: 1 })),
    ).toBeRejected();
  });
});
