import {
  type CreationOptional,
  DataTypes,
  type InferAttributes,
  type InferCreationAttributes,
  Model,
  type ModelStatic,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { AuditAction } from 'wick-core';
import type { User } from './user';

/** Who did what to which record, when. Written only through services/audit.ts. */
export class AuditLog extends Model<InferAttributes<AuditLog>, InferCreationAttributes<AuditLog>> {
  declare id: CreationOptional<number>;
  declare at: CreationOptional<Date>;
  declare actorId: number | null;
  declare action: AuditAction;
  declare entityType: string;
  declare entityId: string | null;
  declare details: Record<string, unknown> | null;
  declare actor?: NonAttribute<User | null>;
}

export function initAuditLog(sequelize: Sequelize): ModelStatic<AuditLog> {
  const Bound = class extends AuditLog {};
  Bound.init(
    {
      // BIGINT comes back from pg as a string; ids stay far below 2^53.
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true, get() { return Number(this.getDataValue('id')); } },
      at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      actorId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(40), allowNull: false },
      entityType: { type: DataTypes.STRING(60), allowNull: false },
      entityId: { type: DataTypes.STRING(100), allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: true },
    },
    { sequelize, modelName: 'AuditLog', tableName: 'audit_log', underscored: true, timestamps: false },
  );
  return Bound;
}
