import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute } from 'sequelize';
import { sequelize } from '@/lib/db/connection';
import { ROLES, type Role } from '@/lib/auth/roles';
import type { User } from './User';
import type { Studio } from './Studio';

/** A person's role in one studio. */
export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare studioId: string;
  declare role: Role;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User>;
  declare studio?: NonAttribute<Studio>;
}

Membership.init(
  {
    id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
    userId: { type: DataTypes.UUID, allowNull: false },
    studioId: { type: DataTypes.UUID, allowNull: false },
    role: {
      type: DataTypes.ENUM(...ROLES),
      allowNull: false,
      validate: { isIn: { args: [ROLES as unknown as string[]], msg: `role must be one of ${ROLES.join(', ')}` } },
    },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'memberships' },
);
