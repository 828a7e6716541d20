import {
  type CreationOptional,
  DataTypes,
  type InferAttributes,
  type InferCreationAttributes,
  Model,
  type ModelStatic,
  type Sequelize,
} from 'sequelize';

/** A person who has signed in at least once. Schema: migrations/0002-users-sessions-audit.ts. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  /** Issuer and subject identify the person at the identity provider. */
  declare issuer: string;
  declare subject: string;
  declare name: string;
  declare email: CreationOptional<string>;
  /** Roles as the provider sent them at the last sign-in. */
  declare idpRoles: CreationOptional<string[]>;
  /** Administrator's overrides, added to / taken from the provider's roles. */
  declare grantedRoles: CreationOptional<string[]>;
  declare revokedRoles: CreationOptional<string[]>;
  declare lastSignInAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUser(sequelize: Sequelize): ModelStatic<User> {
  const Bound = class extends User {};
  // A fresh definition per column: Sequelize writes the column name into the object it is given.
  const roles = () => ({ type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] });
  Bound.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      issuer: { type: DataTypes.STRING(500), allowNull: false },
      subject: { type: DataTypes.STRING(255), allowNull: false },
      name: { type: DataTypes.STRING(200), allowNull: false },
      email: { type: DataTypes.STRING(320), allowNull: false, defaultValue: '' },
      idpRoles: roles(),
      grantedRoles: roles(),
      revokedRoles: roles(),
      lastSignInAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, modelName: 'User', tableName: 'users', underscored: true },
  );
  return Bound;
}
