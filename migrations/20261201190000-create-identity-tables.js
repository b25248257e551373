'use strict';

// Users, studios, memberships, invitations, e-mail records, audit events and
// sign-in throttles: the foundation every later table refers to.
/** @param {{ context: { queryInterface: import('sequelize').QueryInterface, Sequelize: typeof import('sequelize') } }} params */
async function up({ context: { queryInterface, Sequelize } }) {
  const { DataTypes } = Sequelize;
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
  const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
  const roles = ['operator', 'advisor', 'producer', 'admin'];

  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable('users', {
      id,
      email: { type: DataTypes.STRING(320), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: true },
      created_at: now,
      updated_at: now,
    }, { transaction });

    await queryInterface.createTable('studios', {
      id,
      name: { type: DataTypes.STRING(120), allowNull: false },
      slug: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      created_at: now,
      updated_at: now,
    }, { transaction });

    await queryInterface.createTable('memberships', {
      id,
      user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
      studio_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('memberships', ['user_id', 'studio_id'], { unique: true, transaction });
    await queryInterface.addIndex('memberships', ['studio_id', 'role'], { transaction });

    await queryInterface.createTable('invitations', {
      id,
      studio_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      invited_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      email: { type: DataTypes.STRING(320), allowNull: false },
      role: { type: DataTypes.ENUM(...roles), allowNull: false },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      accepted_at: { type: DataTypes.DATE, allowNull: true },
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('invitations', ['studio_id', 'email'], { transaction });

    await queryInterface.createTable('email_messages', {
      id,
      studio_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      kind: { type: DataTypes.STRING(60), allowNull: false },
      to_address: { type: DataTypes.STRING(320), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text_body: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.ENUM('sending', 'sent', 'failed'), allowNull: false, defaultValue: 'sending' },
      error: { type: DataTypes.TEXT, allowNull: true },
      provider_message_id: { type: DataTypes.STRING(300), allowNull: true },
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('email_messages', ['studio_id', 'created_at'], { transaction });

    await queryInterface.createTable('audit_events', {
      id,
      studio_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' },
      actor_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      action: { type: DataTypes.STRING(80), allowNull: false },
      target_type: { type: DataTypes.STRING(60), allowNull: true },
      target_id: { type: DataTypes.STRING(80), allowNull: true },
      data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      created_at: now,
    }, { transaction });
    await queryInterface.addIndex('audit_events', ['studio_id', 'created_at'], { transaction });

    await queryInterface.createTable('sign_in_throttles', {
      key: { type: DataTypes.STRING(400), primaryKey: true },
      failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      window_started_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction });
  });
}

/** @param {{ context: { queryInterface: import('sequelize').QueryInterface } }} params */
async function down({ context: { queryInterface } }) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    for (const table of ['sign_in_throttles', 'audit_events', 'email_messages', 'invitations', 'memberships', 'studios', 'users']) {
      await queryInterface.dropTable(table, { transaction });
    }
    for (const type of ['enum_memberships_role', 'enum_invitations_role', 'enum_email_messages_status']) {
      await queryInterface.sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
}

module.exports = { up, down };
