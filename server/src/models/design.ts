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
import type { Project } from './project';
import type { Variant } from './variant';

/** A design within a project: a family of variants answering one question. Schema: migrations/0004-designs.ts. */
export class Design extends Model<InferAttributes<Design>, InferCreationAttributes<Design>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare name: string;
  declare description: CreationOptional<string>;
  declare createdBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare project?: NonAttribute<Project>;
  declare variants?: NonAttribute<Variant[]>;
}

export function initDesign(sequelize: Sequelize): ModelStatic<Design> {
  const Bound = class extends Design {};
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      createdBy: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Design', tableName: 'designs', underscored: true },
  );
  return Bound;
}
