import { DataTypes } from 'sequelize';
import type { Migration } from './umzug';

/**
 * Sign-in: people as last seen at the identity provider (with the administrator's role overrides), the session
 * store of connect-pg-simple (created here, never by the library), and the audit log.
 */
export const up: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      'users',
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        issuer: { type: DataTypes.STRING(500), allowNull: false },
        subject: { type: DataTypes.STRING(255), allowNull: false },
        name: { type: DataTypes.STRING(200), allowNull: false },
        email: { type: DataTypes.STRING(320), allowNull: false, defaultValue: '' },
        // Roles as the provider sent them at the last sign-in.
        idp_roles: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
        // An administrator's overrides: added to, or taken from, the provider's roles.
        granted_roles: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
        revoked_roles: { type: DataTypes.ARRAY(DataTypes.STRING(40)), allowNull: false, defaultValue: [] },
        last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { transaction },
    );
    await queryInterface.addIndex('users', ['issuer', 'subject'], { unique: true, name: 'users_issuer_subject', transaction });

    // The layout connect-pg-simple expects (its table.sql), with a time zone on the expiry.
    await queryInterface.createTable(
      'sessions',
      {
        sid: { type: DataTypes.STRING, primaryKey: true },
        sess: { type: DataTypes.JSON, allowNull: false },
        expire: { type: DataTypes.DATE(6), allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addIndex('sessions', ['expire'], { name: 'sessions_expire', transaction });

    await queryInterface.createTable(
      'audit_log',
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        actor_id: {
          type: DataTypes.INTEGER,
          allowNull: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'SET NULL',
          onUpdate: 'CASCADE',
        },
        action: { type: DataTypes.STRING(40), allowNull: false },
        entity_type: { type: DataTypes.STRING(60), allowNull: false },
        entity_id: { type: DataTypes.STRING(100), allowNull: true },
        details: { type: DataTypes.JSONB, allowNull: true },
      },
      { transaction },
    );
    await queryInterface.addIndex('audit_log', ['at'], { name: 'audit_log_at', transaction });
    await queryInterface.addIndex('audit_log', ['actor_id', 'at'], { name: 'audit_log_actor', transaction });
    await queryInterface.addIndex('audit_log', ['entity_type', 'entity_id'], { name: 'audit_log_entity', transaction });
    await queryInterface.addIndex('audit_log', ['action', 'at'], { name: 'audit_log_action', transaction });
  });
};

export const down: Migration = async ({ context: { queryInterface, sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('audit_log', { transaction });
    await queryInterface.dropTable('sessions', { transaction });
    await queryInterface.dropTable('users', { transaction });
  });
};
