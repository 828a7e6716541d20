import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/** Suppliers of fibres, webs and liquids; referenced by library entries. */
export const up: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.createTable('suppliers', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    country: { type: DataTypes.STRING(100), allowNull: true },
    supplies: { type: DataTypes.STRING(300), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  });
};

export const down: Migration = async ({ context: { queryInterface } }) => {
  await queryInterface.dropTable('suppliers');
};
