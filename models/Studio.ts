import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/** A production team; everything else belongs to exactly one studio. */
export class Studio extends Model<InferAttributes<Studio>, InferCreationAttributes<Studio>> {
  declare id: CreationOptional<string>;
  declare name: string;
  /** URL segment, e.g. "saltmarsh-dome". */
  declare slug: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Studio.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, validate: { len: { args: [1, 120], msg: 'name must be 1 to 120 characters' } } },
    slug: {
      type: DataTypes.STRING(60),
      allowNull: false,
      unique: true,
      validate: { is: { args: /^[a-z0-9]+(-[a-z0-9]+)*$/, msg: 'slug must be lowercase words joined by hyphens' } },
    },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'studios' },
);
