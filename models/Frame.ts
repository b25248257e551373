import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';
import type { FrameReadout } from '@/lib/renders/settings';

/** One rendered frame in the object store, with its checksum and physics readouts. */
export class Frame extends Model<InferAttributes<Frame>, InferCreationAttributes<Frame>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare renderJobId: string;
  declare index: number;
  declare objectKey: string;
  declare bytes: number;
  declare sha256: string;
  declare readout: FrameReadout;
  declare renderMs: number;
  declare worker: string | null;
  declare createdAt: CreationOptional<Date>;
}

Frame.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    renderJobId: { type: DataTypes.UUID, allowNull: false },
    index: { type: DataTypes.INTEGER, allowNull: false },
    objectKey: { type: DataTypes.STRING(500), allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    readout: { type: DataTypes.JSONB, allowNull: false },
    renderMs: { type: DataTypes.INTEGER, allowNull: false },
    worker: { type: DataTypes.STRING(120), allowNull: true },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'frames', updatedAt: false },
);
