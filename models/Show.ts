import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/** A planetarium show: a studio's container for scenes. */
export class Show extends Model<InferAttributes<Show>, InferCreationAttributes<Show>> {
  declare id: CreationOptional<string>;
  declare studioId: string;
  declare name: string;
  declare archivedAt: Date | null;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Show.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    studioId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false, validate: { len: { args: [1, 160], msg: 'name must be 1 to 160 characters' } } },
    archivedAt: { type: DataTypes.DATE, allowNull: true },
    createdById: { type: DataTypes.UUID, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'shows' },
);
