import {
  CreationOptional, DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model,
} from 'sequelize';
import { sequelize } from '@/lib/db';
import type { MatchStatus, TestRole } from '@/lib/domain/vocabulary';
import type { SourceFile } from './SourceFile';
import type { Site } from './Site';
import type { Survey } from './Survey';
import type { Trap } from './Trap';
import type { Upload } from './Upload';

/** One probe placement on one point (a trap, or the pipe beside it), with its figures. */
export class Test extends Model<InferAttributes<Test>, InferCreationAttributes<Test>> {
  declare id: CreationOptional<number>;
  declare siteId: ForeignKey<Site['id']>;
  declare surveyId: ForeignKey<Survey['id']>;
  declare uploadId: ForeignKey<Upload['id']>;
  declare sourceFileId: ForeignKey<SourceFile['id']>;
  /** Null until the tag is matched to the register (held back in the wizard's tag step). */
  declare trapId: ForeignKey<Trap['id']> | null;
  declare tag: string;
  declare role: TestRole;
  declare linkedTrapTag: string | null;
  declare matchStatus: MatchStatus;
  declare startedAt: Date;
  declare durationS: number;
  declare sampleRateHz: number;
  declare sampleCount: number;
  declare firstLine: number | null;
  declare lastLine: number | null;
  declare meanLevelDb: number | null;
  declare dutyCycle: number | null;
  declare suggestedVerdict: string | null;
  declare confidence: string | null;
  declare lossKgPerHour: number | null;
  /** The analysis's loss mode for the suggestion (blow_through, leaking, rapid_cycling), or null. */
  declare lossMode: CreationOptional<string | null>;
  /** The full figures and the parameters that produced them, so a re-run is reproducible. */
  declare figures: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

Test.init(
  {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    siteId: { type: DataTypes.INTEGER, allowNull: false },
    surveyId: { type: DataTypes.INTEGER, allowNull: false },
    uploadId: { type: DataTypes.INTEGER, allowNull: false },
    sourceFileId: { type: DataTypes.INTEGER, allowNull: false },
    trapId: { type: DataTypes.INTEGER, allowNull: true },
    tag: { type: DataTypes.STRING(80), allowNull: false },
    role: { type: DataTypes.STRING(12), allowNull: false },
    linkedTrapTag: { type: DataTypes.STRING(80), allowNull: true },
    matchStatus: { type: DataTypes.STRING(12), allowNull: false },
    startedAt: { type: DataTypes.DATE, allowNull: false },
    durationS: { type: DataTypes.FLOAT, allowNull: false },
    sampleRateHz: { type: DataTypes.FLOAT, allowNull: false },
    sampleCount: { type: DataTypes.INTEGER, allowNull: false },
    firstLine: { type: DataTypes.INTEGER, allowNull: true },
    lastLine: { type: DataTypes.INTEGER, allowNull: true },
    meanLevelDb: { type: DataTypes.FLOAT, allowNull: true },
    dutyCycle: { type: DataTypes.FLOAT, allowNull: true },
    suggestedVerdict: { type: DataTypes.STRING(24), allowNull: true },
    confidence: { type: DataTypes.STRING(8), allowNull: true },
    lossKgPerHour: { type: DataTypes.FLOAT, allowNull: true },
    lossMode: { type: DataTypes.STRING(16), allowNull: true },
    figures: { type: DataTypes.JSON, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  },
  { sequelize, tableName: 'tests' },
);
