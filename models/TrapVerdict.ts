import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { VerdictCode } from '@/lib/analysis/verdict-codes';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { Test } from './Test';
import type { Trap } from './Trap';
import type { User } from './User';

export type VerdictState = 'confirmed' | 'overridden' | 'retest';

/** The analyst's decision on a trap in a survey: confirmed or overridden (with why), or a re-test asked for. */
export class TrapVerdict extends Model<InferAttributes<TrapVerdict>, InferCreationAttributes<TrapVerdict>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare trapId: ForeignKey<Trap['id']>;
  /** The trap-point test the decision was made on. */
  declare testId: ForeignKey<Test['id']> | null;
  declare state: VerdictState;
  /** What the analysis suggested when the decision was made. */
  declare suggested: VerdictCode | null;
  /** The verdict that counts in reports; null while a re-test is pending. */
  declare verdict: VerdictCode | null;
  declare reason: string | null;
  declare decidedBy: ForeignKey<User['id']> | null;
  declare decidedAt: Date | null;
  declare retestRequestedAt: Date | null;
  declare retestRequestedBy: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

TrapVerdict.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    siteId: { type: DataTypes.INTEGER, allowNull: false },
    surveyId: { type: DataTypes.INTEGER, allowNull: false },
    trapId: { type: DataTypes.INTEGER, allowNull: false },
    testId: { type: DataTypes.INTEGER, allowNull: true },
    state: { type: DataTypes.STRING(16), allowNull: false },
    suggested: { type: DataTypes.STRING(24), allowNull: true },
    verdict: { type: DataTypes.STRING(24), allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    decidedBy: { type: DataTypes.INTEGER, allowNull: true },
    decidedAt: { type: DataTypes.DATE, allowNull: true },
    retestRequestedAt: { type: DataTypes.DATE, allowNull: true },
    retestRequestedBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'trap_verdicts' },
);
