import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

export const REVIEW_STATES = ['in_review', 'approved', 'changes_requested'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/** A producer's request that advisors check one exact scene revision. */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare sceneId: string;
  declare revisionId: string;
  declare state: CreationOptional<ReviewState>;
  /** Advisors asked to review (empty: every advisor of the studio). */
  declare advisorIds: string[];
  declare message: string | null;
  declare submittedById: string | null;
  declare decidedById: string | null;
  declare decidedAt: Date | null;
  declare decisionNote: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Review.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    sceneId: { type: DataTypes.UUID, allowNull: false },
    revisionId: { type: DataTypes.UUID, allowNull: false },
    state: { type: DataTypes.ENUM(...REVIEW_STATES), allowNull: false, defaultValue: 'in_review' },
    advisorIds: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    message: { type: DataTypes.TEXT, allowNull: true },
    submittedById: { type: DataTypes.UUID, allowNull: true },
    decidedById: { type: DataTypes.UUID, allowNull: true },
    decidedAt: { type: DataTypes.DATE, allowNull: true },
    decisionNote: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'reviews' },
);
