import 'server-only';
import type { WhereOptions } from 'sequelize';
import { decimateMinMax } from '@/lib/analysis/decimate';
import { notFound } from '@/lib/http/errors';
import { unpackFloat32, unpackFloat64 } from '@/lib/server/series-codec';
import { Test, TestSeries } from '@/models';
import { DerivedCache, surveyRowsVersion } from './derived-cache';

function testDto(t: Test) {
  return {
    id: t.id, siteId: t.siteId, surveyId: t.surveyId, uploadId: t.uploadId, sourceFileId: t.sourceFileId, trapId: t.trapId ?? null,
    tag: t.tag, role: t.role, linkedTrapTag: t.linkedTrapTag, matchStatus: t.matchStatus, startedAt: t.startedAt.toISOString(),
    durationS: t.durationS, sampleRateHz: t.sampleRateHz, sampleCount: t.sampleCount, meanLevelDb: t.meanLevelDb,
    dutyCycle: t.dutyCycle, suggestedVerdict: t.suggestedVerdict, confidence: t.confidence, lossKgPerHour: t.lossKgPerHour,
    figures: t.figures,
  };
}
export type TestDto = ReturnType<typeof testDto>;

const LISTED = [
  'id', 'siteId', 'surveyId', 'uploadId', 'sourceFileId', 'trapId', 'tag', 'role', 'linkedTrapTag', 'matchStatus', 'startedAt',
  'durationS', 'sampleRateHz', 'sampleCount', 'meanLevelDb', 'dutyCycle', 'suggestedVerdict', 'confidence', 'lossKgPerHour',
] as const satisfies readonly (keyof Test)[];

/** A survey's totals per filter, kept while the database's count of writes to its rows stands. */
const totals = new DerivedCache<number>(64);

/** The total of a list: for a survey's tests (200,000 of them) counted once per write to them, otherwise counted. */
async function countOf(siteId: number, q: ListQuery, where: WhereOptions<Test>): Promise<number> {
  if (q.surveyId === undefined) return Test.count({ where });
  const version = await surveyRowsVersion(q.surveyId);
  return totals.get([siteId, q.surveyId, q.uploadId, q.trapId, q.role].join(':'), version, () => Test.count({ where }));
}

type ListQuery = {
  page: number; pageSize: number; surveyId?: number; uploadId?: number; trapId?: number; role?: 'trap' | 'reference'; figures: 'none' | 'full';
};

export async function listTests(siteId: number, q: ListQuery) {
  const where: WhereOptions<Test> = { siteId };
  for (const key of ['surveyId', 'uploadId', 'trapId', 'role'] as const) if (q[key] !== undefined) Object.assign(where, { [key]: q[key] });
  // The full figures are a few kilobytes a test: read only when asked for. On SQLite they sit in
  // the row before the columns added later, so only the listed columns are read.
  const attributes: string[] = q.figures === 'full' ? [...LISTED, 'figures'] : [...LISTED];
  const [rows, count] = await Promise.all([
    Test.findAll({ where, attributes, order: [['startedAt', 'ASC'], ['id', 'ASC']], limit: q.pageSize, offset: (q.page - 1) * q.pageSize }),
    countOf(siteId, q, where),
  ]);
  return { items: rows.map((t) => ({ ...testDto(t), figures: q.figures === 'full' ? t.figures : null })), total: count, page: q.page, pageSize: q.pageSize };
}

export async function siteIdOfTest(testId: number): Promise<number | null> {
  return (await Test.findByPk(testId, { attributes: ['siteId'] }))?.siteId ?? null;
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? Math.round(v * 1000) / 1000 : null);

/**
 * A test's readings for the plot: min/max per bucket over the whole test, or over a window
 * (every reading when the window holds few enough). Temperature is taken at the same readings.
 */
export async function getSeries(testId: number, q: { points: number; from?: number; to?: number }) {
  const test = await Test.findByPk(testId);
  const series = await TestSeries.findByPk(testId);
  if (!test || !series) throw notFound('test');
  const level = unpackFloat32(series.levelDb);
  const temperature = series.temperatureC ? unpackFloat32(series.temperatureC) : null;
  const n = level.length;
  const times = series.timeOffsetsS ? unpackFloat64(series.timeOffsetsS) : Float64Array.from({ length: n }, (_, i) => i / test.sampleRateHz);
  let start = 0;
  let end = n;
  if (q.from !== undefined || q.to !== undefined) {
    const from = q.from ?? 0;
    const to = q.to ?? Infinity;
    while (start < n && times[start] < from) start++;
    end = start;
    while (end < n && times[end] <= to) end++;
  }
  const windowTimes = times.subarray(start, end);
  const windowLevel = level.subarray(start, end);
  const picked = decimateMinMax(windowTimes, windowLevel, q.points);
  const decimated = picked.index.length < windowLevel.length;
  return {
    testId, startedAt: test.startedAt.toISOString(), sampleCount: n, decimated,
    t: Array.from(picked.x, (x) => Math.round(x * 1e4) / 1e4),
    levelDb: Array.from(picked.y, finiteOrNull),
    temperatureC: temperature ? Array.from(picked.index, (i) => finiteOrNull(temperature[start + i])) : null,
  };
}
