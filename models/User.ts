import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/** A person who can sign in; belongs to studios through Membership. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare name: string;
  /** bcrypt hash; null until the person sets a password from an invitation. */
  declare passwordHash: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

User.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    email: {
      type: DataTypes.STRING(320),
      allowNull: false,
      unique: true,
      validate: { isEmail: { msg: 'email must be an e-mail address' } },
      set(value: string) {
        this.setDataValue('email', value.trim().toLowerCase());
      },
    },
    name: { type: DataTypes.STRING(120), allowNull: false, validate: { len: { args: [1, 120], msg: 'name must be 1 to 120 characters' } } },
    passwordHash: { type: DataTypes.STRING(100), allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'users' },
);
