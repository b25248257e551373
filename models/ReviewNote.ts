import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

export const NOTE_STATUSES = ['open', 'resolved', 'accepted'] as const;
export type NoteStatus = (typeof NOTE_STATUSES)[number];

/** A note pinned to a proper time on the path (and optionally a point on the frame), or a reply in its thread. */
export class ReviewNote extends Model<InferAttributes<ReviewNote>, InferCreationAttributes<ReviewNote>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare reviewId: string;
  declare parentId: string | null;
  declare authorId: string | null;
  /** Proper time on the path, M (null for replies). */
  declare tau: number | null;
  /** Point on the frame, 0..1 from the left and top (optional). */
  declare pointX: number | null;
  declare pointY: number | null;
  declare body: string;
  declare status: CreationOptional<NoteStatus>;
  declare statusChangedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

ReviewNote.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    reviewId: { type: DataTypes.UUID, allowNull: false },
    parentId: { type: DataTypes.UUID, allowNull: true },
    authorId: { type: DataTypes.UUID, allowNull: true },
    tau: { type: DataTypes.DOUBLE, allowNull: true },
    pointX: { type: DataTypes.DOUBLE, allowNull: true },
    pointY: { type: DataTypes.DOUBLE, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.ENUM(...NOTE_STATUSES), allowNull: false, defaultValue: 'open' },
    statusChangedById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'review_notes' },
);
