import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { SourceFileKind, SourceFileStatus } from '@/lib/domain/vocabulary';
import type { InstrumentProfile } from './InstrumentProfile';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { Upload } from './Upload';

/**
 * One file as received (a loose file or a zip), or one entry of a zip. The bytes of received
 * files are kept by SHA-256 in the upload store; zip entries are read from their zip again.
 */
export class SourceFile extends Model<InferAttributes<SourceFile>, InferCreationAttributes<SourceFile>> {
  declare id: CreationOptional<number>;
  declare uploadId: ForeignKey<Upload['id']>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare containerId: ForeignKey<SourceFile['id']> | null;
  /** The name as the user's computer gave it: a label, never a path we write to. */
  declare name: string;
  /** For a zip entry, its name inside the zip (a label). */
  declare entry: string | null;
  declare kind: SourceFileKind;
  declare sha256: string;
  declare size: number;
  declare status: SourceFileStatus;
  declare fingerprint: CreationOptional<string | null>;
  declare profileId: ForeignKey<InstrumentProfile['id']> | null;
  declare profileRevision: CreationOptional<number | null>;
  declare detection: CreationOptional<Record<string, unknown> | null>;
  declare problems: CreationOptional<unknown[] | null>;
  declare rowCounts: CreationOptional<Record<string, number> | null>;
  declare hints: CreationOptional<string[] | null>;
  declare testCount: CreationOptional<number>;
  declare duplicateOf: ForeignKey<SourceFile['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

SourceFile.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    uploadId: { type: DataTypes.INTEGER, allowNull: false },
    siteId: { type: DataTypes.INTEGER, allowNull: false },
    surveyId: { type: DataTypes.INTEGER, allowNull: false },
    containerId: { type: DataTypes.INTEGER, allowNull: true },
    profileId: { type: DataTypes.INTEGER, allowNull: true },
    duplicateOf: { type: DataTypes.INTEGER, allowNull: true },
    name: { type: DataTypes.STRING(500), allowNull: false },
    entry: { type: DataTypes.STRING(1000), allowNull: true },
    kind: { type: DataTypes.STRING(12), allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    // PostgreSQL's driver returns int8 as text (to keep precision past 2^53); a file's size is far below that.
    size: { type: DataTypes.BIGINT, allowNull: false, get() { return Number(this.getDataValue('size')); } },
    status: { type: DataTypes.STRING(24), allowNull: false },
    fingerprint: { type: DataTypes.STRING(40), allowNull: true },
    profileRevision: { type: DataTypes.INTEGER, allowNull: true },
    detection: { type: DataTypes.JSON, allowNull: true },
    problems: { type: DataTypes.JSON, allowNull: true },
    rowCounts: { type: DataTypes.JSON, allowNull: true },
    hints: { type: DataTypes.JSON, allowNull: true },
    testCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'source_files' },
);
