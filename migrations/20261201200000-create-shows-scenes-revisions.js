'use strict';

// Shows, scenes and immutable scene revisions (content-hashed JSON specs).
/** @param {{ context: { queryInterface: import('sequelize').QueryInterface, Sequelize: typeof import('sequelize') } }} params */
async function up({ context: { queryInterface, Sequelize } }) {
  const { DataTypes } = Sequelize;
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
  const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
  const studioRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' };
  const userRef = { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };

  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable('shows', {
      id,
      studio_id: studioRef,
      name: { type: DataTypes.STRING(160), allowNull: false },
      archived_at: { type: DataTypes.DATE, allowNull: true },
      created_by_id: userRef,
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('shows', ['studio_id', 'name'], { transaction });

    await queryInterface.createTable('scenes', {
      id,
      studio_id: studioRef,
      show_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'shows', key: 'id' }, onDelete: 'CASCADE' },
      name: { type: DataTypes.STRING(160), allowNull: false },
      slug: { type: DataTypes.STRING(80), allowNull: false },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      archived_at: { type: DataTypes.DATE, allowNull: true },
      latest_revision_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      created_by_id: userRef,
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('scenes', ['show_id', 'slug'], { unique: true, transaction });

    await queryInterface.createTable('scene_revisions', {
      id,
      studio_id: studioRef,
      scene_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'scenes', key: 'id' }, onDelete: 'CASCADE' },
      number: { type: DataTypes.INTEGER, allowNull: false },
      based_on_number: { type: DataTypes.INTEGER, allowNull: true },
      spec: { type: DataTypes.JSONB, allowNull: false },
      content_hash: { type: DataTypes.STRING(64), allowNull: false },
      message: { type: DataTypes.STRING(500), allowNull: true },
      author_id: userRef,
      created_at: now,
    }, { transaction });
    await queryInterface.addIndex('scene_revisions', ['scene_id', 'number'], { unique: true, transaction });
    await queryInterface.addIndex('scene_revisions', ['content_hash'], { transaction });
    // Revisions are immutable: the database itself refuses updates.
    await queryInterface.sequelize.query(`
      CREATE FUNCTION scene_revisions_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'scene revisions are immutable; save a new revision instead'; END $$;
      CREATE TRIGGER scene_revisions_no_update BEFORE UPDATE ON scene_revisions
        FOR EACH ROW EXECUTE FUNCTION scene_revisions_immutable();`, { transaction });
  });
}

/** @param {{ context: { queryInterface: import('sequelize').QueryInterface } }} params */
async function down({ context: { queryInterface } }) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('scene_revisions', { transaction });
    await queryInterface.sequelize.query('DROP FUNCTION IF EXISTS scene_revisions_immutable()', { transaction });
    await queryInterface.dropTable('scenes', { transaction });
    await queryInterface.dropTable('shows', { transaction });
  });
}

module.exports = { up, down };
