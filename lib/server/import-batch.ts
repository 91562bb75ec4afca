import 'server-only';
import { QueryTypes, type InferAttributes } from 'sequelize';
import { sequelize, writeTransaction } from '@/lib/db';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import type { AnalysedTest } from '@/lib/pipeline/analysed-test';
import { testJson } from '@/lib/pipeline/test-json';
import { tagKey } from '@/lib/pipeline/trap-register';
import { SourceFile, Test, TestSeries, Upload } from '@/models';
import { packFloat32, packFloat64 } from './series-codec';
import { assertStillHeld } from './upload-claim';

// The import's writes, several files to a transaction. A transaction costs more than the
// statements in it (SQLite opens a connection for each), and on a day of small files one per
// file cost more than reading them. A batch still lands whole or not at all, so every file
// in it does too; files not yet written are still 'pending' and are read again after a crash.

/** What one file's import writes: its row's new state, and its tests with their series. */
export interface FileOutcome {
  file: SourceFile;
  changes: Partial<InferAttributes<SourceFile>>;
  tests: { analysed: AnalysedTest; test: NormalisedTest }[];
}

/** A batch is written once it holds this many files or samples, or is this old. */
const LIMITS = { files: 100, samples: 500_000, ageMs: 1_000 };

export interface ImportBatch {
  /** Queues a file's outcome, writing the batch when it is full or old enough. */
  add(outcome: FileOutcome): Promise<void>;
  /** Writes whatever is queued, and returns once every batch is written. */
  flush(): Promise<void>;
}

/** A stored test's analysis, with its figures as written (to tell whether settling changed them). */
export interface StoredAnalysis {
  analysed: AnalysedTest;
  figuresJson: string;
}

export interface BatchTarget {
  upload: Upload;
  trapIdByTag: Map<string, number>;
  /** Told the stored id of each test written, for settling reference checks afterwards. */
  onStored: (testId: number, stored: StoredAnalysis) => void;
}

export function createImportBatch(target: BatchTarget): ImportBatch {
  let queued: FileOutcome[] = [];
  let samples = 0;
  let since = Date.now();
  // The batch being written: SQLite works on it in the thread pool while the next files are
  // read and analysed here. One at a time; its failure surfaces at the next add or flush.
  let writing: Promise<void> | null = null;

  const startWriting = async () => {
    if (writing) await writing;
    const batch = queued;
    queued = [];
    samples = 0;
    since = Date.now();
    writing = batch.length ? write(target, batch) : null;
    writing?.catch(() => undefined); // awaited in its turn; not an unhandled rejection meanwhile
  };

  return {
    async add(outcome) {
      queued.push(outcome);
      for (const t of outcome.tests) samples += t.test.sampleCount;
      if (queued.length >= LIMITS.files || samples >= LIMITS.samples || Date.now() - since >= LIMITS.ageMs) await startWriting();
    },
    async flush() {
      await startWriting();
      if (writing) await writing;
      writing = null;
    },
  };
}

/** The figures a test row keeps: the summary columns, and the full figures with their parameters. */
export function testColumns(analysed: AnalysedTest) {
  const json = testJson(analysed);
  return {
    meanLevelDb: json.level.meanDb, dutyCycle: json.cycles.dutyCycle, suggestedVerdict: json.verdict.suggested,
    confidence: json.verdict.confidence, lossKgPerHour: json.loss.kgPerHour, lossMode: json.loss.lossMode,
    figures: { ...json, params: analysed.analysis?.params ?? null } as unknown as Record<string, unknown>,
  };
}

const SERIES_TABLE = TestSeries.getTableName() as string;
const SERIES_COLUMNS = (['testId', 'levelDb', 'temperatureC', 'timeOffsetsS'] as const).map((a) => TestSeries.getAttributes()[a].field).join(', ');

async function write(target: BatchTarget, batch: FileOutcome[]) {
  const stored = batch.flatMap((o) => o.tests.map((t) => ({ file: o.file, ...t, columns: testColumns(t.analysed) })));
  const rows = await writeTransaction(async (transaction) => {
    // Nothing of an upload another instance has taken over (lib/server/upload-claim.ts).
    await assertStillHeld(target.upload.id, transaction);
    // A file read again replaces the tests of its earlier run.
    await Test.destroy({ where: { sourceFileId: batch.map((o) => o.file.id) }, transaction });
    const rows = stored.length === 0 ? [] : await Test.bulkCreate(stored.map(({ file, analysed, test, columns }) => {
      const trapTag = test.role === 'trap' ? test.tag : test.linkedTrapTag;
      const trapId = trapTag ? target.trapIdByTag.get(tagKey(trapTag)) ?? null : null;
      return {
        siteId: file.siteId, surveyId: file.surveyId, uploadId: file.uploadId, sourceFileId: file.id, trapId,
        tag: test.tag, role: test.role, linkedTrapTag: analysed.linkedTrapTag, matchStatus: trapId ? 'matched' as const : 'unmatched' as const,
        startedAt: new Date(test.startedAt), durationS: test.durationS, sampleRateHz: test.sampleRateHz, sampleCount: test.sampleCount,
        firstLine: test.source.firstLine, lastLine: test.source.lastLine, ...columns,
      };
    }), { transaction });
    // The blobs as bound parameters, in one statement per 100 series: Sequelize's bulk insert
    // writes them into the SQL text as hexadecimal (twice their size), one insert per series
    // pays the statement's cost each time.
    for (let from = 0; from < rows.length; from += 100) {
      const part = rows.slice(from, from + 100);
      const bind = part.flatMap((row, i) => {
        const { test } = stored[from + i];
        return [row.id, packFloat32(test.levelDb), test.temperatureC ? packFloat32(test.temperatureC) : null, test.timeOffsetsS ? packFloat64(test.timeOffsetsS) : null];
      });
      const values = part.map((_, i) => `(${[1, 2, 3, 4].map((k) => `$${4 * i + k}`).join(', ')})`).join(', ');
      await sequelize.query(`INSERT INTO ${SERIES_TABLE} (${SERIES_COLUMNS}) VALUES ${values}`, { bind, transaction, type: QueryTypes.INSERT });
    }
    // The files' new states, one statement for all files that changed the same fields (an
    // upsert on rows that are there); fields a file did not change are left as they are.
    const byFields = new Map<string, FileOutcome[]>();
    for (const o of batch) {
      const k = Object.keys(o.changes).sort().join(',');
      byFields.set(k, [...(byFields.get(k) ?? []), o]);
    }
    for (const [fields, group] of byFields) {
      await SourceFile.bulkCreate(group.map((o) => ({ ...o.file.get({ plain: true }), ...o.changes })), {
        updateOnDuplicate: [...(fields.split(',') as (keyof InferAttributes<SourceFile>)[]), 'updatedAt'], transaction,
      });
    }
    await target.upload.increment({
      filesDone: batch.length, testCount: stored.length, sampleCount: stored.reduce((s, t) => s + t.test.sampleCount, 0),
    }, { transaction });
    return rows;
  });
  rows.forEach((row, i) => target.onStored(row.id, { analysed: stored[i].analysed, figuresJson: JSON.stringify(stored[i].columns.figures) }));
}
