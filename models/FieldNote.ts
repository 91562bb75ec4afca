import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { Test } from './Test';
import type { Trap } from './Trap';
import type { User } from './User';

export const FIELD_NOTE_KINDS = ['not_reachable', 'line_out_of_service', 'insulation_missing', 'photo', 'remark'] as const;
export type FieldNoteKind = (typeof FIELD_NOTE_KINDS)[number];

/** A technician's note on a trap in a survey (optionally on one test), with an optional photo kept by hash. */
export class FieldNote extends Model<InferAttributes<FieldNote>, InferCreationAttributes<FieldNote>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare trapId: ForeignKey<Trap['id']>;
  declare testId: ForeignKey<Test['id']> | null;
  declare kind: FieldNoteKind;
  declare text: string | null;
  declare photoSha256: string | null;
  declare photoType: string | null;
  declare createdBy: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

FieldNote.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    siteId: { type: DataTypes.INTEGER, allowNull: false },
    surveyId: { type: DataTypes.INTEGER, allowNull: false },
    trapId: { type: DataTypes.INTEGER, allowNull: false },
    testId: { type: DataTypes.INTEGER, allowNull: true },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: true },
    photoSha256: { type: DataTypes.STRING(64), allowNull: true },
    photoType: { type: DataTypes.STRING(40), allowNull: true },
    createdBy: { type: DataTypes.INTEGER, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'field_notes' },
);
