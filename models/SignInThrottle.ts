import { DataTypes, Model, type InferAttributes, type InferCreationAttributes } from 'sequelize';
import { sequelize } from '@/lib/db/connection';

/**
 * Failed sign-in counts per key ("account:<email>" or "address:<ip>"), kept in
 * the database so the limit holds across every app process.
 */
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  declare key: string;
  declare failures: number;
  declare windowStartedAt: Date;
}

SignInThrottle.init(
  {
    key: { type: DataTypes.STRING(400), primaryKey: true },
    failures: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    windowStartedAt: { type: DataTypes.DATE, allowNull: false },
  },
  { sequelize, tableName: 'sign_in_throttles', timestamps: false },
);
