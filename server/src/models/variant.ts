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
import type { AnyVariantConfiguration, AnyVariantInputs, AnyVariantOptions, AnyVariantResults, PinnedMaterial } from 'wick-core';
import type { Design } from './design';

/**
 * A saved variant: its inputs, the options and wick-core version it was evaluated with, and the results the
 * server computed (the record). Schema: migrations/0004-designs.ts.
 */
export class Variant extends Model<InferAttributes<Variant>, InferCreationAttributes<Variant>> {
  declare id: CreationOptional<number>;
  declare designId: number;
  declare name: string;
  declare notes: CreationOptional<string>;
  /** A single-layer configuration or 'stack'. */
  declare configuration: AnyVariantConfiguration;
  declare inputs: AnyVariantInputs;
  declare options: AnyVariantOptions;
  declare results: AnyVariantResults;
  declare coreVersion: string;
  /** Pinned library revisions as saved (state at save time). */
  declare materials: CreationOptional<PinnedMaterial[]>;
  /** Optimistic locking. */
  declare version: CreationOptional<number>;
  declare createdBy: number;
  declare updatedBy: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare design?: NonAttribute<Design>;
}

export function initVariant(sequelize: Sequelize): ModelStatic<Variant> {
  const Bound = class extends Variant {};
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      designId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      configuration: { type: DataTypes.STRING(20), allowNull: false },
      inputs: { type: DataTypes.JSONB, allowNull: false },
      options: { type: DataTypes.JSONB, allowNull: false },
      results: { type: DataTypes.JSONB, allowNull: false },
      coreVersion: { type: DataTypes.STRING(20), allowNull: false },
      materials: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdBy: { type: DataTypes.INTEGER, allowNull: false },
      updatedBy: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'Variant', tableName: 'variants', underscored: true },
  );
  return Bound;
}
