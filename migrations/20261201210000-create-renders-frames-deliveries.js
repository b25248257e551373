'use strict';

// Render jobs, the frames they produce (object key, checksum, readouts) and
// deliveries (frame packages for operators).
/** @param {{ context: { queryInterface: import('sequelize').QueryInterface, Sequelize: typeof import('sequelize') } }} params */
async function up({ context: { queryInterface, Sequelize } }) {
  const { DataTypes } = Sequelize;
  const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn('now') };
  const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal('gen_random_uuid()') };
  const studioRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'studios', key: 'id' }, onDelete: 'CASCADE' };
  const userRef = { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };

  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable('render_jobs', {
      id,
      studio_id: studioRef,
      scene_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'scenes', key: 'id' }, onDelete: 'CASCADE' },
      revision_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'scene_revisions', key: 'id' }, onDelete: 'CASCADE' },
      kind: { type: DataTypes.ENUM('still', 'sequence'), allowNull: false },
      status: { type: DataTypes.ENUM('queued', 'running', 'done', 'failed', 'cancelled'), allowNull: false, defaultValue: 'queued' },
      settings: { type: DataTypes.JSONB, allowNull: false },
      frame_start: { type: DataTypes.INTEGER, allowNull: false },
      frame_count: { type: DataTypes.INTEGER, allowNull: false },
      frames_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      frames_failed: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      draft: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      photosensitivity: { type: DataTypes.JSONB, allowNull: true },
      error: { type: DataTypes.TEXT, allowNull: true },
      requested_by_id: userRef,
      started_at: { type: DataTypes.DATE, allowNull: true },
      finished_at: { type: DataTypes.DATE, allowNull: true },
      created_at: now,
      updated_at: now,
    }, { transaction });
    await queryInterface.addIndex('render_jobs', ['studio_id', 'created_at'], { transaction });
    await queryInterface.addIndex('render_jobs', ['studio_id', 'status'], { transaction });

    await queryInterface.createTable('frames', {
      id,
      studio_id: studioRef,
      render_job_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'render_jobs', key: 'id' }, onDelete: 'CASCADE' },
      index: { type: DataTypes.INTEGER, allowNull: false },
      object_key: { type: DataTypes.STRING(500), allowNull: false },
      bytes: { type: DataTypes.INTEGER, allowNull: false },
      sha256: { type: DataTypes.STRING(64), allowNull: false },
      readout: { type: DataTypes.JSONB, allowNull: false },
      render_ms: { type: DataTypes.INTEGER, allowNull: false },
      worker: { type: DataTypes.STRING(120), allowNull: true },
      created_at: now,
    }, { transaction });
    // One row per frame index: a retried frame can never be recorded twice.
    await queryInterface.addIndex('frames', ['render_job_id', 'index'], { unique: true, transaction });

    await queryInterface.createTable('deliveries', {
      id,
      studio_id: studioRef,
      render_job_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: 'render_jobs', key: 'id' }, onDelete: 'CASCADE' },
      status: { type: DataTypes.ENUM('ready', 'loaded'), allowNull: false, defaultValue: 'ready' },
      manifest: { type: DataTypes.JSONB, allowNull: false },
      loaded_at: { type: DataTypes.DATE, allowNull: true },
      loaded_by_id: userRef,
      created_at: now,
      updated_at: now,
    }, { transaction });
  });
}

/** @param {{ context: { queryInterface: import('sequelize').QueryInterface } }} params */
async function down({ context: { queryInterface } }) {
  await queryInterface.sequelize.transaction(async (transaction) => {
    for (const table of ['deliveries', 'frames', 'render_jobs']) await queryInterface.dropTable(table, { transaction });
    for (const type of ['enum_render_jobs_kind', 'enum_render_jobs_status', 'enum_deliveries_status']) {
      await queryInterface.sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
}

module.exports = { up, down };
