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
import type { CurveMeasurement, LabProposal, RunOrientation } from 'wick-core';
import type { LabRun } from './lab-run';

/**
 * A set of replicate lab runs: same web, liquid, orientation and measured quantity. Holds the proposals of its
 * fitted values to the library. Schema: migrations/0005-lab-data.ts.
 */
export class LabSet extends Model<InferAttributes<LabSet>, InferCreationAttributes<LabSet>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare notes: CreationOptional<string>;
  declare webEntryId: number;
  /** 'built-in:<id>' or 'library:<entry id>'. */
  declare liquidKey: string;
  declare liquidName: string;
  declare orientation: RunOrientation;
  declare measurement: CurveMeasurement;
  declare proposals: CreationOptional<LabProposal[]>;
  /** Optimistic locking. */
  declare version: CreationOptional<number>;
  declare createdBy: number;
  declare updatedBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare runs?: NonAttribute<LabRun[]>;
}

export function initLabSet(sequelize: Sequelize): ModelStatic<LabSet> {
  const Bound = class extends LabSet {};
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      webEntryId: { type: DataTypes.INTEGER, allowNull: false },
      liquidKey: { type: DataTypes.STRING(80), allowNull: false },
      liquidName: { type: DataTypes.STRING(200), allowNull: false },
      orientation: { type: DataTypes.STRING(12), allowNull: false },
      measurement: { type: DataTypes.STRING(8), allowNull: false },
      proposals: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdBy: { type: DataTypes.INTEGER, allowNull: false },
      updatedBy: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LabSet', tableName: 'lab_sets', underscored: true },
  );
  return Bound;
}
