import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';
import type { RenderSettings } from '@/lib/renders/settings';

export const RENDER_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type RenderStatus = (typeof RENDER_STATUSES)[number];

/** A still or frame-sequence render of one scene revision. */
export class RenderJob extends Model<InferAttributes<RenderJob>, InferCreationAttributes<RenderJob>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare sceneId: string;
  declare revisionId: string;
  declare kind: 'still' | 'sequence';
  declare status: CreationOptional<RenderStatus>;
  declare settings: RenderSettings;
  declare frameStart: number;
  declare frameCount: number;
  declare framesDone: CreationOptional<number>;
  declare framesFailed: CreationOptional<number>;
  /** True until the revision is approved (Reviews); drafts never become deliveries for operators. */
  declare draft: CreationOptional<boolean>;
  declare photosensitivity: Record<string, unknown> | null;
  declare error: string | null;
  declare requestedById: string | null;
  declare startedAt: Date | null;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

RenderJob.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    sceneId: { type: DataTypes.UUID, allowNull: false },
    revisionId: { type: DataTypes.UUID, allowNull: false },
    kind: { type: DataTypes.ENUM('still', 'sequence'), allowNull: false },
    status: { type: DataTypes.ENUM(...RENDER_STATUSES), allowNull: false, defaultValue: 'queued' },
    settings: { type: DataTypes.JSONB, allowNull: false },
    frameStart: { type: DataTypes.INTEGER, allowNull: false },
    frameCount: { type: DataTypes.INTEGER, allowNull: false },
    framesDone: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    framesFailed: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    draft: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    photosensitivity: { type: DataTypes.JSONB, allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    requestedById: { type: DataTypes.UUID, allowNull: true },
    startedAt: { type: DataTypes.DATE, allowNull: true },
    finishedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'render_jobs' },
);
