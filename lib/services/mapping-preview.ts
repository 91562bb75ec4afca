import 'server-only';
import { decimateMinMax } from '@/lib/analysis/decimate';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import { timeOffsetAt } from '@/lib/import/normalised-test';
import { AppError } from '@/lib/http/errors';
import { analyseFile } from '@/lib/pipeline/analyse-file';
import { entryBytes } from '@/lib/server/process-upload';
import { readStored } from '@/lib/server/upload-store';
import { Site, SourceFile } from '@/models';

const PREVIEW_TESTS = 3;
const PREVIEW_POINTS = 300;

const round = (v: number) => (Number.isFinite(v) ? Math.round(v * 1000) / 1000 : null);

function previewSeries(test: NormalisedTest) {
  const times = Float64Array.from({ length: test.sampleCount }, (_, i) => timeOffsetAt(test, i));
  const picked = decimateMinMax(times, test.levelDb, PREVIEW_POINTS);
  return {
    t: Array.from(picked.x, (x) => Math.round(x * 1000) / 1000),
    levelDb: Array.from(picked.y, round),
    temperatureC: test.temperatureC ? Array.from(picked.index, (i) => round(test.temperatureC![i])) : null,
  };
}

/** What a draft profile would read from one file of the upload; nothing is stored. */
export async function previewMapping(uploadId: number, fileId: number, profile: InstrumentProfile) {
  const file = await SourceFile.findByPk(fileId);
  if (!file || file.uploadId !== uploadId || file.kind === 'zip') {
    throw new AppError('invalid', 'Invalid request body.', [{ path: 'fileId', message: 'No such data file in this upload.' }]);
  }
  const site = (await Site.findByPk(file.siteId))!;
  const bytes = file.kind === 'file' ? await readStored(file.sha256) : await entryBytes(file);
  const kept: NormalisedTest[] = [];
  const result = analyseFile(bytes, {
    fileName: file.name, ...(file.entry ? { entry: file.entry } : {}), hints: file.hints ?? [], profile, timeZone: site.timeZone,
    onTest: (_analysed, test) => {
      if (kept.length < PREVIEW_TESTS) kept.push(test);
    },
  });
  return {
    refused: result.refused,
    testCount: result.tests.length,
    rowCounts: (result.rowCounts ?? null) as Record<string, number> | null,
    problems: result.problems.slice(0, 50) as unknown as Record<string, unknown>[],
    tests: (result.refused ? [] : kept).map((t, i) => ({
      tag: t.tag, role: t.role, linkedTrapTag: t.linkedTrapTag, startedAt: new Date(t.startedAt).toISOString(),
      sampleCount: t.sampleCount, sampleRateHz: t.sampleRateHz, durationS: t.durationS,
      meanLevelDb: result.tests[i]?.level.mean ?? null, series: previewSeries(t),
    })),
  };
}
