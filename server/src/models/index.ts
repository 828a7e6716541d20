import type { ModelStatic, Sequelize } from 'sequelize';
import { type AuditLog, initAuditLog } from './audit-log';
import { type LabRun, initLabRun } from './lab-run';
import { type LabSet, initLabSet } from './lab-set';
import { type User, initUser } from './user';

export { AuditLog } from './audit-log';
export { LabRun } from './lab-run';
export { LabSet } from './lab-set';
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

// ── Design workspace: projects → designs → variants, and decisions ─────────────────────────────────────────
import { type Decision, initDecision } from './decision';
import { type Design, initDesign } from './design';
import { type Project, initProject } from './project';
import { type Variant, initVariant } from './variant';

export { Decision } from './decision';
export { Design } from './design';
export { Project } from './project';
export { Variant } from './variant';

export interface DesignModels {
  readonly Project: ModelStatic<Project>;
  readonly Design: ModelStatic<Design>;
  readonly Variant: ModelStatic<Variant>;
  readonly Decision: ModelStatic<Decision>;
  readonly User: ModelStatic<User>;
}

const boundDesigns = new WeakMap<Sequelize, DesignModels>();

/** The design-workspace models bound to one Sequelize instance, with their associations (and to users). */
export function designModels(sequelize: Sequelize): DesignModels {
  const hit = boundDesigns.get(sequelize);
  if (hit) return hit;
  const { User: BoundUser } = authModels(sequelize);
  const models: DesignModels = {
    Project: initProject(sequelize),
    Design: initDesign(sequelize),
    Variant: initVariant(sequelize),
    Decision: initDecision(sequelize),
    User: BoundUser,
  };
  models.Project.hasMany(models.Design, { foreignKey: 'projectId', as: 'designs' });
  models.Design.belongsTo(models.Project, { foreignKey: 'projectId', as: 'project' });
  models.Design.hasMany(models.Variant, { foreignKey: 'designId', as: 'variants' });
  models.Variant.belongsTo(models.Design, { foreignKey: 'designId', as: 'design' });
  models.Decision.belongsTo(models.User, { foreignKey: 'decidedBy', as: 'decider', constraints: false });
  boundDesigns.set(sequelize, models);
  return models;
}

// ── Lab data: replicate sets and measured runs ───────────────────────────────────────────────────────────────

export interface LabModels {
  readonly LabSet: ModelStatic<LabSet>;
  readonly LabRun: ModelStatic<LabRun>;
  readonly User: ModelStatic<User>;
}

const boundLab = new WeakMap<Sequelize, LabModels>();

/** The lab-data models bound to one Sequelize instance, with their associations. */
export function labModels(sequelize: Sequelize): LabModels {
  const hit = boundLab.get(sequelize);
  if (hit) return hit;
  const { User: BoundUser } = authModels(sequelize);
  const models: LabModels = { LabSet: initLabSet(sequelize), LabRun: initLabRun(sequelize), User: BoundUser };
  models.LabSet.hasMany(models.LabRun, { foreignKey: 'setId', as: 'runs' });
  models.LabRun.belongsTo(models.LabSet, { foreignKey: 'setId', as: 'labSet' });
  boundLab.set(sequelize, models);
  return models;
}
