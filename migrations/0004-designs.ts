import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/**
 * The design workspace: projects (product programmes) → designs → variants, and the decisions taken by
 * comparing variants. A variant keeps its inputs, the wick-core version and the results computed on the server
 * (the record). Needs `users` (0002, sign-in).
 */
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  const userRef = (allowNull: boolean) => ({
    type: DataTypes.INTEGER,
    allowNull,
    references: { model: 'users', key: 'id' },
    onDelete: 'RESTRICT',
    onUpdate: 'CASCADE',
  });
  const timestamps = {
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  };

  await sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      'projects',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        created_by: userRef(false),
        ...timestamps,
      },
      { transaction },
    );

    await queryInterface.createTable(
      'designs',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        project_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'projects', key: 'id' },
          onDelete: 'CASCADE',
        },
        name: { type: DataTypes.STRING(200), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        created_by: userRef(false),
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex('designs', ['project_id', 'name'], { unique: true, name: 'designs_project_name', transaction });

    await queryInterface.createTable(
      'variants',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        design_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'designs', key: 'id' },
          onDelete: 'CASCADE',
        },
        name: { type: DataTypes.STRING(200), allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        configuration: { type: DataTypes.STRING(20), allowNull: false },
        inputs: { type: DataTypes.JSONB, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: false },
        results: { type: DataTypes.JSONB, allowNull: false },
        core_version: { type: DataTypes.STRING(20), allowNull: false },
        // Pinned library revisions ({ kind, id, revision, name, state }), for the unapproved marking and banners.
        materials: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        // Optimistic locking: a stale save gets 409.
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        created_by: userRef(false),
        updated_by: userRef(false),
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex('variants', ['design_id'], { name: 'variants_design', transaction });
    await queryInterface.addIndex('variants', ['design_id', 'name'], { unique: true, name: 'variants_design_name', transaction });

    await queryInterface.createTable(
      'decisions',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        project_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'projects', key: 'id' },
          onDelete: 'CASCADE',
        },
        // The compared variants in the order shown; ids of variants deleted later stay as history.
        variant_ids: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        baseline_variant_id: { type: DataTypes.INTEGER, allowNull: false },
        chosen_variant_id: {
          type: DataTypes.INTEGER,
          allowNull: true,
          references: { model: 'variants', key: 'id' },
          onDelete: 'SET NULL',
        },
        chosen_variant_name: { type: DataTypes.STRING(200), allowNull: false },
        rationale: { type: DataTypes.TEXT, allowNull: false },
        // The key-figure table as it stood when the decision was taken.
        snapshot: { type: DataTypes.JSONB, allowNull: false },
        decided_by: userRef(false),
        decided_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { transaction },
    );
    await queryInterface.addIndex('decisions', ['project_id', 'decided_at'], { name: 'decisions_project', transaction });
  });
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('decisions', { transaction });
    await queryInterface.dropTable('variants', { transaction });
    await queryInterface.dropTable('designs', { transaction });
    await queryInterface.dropTable('projects', { transaction });
  });
};
