import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/** An advisor's sign-off of one exact revision, bound to its content hash; immutable. */
export class Approval extends Model<InferAttributes<Approval>, InferCreationAttributes<Approval>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare sceneId: string;
  declare revisionId: string;
  declare reviewId: string;
  declare contentHash: string;
  declare approvedById: string | null;
  declare createdAt: CreationOptional<Date>;
}

Approval.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    sceneId: { type: DataTypes.UUID, allowNull: false },
    revisionId: { type: DataTypes.UUID, allowNull: false },
    reviewId: { type: DataTypes.UUID, allowNull: false },
    contentHash: { type: DataTypes.STRING(64), allowNull: false },
    approvedById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'approvals', updatedAt: false },
);
