import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';
import type { SceneSpec } from '@/lib/scenes/schema';

/**
 * An immutable snapshot of everything that defines a shot. Saving an edit
 * adds a revision; the database refuses updates to existing rows.
 */
export class SceneRevision extends Model<InferAttributes<SceneRevision>, InferCreationAttributes<SceneRevision>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare sceneId: string;
  /** 1, 2, 3 ... per scene */
  declare number: number;
  /** The revision the author started from (null for the first). */
  declare basedOnNumber: number | null;
  declare spec: SceneSpec;
  /** SHA-256 of the RFC 8785 canonical JSON of spec. */
  declare contentHash: string;
  declare message: string | null;
  declare authorId: string | null;
  declare createdAt: CreationOptional<Date>;
}

SceneRevision.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    sceneId: { type: DataTypes.UUID, allowNull: false },
    number: { type: DataTypes.INTEGER, allowNull: false },
    basedOnNumber: { type: DataTypes.INTEGER, allowNull: true },
    spec: { type: DataTypes.JSONB, allowNull: false },
    contentHash: { type: DataTypes.STRING(64), allowNull: false },
    message: { type: DataTypes.STRING(500), allowNull: true },
    authorId: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'scene_revisions', updatedAt: false },
);
