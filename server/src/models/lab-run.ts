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
import type { CurveMeasurement, FitSettings, RunFigures, RunLiquid, RunOrientation, RunWeb } from 'wick-core';
import type { LabSet } from './lab-set';

/**
 * One measured wicking run: the curve in SI, the uploaded file, the specimen (web revision, orientation, size),
 * the liquid at the run temperature, conditions and notes, and how it is fitted. Schema: migrations/0005-lab-data.ts.
 */
export class LabRun extends Model<InferAttributes<LabRun>, InferCreationAttributes<LabRun>> {
  declare id: CreationOptional<number>;
  declare setId: number;
  declare name: string;
  declare webEntryId: number;
  declare webRevision: number;
  declare web: RunWeb;
  declare liquid: RunLiquid;
  /** K */
  declare temperature: number;
  declare orientation: RunOrientation;
  /** rad from horizontal. */
  declare tilt: number;
  /** m */
  declare width: number | null;
  /** m */
  declare thickness: number | null;
  declare measurement: CurveMeasurement;
  /** s */
  declare times: number[];
  /** m or kg */
  declare readings: number[];
  declare timeUnit: string;
  declare valueUnit: string;
  declare fileId: number;
  declare conditions: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  /** YYYY-MM-DD */
  declare measuredAt: string | null;
  declare fit: FitSettings;
  declare summary: RunFigures;
  declare coreVersion: string;
  /** Optimistic locking. */
  declare version: CreationOptional<number>;
  declare createdBy: number;
  declare updatedBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare labSet?: NonAttribute<LabSet>;
}

export function initLabRun(sequelize: Sequelize): ModelStatic<LabRun> {
  const Bound = class extends LabRun {};
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      setId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      webEntryId: { type: DataTypes.INTEGER, allowNull: false },
      webRevision: { type: DataTypes.INTEGER, allowNull: false },
      web: { type: DataTypes.JSONB, allowNull: false },
      liquid: { type: DataTypes.JSONB, allowNull: false },
      temperature: { type: DataTypes.DOUBLE, allowNull: false },
      orientation: { type: DataTypes.STRING(12), allowNull: false },
      tilt: { type: DataTypes.DOUBLE, allowNull: false },
      width: { type: DataTypes.DOUBLE, allowNull: true },
      thickness: { type: DataTypes.DOUBLE, allowNull: true },
      measurement: { type: DataTypes.STRING(8), allowNull: false },
      times: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: false },
      readings: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: false },
      timeUnit: { type: DataTypes.STRING(20), allowNull: false },
      valueUnit: { type: DataTypes.STRING(20), allowNull: false },
      fileId: { type: DataTypes.INTEGER, allowNull: false },
      conditions: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      measuredAt: { type: DataTypes.DATEONLY, allowNull: true },
      fit: { type: DataTypes.JSONB, allowNull: false },
      summary: { type: DataTypes.JSONB, allowNull: false },
      coreVersion: { type: DataTypes.STRING(20), allowNull: false },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdBy: { type: DataTypes.INTEGER, allowNull: false },
      updatedBy: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'LabRun', tableName: 'lab_runs', underscored: true },
  );
  return Bound;
}
