import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/** One shot of a show; its content lives in immutable SceneRevisions. */
export class Scene extends Model<InferAttributes<Scene>, InferCreationAttributes<Scene>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare showId: string;
  declare name: string;
  /** Used in frame file names: <scene-slug>_<frame 0000>.png */
  declare slug: string;
  declare position: CreationOptional<number>;
  declare archivedAt: Date | null;
  /** Number of the newest revision (0 before the first save). */
  declare latestRevisionNumber: CreationOptional<number>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Scene.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    showId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false, validate: { len: { args: [1, 160], msg: 'name must be 1 to 160 characters' } } },
    slug: { type: DataTypes.STRING(80), allowNull: false, validate: { is: { args: /^[a-z0-9]+(-[a-z0-9]+)*$/, msg: 'slug must be lowercase words joined by hyphens' } } },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    latestRevisionNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'scenes' },
);
