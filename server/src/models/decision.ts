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
import type { ComparedFigure } from 'wick-core';
import type { User } from './user';

/** A decision taken on a comparison: the chosen variant, why, who and when. Schema: migrations/0004-designs.ts. */
export class Decision extends Model<InferAttributes<Decision>, InferCreationAttributes<Decision>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare variantIds: number[];
  declare baselineVariantId: number;
  declare chosenVariantId: number | null;
  declare chosenVariantName: string;
  declare rationale: string;
  /** The compare table at decision time. */
  declare snapshot: { readonly figures: readonly ComparedFigure[]; readonly variants: readonly { id: number; name: string }[] };
  declare decidedBy: number;
  declare decidedAt: CreationOptional<Date>;
  declare decider?: NonAttribute<User>;
}

export function initDecision(sequelize: Sequelize): ModelStatic<Decision> {
  const Bound = class extends Decision {};
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      projectId: { type: DataTypes.INTEGER, allowNull: false },
      variantIds: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
      baselineVariantId: { type: DataTypes.INTEGER, allowNull: false },
      chosenVariantId: { type: DataTypes.INTEGER, allowNull: true },
      chosenVariantName: { type: DataTypes.STRING(200), allowNull: false },
      rationale: { type: DataTypes.TEXT, allowNull: false },
      snapshot: { type: DataTypes.JSONB, allowNull: false },
      decidedBy: { type: DataTypes.INTEGER, allowNull: false },
      decidedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: 'Decision', tableName: 'decisions', underscored: true, timestamps: false },
  );
  return Bound;
}
