import type { ModelStatic, Sequelize } from 'sequelize';
import { type AuditLog, initAuditLog } from './audit-log';
import { type User, initUser } from './user';

export { AuditLog } from './audit-log';
export { User } from './user';

export interface AuthModels {
  readonly User: ModelStatic<User>;
  readonly AuditLog: ModelStatic<AuditLog>;
}

const bound = new WeakMap<Sequelize, AuthModels>();

/**
 * People and the audit log, bound to one Sequelize instance (own subclasses per instance, so an app built on a
 * second connection — tests do that — never rebinds the classes another app uses). Associations live here.
 */
export function authModels(sequelize: Sequelize): AuthModels {
  const hit = bound.get(sequelize);
  if (hit) return hit;
  const models: AuthModels = { User: initUser(sequelize), AuditLog: initAuditLog(sequelize) };
  models.AuditLog.belongsTo(models.User, { foreignKey: 'actorId', as: 'actor', constraints: false });
  models.User.hasMany(models.AuditLog, { foreignKey: 'actorId', as: 'auditEntries', constraints: false });
  bound.set(sequelize, models);
  return models;
}
