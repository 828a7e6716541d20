import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/**
 * The material and liquid library: entries with numbered revisions (draft → in review → approved | returned),
 * uploaded files kept byte for byte with their checksum, upload previews waiting for a commit, and the mail
 * outbox (a message is written in the same transaction as the decision and sent after it commits).
 * Needs `users` (0002, sign-in) and `suppliers` (0001).
 */
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  const tables = (await queryInterface.showAllTables()).map((t) => (typeof t === 'string' ? t : (t as { tableName: string }).tableName));
  if (!tables.includes('users')) {
    throw new Error('0003-library needs the users table of 0002 (sign-in); run that migration first.');
  }
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
      'library_entries',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        // Optimistic locking: every change to the entry or one of its revisions increments it.
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        head_revision_id: { type: DataTypes.INTEGER, allowNull: true },
        approved_revision_id: { type: DataTypes.INTEGER, allowNull: true },
        created_by: userRef(false),
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint('library_entries', {
      type: 'check',
      fields: ['kind'],
      where: { kind: ['fibre', 'web', 'liquid'] },
      name: 'library_entries_kind_check',
      transaction,
    });

    await queryInterface.createTable(
      'library_revisions',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        entry_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'library_entries', key: 'id' },
          onDelete: 'CASCADE',
        },
        number: { type: DataTypes.INTEGER, allowNull: false },
        state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'draft' },
        name: { type: DataTypes.STRING(200), allowNull: false },
        supplier_id: {
          type: DataTypes.INTEGER,
          allowNull: true,
          references: { model: 'suppliers', key: 'id' },
          onDelete: 'RESTRICT',
        },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        data: { type: DataTypes.JSONB, allowNull: false },
        created_by: userRef(false),
        updated_by: userRef(false),
        submitted_by: userRef(true),
        submitted_at: { type: DataTypes.DATE, allowNull: true },
        reviewed_by: userRef(true),
        reviewed_at: { type: DataTypes.DATE, allowNull: true },
        review_comment: { type: DataTypes.TEXT, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint('library_revisions', {
      type: 'check',
      fields: ['state'],
      where: { state: ['draft', 'in-review', 'approved', 'returned'] },
      name: 'library_revisions_state_check',
      transaction,
    });
    await queryInterface.addIndex('library_revisions', ['entry_id', 'number'], {
      unique: true,
      name: 'library_revisions_entry_number',
      transaction,
    });
    // At most one revision per entry that is not approved: the one being worked on or reviewed.
    await queryInterface.addIndex('library_revisions', ['entry_id'], {
      unique: true,
      name: 'library_revisions_one_open',
      where: { state: ['draft', 'in-review', 'returned'] },
      transaction,
    });
    await queryInterface.addIndex('library_revisions', ['state'], { name: 'library_revisions_state', transaction });
    for (const column of ['head_revision_id', 'approved_revision_id']) {
      await queryInterface.addConstraint('library_entries', {
        type: 'foreign key',
        fields: [column],
        references: { table: 'library_revisions', field: 'id' },
        onDelete: 'SET NULL',
        onUpdate: 'CASCADE',
        name: `library_entries_${column}_fkey`,
        transaction,
      });
    }

    await queryInterface.createTable(
      'library_files',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        purpose: { type: DataTypes.STRING(20), allowNull: false },
        file_name: { type: DataTypes.STRING(255), allowNull: false },
        media_type: { type: DataTypes.STRING(100), allowNull: false },
        size: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        encoding: { type: DataTypes.STRING(20), allowNull: false },
        delimiter: { type: DataTypes.STRING(4), allowNull: false },
        content: { type: DataTypes.BLOB, allowNull: false },
        uploaded_by: userRef(false),
        created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { transaction },
    );
    await queryInterface.addIndex('library_files', ['sha256'], { name: 'library_files_sha256', transaction });

    await queryInterface.createTable(
      'library_uploads',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        purpose: { type: DataTypes.STRING(20), allowNull: false },
        entry_id: {
          type: DataTypes.INTEGER,
          allowNull: true,
          references: { model: 'library_entries', key: 'id' },
          onDelete: 'CASCADE',
        },
        file_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          references: { model: 'library_files', key: 'id' },
          onDelete: 'CASCADE',
        },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'pending' },
        preview: { type: DataTypes.JSONB, allowNull: false },
        warnings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        created_by: userRef(false),
        expires_at: { type: DataTypes.DATE, allowNull: false },
        committed_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { transaction },
    );

    await queryInterface.createTable(
      'mail_outbox',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        to_address: { type: DataTypes.STRING(320), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        last_error: { type: DataTypes.TEXT, allowNull: true },
        next_attempt_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        sent_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { transaction },
    );
    await queryInterface.addIndex('mail_outbox', ['status', 'next_attempt_at'], { name: 'mail_outbox_due', transaction });
  });
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('mail_outbox', { transaction });
    await queryInterface.dropTable('library_uploads', { transaction });
    await queryInterface.dropTable('library_files', { transaction });
    await queryInterface.removeConstraint('library_entries', 'library_entries_head_revision_id_fkey', { transaction });
    await queryInterface.removeConstraint('library_entries', 'library_entries_approved_revision_id_fkey', { transaction });
    await queryInterface.dropTable('library_revisions', { transaction });
    await queryInterface.dropTable('library_entries', { transaction });
  });
};
