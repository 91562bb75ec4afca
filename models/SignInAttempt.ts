import {
  CreationOptional, DataTypes, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';

/** Every sign-in attempt, kept for throttling and for the record. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare ip: string | null;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;
}

SignInAttempt.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    email: { type: DataTypes.STRING(254), allowNull: false },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
    createdAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'sign_in_attempts', updatedAt: false },
);
