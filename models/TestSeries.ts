import { DataTypes, ForeignKey, InferAttributes, InferCreationAttributes, Model } from 'sequelize';
import { sequelize } from '@/lib/db';
import type { Test } from './Test';

/** A test's readings, packed: one row per test (one row per sample is ~100× slower to write). */
export class TestSeries extends Model<InferAttributes<TestSeries>, InferCreationAttributes<TestSeries>> {
  declare testId: ForeignKey<Test['id']>;
  /** Float32, little-endian, dB. */
  declare levelDb: Buffer;
  /** Float32, °C; NaN where the meter left the cell blank. */
  declare temperatureC: Buffer | null;
  /** Float64 seconds from the start, only when sampling is irregular. */
  declare timeOffsetsS: Buffer | null;
}

TestSeries.init(
  {
    testId: { type: DataTypes.INTEGER, primaryKey: true },
    levelDb: { type: DataTypes.BLOB, allowNull: false },
    temperatureC: { type: DataTypes.BLOB, allowNull: true },
    timeOffsetsS: { type: DataTypes.BLOB, allowNull: true },
  },
  { sequelize, tableName: 'test_series', timestamps: false },
);
