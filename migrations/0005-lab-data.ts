import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/**
 * Lab data: replicate sets and the measured wicking runs in them. A run keeps its curve in SI, the uploaded file
 * (a `library_files` row, so a proposal to the library can cite it), the web revision and liquid it used, and
 * its fit settings; fits are recomputed by wick-core, a summary is kept for lists. Needs `users` (0002) and the
 * library (0003).
 */
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  const userRef = () => ({
    type: DataTypes.INTEGER,
    allowNull: false,
    references: { model: 'users', key: 'id' },
    onDelete: 'RESTRICT',
    onUpdate: 'CASCADE',
  });
  const webRef = () => ({
    type: DataTypes.INTEGER,
    allowNull: false,
    references: { model: 'library_entries', key: 'id' },
    onDelete: 'RESTRICT',
  });
  const timestamps = {
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
  };

  await sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      'lab_sets',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        // What every run of the set shares: the web, the liquid ('built-in:<id>' or 'library:<entry id>'), the
        // orientation and the measured quantity. Replicates differ only in specimen and reading.
        web_entry_id: webRef(),
        liquid_key: { type: DataTypes.STRING(80), allowNull: false },
        liquid_name: { type: DataTypes.STRING(200), allowNull: false },
        orientation: { type: DataTypes.STRING(12), allowNull: false },
        measurement: { type: DataTypes.STRING(8), allowNull: false },
        // Web revisions created from the set's fits ({ entryId, revision, runIds, figures, … }).
        proposals: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        created_by: userRef(),
        updated_by: userRef(),
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex('lab_sets', ['web_entry_id'], { name: 'lab_sets_web', transaction });

    await queryInterface.createTable(
      'lab_runs',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        set_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'lab_sets', key: 'id' },
          onDelete: 'RESTRICT',
        },
        name: { type: DataTypes.STRING(200), allowNull: false },
        web_entry_id: webRef(),
        web_revision: { type: DataTypes.INTEGER, allowNull: false },
        // RunWeb snapshot (name, state, porosity of the pinned revision).
        web: { type: DataTypes.JSONB, allowNull: false },
        // RunLiquid: identity and properties at the run temperature, as the fits used them.
        liquid: { type: DataTypes.JSONB, allowNull: false },
        temperature: { type: DataTypes.DOUBLE, allowNull: false },
        orientation: { type: DataTypes.STRING(12), allowNull: false },
        tilt: { type: DataTypes.DOUBLE, allowNull: false },
        width: { type: DataTypes.DOUBLE, allowNull: true },
        thickness: { type: DataTypes.DOUBLE, allowNull: true },
        measurement: { type: DataTypes.STRING(8), allowNull: false },
        // The curve in SI (s; m or kg), as parsed from the file.
        times: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: false },
        readings: { type: DataTypes.ARRAY(DataTypes.DOUBLE), allowNull: false },
        time_unit: { type: DataTypes.STRING(20), allowNull: false },
        value_unit: { type: DataTypes.STRING(20), allowNull: false },
        file_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'library_files', key: 'id' },
          onDelete: 'RESTRICT',
        },
        conditions: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        measured_at: { type: DataTypes.DATEONLY, allowNull: true },
        fit: { type: DataTypes.JSONB, allowNull: false },
        // Key figures of the last fit (for lists) and the wick-core version that computed them.
        summary: { type: DataTypes.JSONB, allowNull: false },
        core_version: { type: DataTypes.STRING(20), allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        created_by: userRef(),
        updated_by: userRef(),
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addIndex('lab_runs', ['set_id'], { name: 'lab_runs_set', transaction });
    await queryInterface.addIndex('lab_runs', ['web_entry_id'], { name: 'lab_runs_web', transaction });
  });
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('lab_runs', { transaction });
    await queryInterface.dropTable('lab_sets', { transaction });
  });
};
