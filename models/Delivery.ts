import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';
import type { DeliveryManifest } from '@/lib/renders/manifest';

/** A finished sequence packaged for show operators. */
export class Delivery extends Model<InferAttributes<Delivery>, InferCreationAttributes<Delivery>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare renderJobId: string;
  declare status: CreationOptional<'ready' | 'loaded'>;
  declare manifest: DeliveryManifest;
  declare loadedAt: Date | null;
  declare loadedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Delivery.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    renderJobId: { type: DataTypes.UUID, allowNull: false },
    status: { type: DataTypes.ENUM('ready', 'loaded'), allowNull: false, defaultValue: 'ready' },
    manifest: { type: DataTypes.JSONB, allowNull: false },
    loadedAt: { type: DataTypes.DATE, allowNull: true },
    loadedById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'deliveries' },
);
