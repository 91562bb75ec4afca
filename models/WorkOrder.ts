import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { Test } from './Test';
import type { Trap } from './Trap';
import type { User } from './User';

export const WORK_ORDER_ACTIONS = ['repair', 'replace', 'clean_strainer', 'retest'] as const;
export type WorkOrderAction = (typeof WORK_ORDER_ACTIONS)[number];
export const WORK_ORDER_STATUSES = ['open', 'scheduled', 'done', 'verified', 'reopened'] as const;
export type WorkOrderStatus = (typeof WORK_ORDER_STATUSES)[number];
export const WORK_ORDER_PRIORITIES = ['urgent', 'high', 'normal', 'low'] as const;
export type WorkOrderPriority = (typeof WORK_ORDER_PRIORITIES)[number];

/** Repair work on a failed trap, from a survey's confirmed verdict to a re-test that verifies it. */
export class WorkOrder extends Model<InferAttributes<WorkOrder>, InferCreationAttributes<WorkOrder>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare trapId: ForeignKey<Trap['id']>;
  declare verdict: string | null;
  declare action: WorkOrderAction;
  declare priority: WorkOrderPriority;
  declare priorityReason: string | null;
  declare assigneeId: ForeignKey<User['id']> | null;
  declare dueOn: string | null;
  declare status: WorkOrderStatus;
  declare lossKgPerHour: number | null;
  declare costPerYear: number | null;
  declare repairCost: number | null;
  declare notes: string | null;
  declare doneAt: Date | null;
  declare doneBy: ForeignKey<User['id']> | null;
  declare verifiedByTestId: ForeignKey<Test['id']> | null;
  declare verifiedAt: Date | null;
  declare remindedAt: Date | null;
  declare createdBy: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

WorkOrder.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    siteId: { type: DataTypes.INTEGER, allowNull: false },
    surveyId: { type: DataTypes.INTEGER, allowNull: false },
    trapId: { type: DataTypes.INTEGER, allowNull: false },
    verdict: { type: DataTypes.STRING(24), allowNull: true },
    action: { type: DataTypes.STRING(20), allowNull: false },
    priority: { type: DataTypes.STRING(10), allowNull: false },
    priorityReason: { type: DataTypes.TEXT, allowNull: true },
    assigneeId: { type: DataTypes.INTEGER, allowNull: true },
    dueOn: { type: DataTypes.DATEONLY, allowNull: true },
    status: { type: DataTypes.STRING(12), allowNull: false },
    lossKgPerHour: { type: DataTypes.FLOAT, allowNull: true },
    costPerYear: { type: DataTypes.FLOAT, allowNull: true },
    repairCost: { type: DataTypes.FLOAT, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: true },
    doneAt: { type: DataTypes.DATE, allowNull: true },
    doneBy: { type: DataTypes.INTEGER, allowNull: true },
    verifiedByTestId: { type: DataTypes.INTEGER, allowNull: true },
    verifiedAt: { type: DataTypes.DATE, allowNull: true },
    remindedAt: { type: DataTypes.DATE, allowNull: true },
    createdBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'work_orders' },
);
