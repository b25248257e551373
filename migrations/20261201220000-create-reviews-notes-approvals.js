'use strict';

// Advisor reviews of exact scene revisions, their time-pinned note threads,
// and immutable approvals bound to a revision's content hash.
/** @param {{ context: { queryInterface: import('sequelize').QueryInterface, Sequelize: typeof import('sequelize') } }} params */
async function up({ context: { queryInterface, Sequelize } }) {
  const { DataTypes } = Sequelize;
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
  const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
  const studioRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' };
  const userRef = { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };
  const sceneRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'scenes', key: 'id' }, onDelete: 'CASCADE' };
  const revisionRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'scene_revisions', key: 'id' }, onDelete: 'CASCADE' };

  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable('reviews', {
      id,
      studio_id: studioRef,
      scene_id: sceneRef,
      revision_id: revisionRef,
      state: { type: DataTypes.ENUM('in_review', 'approved', 'changes_requested'), allowNull: false, defaultValue: 'in_review' },
      advisor_ids: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      message: { type: DataTypes.TEXT, allowNull: true },
      submitted_by_id: userRef,
      decided_by_id: userRef,
      decided_at: { type: DataTypes.DATE, allowNull: true },
      decision_note: { type: DataTypes.TEXT, allowNull: true },
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('reviews', ['studio_id', 'state'], { transaction });
    // At most one open review per revision.
    await queryInterface.addIndex('reviews', ['revision_id'], { unique: true, where: { state: 'in_review' }, name: 'reviews_one_open_per_revision', transaction });

    await queryInterface.createTable('review_notes', {
      id,
      studio_id: studioRef,
      review_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'reviews', key: 'id' }, onDelete: 'CASCADE' },
      parent_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'review_notes', key: 'id' }, onDelete: 'CASCADE' },
      author_id: userRef,
      tau: { type: DataTypes.DOUBLE, allowNull: true },
      point_x: { type: DataTypes.DOUBLE, allowNull: true },
      point_y: { type: DataTypes.DOUBLE, allowNull: true },
      body: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.ENUM('open', 'resolved', 'accepted'), allowNull: false, defaultValue: 'open' },
      status_changed_by_id: userRef,
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('review_notes', ['review_id', 'created_at'], { transaction });

    await queryInterface.createTable('approvals', {
      id,
      studio_id: studioRef,
      scene_id: sceneRef,
      revision_id: revisionRef,
      review_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'reviews', key: 'id' }, onDelete: 'CASCADE' },
      content_hash: { type: DataTypes.STRING(64), allowNull: false },
      approved_by_id: userRef,
      created_at: now,
    }, { transaction });
    await queryInterface.addIndex('approvals', ['revision_id'], { unique: true, transaction });
    await queryInterface.sequelize.query(`
      CREATE FUNCTION approvals_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'approvals are immutable'; END $$;
      CREATE TRIGGER approvals_no_update BEFORE UPDATE ON approvals
        FOR EACH ROW EXECUTE FUNCTION approvals_immutable();`, { transaction });
  });
}

/** @param {{ context: { queryInterface: import('sequelize').QueryInterface } }} params */
async function down({ context: { queryInterface } }) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable('approvals', { transaction });
    await queryInterface.sequelize.query('DROP FUNCTION IF EXISTS approvals_immutable()', { transaction });
    await queryInterface.dropTable('review_notes', { transaction });
    await queryInterface.dropTable('reviews', { transaction });
    for (const type of ['enum_reviews_state', 'enum_review_notes_status']) {
      await queryInterface.sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
}

module.exports = { up, down };
