import 'server-only';
import { createHash } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { writeTransaction } from '@/lib/db';
import { DETECT_SAMPLE_BYTES, detectLayout, type LayoutDetection } from '@/lib/import/detect-layout';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import { readZip } from '@/lib/import/zip-read';
import { measureTest, type AnalysedTest } from '@/lib/pipeline/analysed-test';
import { analyseFile } from '@/lib/pipeline/analyse-file';
import { settleTests } from '@/lib/pipeline/settle';
import { testJson } from '@/lib/pipeline/test-json';
import { registerFromTraps, tagKey, type TrapRegister } from '@/lib/pipeline/trap-register';
import { FieldNote, InstrumentProfile, Site, SourceFile, Test, TestSeries, Trap, Upload } from '@/models';
import { settleWorkOrdersAfterUpload } from '@/lib/services/work-orders';
import { packFloat32, packFloat64, unpackFloat32, unpackFloat64 } from './series-codec';
import { analysisParamsFor } from './analysis-params';
import { uploadLimits } from './upload-limits';
import { readStored } from './upload-store';

type Context = {
  upload: Upload;
  site: Site;
  register: TrapRegister;
  trapIdByTag: Map<string, number>;
  /** Analysed tests of this run by test id, for settling reference checks across files. */
  analysed: Map<number, AnalysedTest>;
  /** Per upload: profiles by fingerprint or id, and the analysis parameters of each profile. */
  profiles: Map<string, InstrumentProfile | null>;
  params: Map<number, Awaited<ReturnType<typeof analysisParamsFor>>>;
};

async function profileOf(ctx: Context, key: { id: number } | { fingerprint: string }) {
  const k = 'id' in key ? `id:${key.id}` : `fp:${key.fingerprint}`;
  if (!ctx.profiles.has(k)) {
    ctx.profiles.set(k, 'id' in key
      ? await InstrumentProfile.findByPk(key.id)
      : await InstrumentProfile.findOne({ where: { fingerprint: key.fingerprint }, order: [['updatedAt', 'DESC']] }));
  }
  return ctx.profiles.get(k) ?? null;
}

async function paramsOf(ctx: Context, profile: InstrumentProfile) {
  if (!ctx.params.has(profile.id)) ctx.params.set(profile.id, await analysisParamsFor(ctx.site, profile.definition));
  return ctx.params.get(profile.id)!;
}

async function loadRegister(siteId: number) {
  const traps = await Trap.findAll({ where: { siteId }, attributes: ['id', 'tag', 'trapType', 'pressureBarg', 'sizeDn', 'orificeMm', 'status'] });
  return {
    register: registerFromTraps(traps.map((t) => t.get({ plain: true })), 'site register'),
    trapIdByTag: new Map(traps.map((t) => [tagKey(t.tag), t.id])),
  };
}

/** What the wizard needs of a detection: everything but the bulk of the problems. */
function detectionSummary(d: LayoutDetection) {
  return { ...d, problems: d.problems.slice(0, 50) };
}

/** Processes every waiting file of an upload, then settles reference checks across its files. */
export async function processUpload(uploadId: number) {
  const upload = await Upload.findByPk(uploadId);
  if (!upload) return;
  const site = (await Site.findByPk(upload.siteId))!;
  await writeTransaction((transaction) => upload.update({ status: 'processing', startedAt: upload.startedAt ?? new Date(), error: null }, { transaction }));
  const ctx: Context = { upload, site, ...(await loadRegister(site.id)), analysed: new Map(), profiles: new Map(), params: new Map() };

  // A zip still "pending" was interrupted while unpacking: its entries are made again.
  for (const zip of await SourceFile.findAll({ where: { uploadId, kind: 'zip', status: 'pending' } })) {
    await writeTransaction((transaction) => SourceFile.destroy({ where: { containerId: zip.id }, transaction }));
    await unpackZip(ctx, zip);
  }
  for (const file of await SourceFile.findAll({ where: { uploadId, kind: { [Op.in]: ['file', 'entry'] }, status: 'pending' }, order: [['id', 'ASC']] })) {
    const bytes = file.kind === 'file' ? await readStored(file.sha256) : await entryBytes(file);
    await processFile(ctx, file, bytes);
  }
  await settleUpload(ctx);
  await finish(upload);
  await settleWorkOrdersAfterUpload(uploadId);
}

export async function entryBytes(entry: SourceFile): Promise<Uint8Array> {
  const zip = (await SourceFile.findByPk(entry.containerId!))!;
  const contents = readZip(await readStored(zip.sha256), uploadLimits().zip, zip.name);
  const found = contents.entries.find((e) => e.name === entry.entry);
  const read = found?.read();
  if (!read?.ok) throw new Error(`Entry ${entry.entry} of ${zip.name} can no longer be read`);
  return read.bytes;
}

async function unpackZip(ctx: Context, zip: SourceFile) {
  const contents = readZip(await readStored(zip.sha256), uploadLimits().zip, zip.name);
  const problems: unknown[] = [...contents.problems];
  for (const s of contents.skipped) {
    problems.push({ code: 'zip-entry-skipped', severity: 'warning', file: zip.name, entry: s.name, message: `${zip.name} › ${s.name}: skipped, ${s.reason}` });
  }
  const entries: { row: SourceFile; bytes: Uint8Array }[] = [];
  for (const entry of contents.entries) {
    const read = entry.read();
    if (!read.ok) {
      problems.push(read.problem);
      continue;
    }
    const sha256 = createHash('sha256').update(read.bytes).digest('hex');
    const earlier = await SourceFile.findOne({ where: { surveyId: zip.surveyId, sha256, status: { [Op.in]: ['pending', 'needs_mapping', 'processed'] } } });
    const row = await writeTransaction((transaction) => SourceFile.create({
      uploadId: zip.uploadId, siteId: zip.siteId, surveyId: zip.surveyId, containerId: zip.id, name: zip.name, entry: entry.name,
      kind: 'entry', sha256, size: read.bytes.length, status: earlier ? 'duplicate' : 'pending', profileId: null,
      duplicateOf: earlier?.id ?? null, hints: entry.hints,
    }, { transaction }));
    if (!earlier) entries.push({ row, bytes: read.bytes });
  }
  const refused = contents.problems.some((p) => p.severity === 'error') && contents.entries.length === 0;
  await writeTransaction(async (transaction) => {
    await zip.update({ status: refused ? 'failed' : 'unpacked', problems }, { transaction });
    await ctx.upload.increment({ filesTotal: entries.length, filesDone: 1 }, { transaction });
  });
  for (const { row, bytes } of entries) await processFile(ctx, row, bytes);
}

async function processFile(ctx: Context, file: SourceFile, bytes: Uint8Array) {
  const place = { fileName: file.name, ...(file.entry ? { entry: file.entry } : {}), hints: file.hints ?? [] };
  const detection = detectLayout(bytes.length > DETECT_SAMPLE_BYTES ? bytes.subarray(0, DETECT_SAMPLE_BYTES) : bytes, {
    ...place, isWholeFile: bytes.length <= DETECT_SAMPLE_BYTES,
  });
  if (!detection.ok) {
    await writeTransaction(async (transaction) => {
      await file.update({ status: 'failed', fingerprint: detection.fingerprint, detection: null, problems: detection.problems }, { transaction });
      await ctx.upload.increment({ filesDone: 1 }, { transaction });
    });
    return;
  }
  const profile = await profileOf(ctx, file.profileId ? { id: file.profileId } : { fingerprint: detection.fingerprint });
  if (!profile) {
    // A layout no profile knows: the file waits for an analyst to map it in the wizard.
    await writeTransaction(async (transaction) => {
      await file.update({ status: 'needs_mapping', fingerprint: detection.fingerprint, detection: detectionSummary(detection), problems: detection.problems }, { transaction });
      await ctx.upload.increment({ filesDone: 1 }, { transaction });
    });
    return;
  }
  const series = new Map<string, NormalisedTest>();
  const result = analyseFile(bytes, {
    ...place, profile: profile.definition, timeZone: ctx.site.timeZone, register: ctx.register,
    params: await paramsOf(ctx, profile),
    onTest: (analysed, test) => series.set(analysed.key, test),
  });
  await writeTransaction(async (transaction) => {
    await Test.destroy({ where: { sourceFileId: file.id }, transaction });
    let samples = 0;
    for (const analysed of result.tests) {
      const test = series.get(analysed.key)!;
      const row = await storeTest(ctx, file, analysed, test, transaction);
      ctx.analysed.set(row.id, analysed);
      samples += test.sampleCount;
    }
    await file.update({
      status: result.refused ? 'failed' : 'processed', fingerprint: detection.fingerprint, profileId: profile.id,
      profileRevision: profile.revision, problems: result.problems, rowCounts: (result.rowCounts ?? null) as Record<string, number> | null,
      testCount: result.tests.length,
    }, { transaction });
    await ctx.upload.increment({ filesDone: 1, testCount: result.tests.length, sampleCount: samples }, { transaction });
  });
}

function figuresOf(analysed: AnalysedTest) {
  return { ...testJson(analysed), params: analysed.analysis?.params ?? null } as unknown as Record<string, unknown>;
}

function columnsOf(analysed: AnalysedTest) {
  const json = testJson(analysed);
  return {
    meanLevelDb: json.level.meanDb, dutyCycle: json.cycles.dutyCycle, suggestedVerdict: json.verdict.suggested,
    confidence: json.verdict.confidence, lossKgPerHour: json.loss.kgPerHour, lossMode: json.loss.lossMode, figures: figuresOf(analysed),
  };
}

async function storeTest(ctx: Context, file: SourceFile, analysed: AnalysedTest, test: NormalisedTest, transaction: Transaction) {
  const trapTag = test.role === 'trap' ? test.tag : test.linkedTrapTag;
  const trapId = trapTag ? ctx.trapIdByTag.get(tagKey(trapTag)) ?? null : null;
  const row = await Test.create({
    siteId: file.siteId, surveyId: file.surveyId, uploadId: file.uploadId, sourceFileId: file.id, trapId,
    tag: test.tag, role: test.role, linkedTrapTag: analysed.linkedTrapTag, matchStatus: trapId ? 'matched' : 'unmatched',
    startedAt: new Date(test.startedAt), durationS: test.durationS, sampleRateHz: test.sampleRateHz, sampleCount: test.sampleCount,
    firstLine: test.source.firstLine, lastLine: test.source.lastLine, ...columnsOf(analysed),
  }, { transaction });
  await TestSeries.create({
    testId: row.id, levelDb: packFloat32(test.levelDb),
    temperatureC: test.temperatureC ? packFloat32(test.temperatureC) : null,
    timeOffsetsS: test.timeOffsetsS ? packFloat64(test.timeOffsetsS) : null,
  }, { transaction });
  return row;
}

/** A stored test as the reader gave it, for measuring again (tests of an earlier run, or after a tag is mapped). */
export async function normalisedFromStore(row: Test, file: SourceFile): Promise<NormalisedTest | null> {
  const series = await TestSeries.findByPk(row.id);
  if (!series) return null;
  return {
    tag: row.tag, role: row.role, linkedTrapTag: row.linkedTrapTag, startedAt: row.startedAt.getTime(),
    sampleRateHz: row.sampleRateHz, sampleCount: row.sampleCount, durationS: row.durationS,
    timeOffsetsS: series.timeOffsetsS ? unpackFloat64(series.timeOffsetsS) : null,
    levelDb: unpackFloat32(series.levelDb), temperatureC: series.temperatureC ? unpackFloat32(series.temperatureC) : null,
    source: { file: file.name, ...(file.entry ? { entry: file.entry } : {}), hints: file.hints ?? [], firstLine: row.firstLine ?? 0, lastLine: row.lastLine ?? 0 },
    duplicatesCollapsed: 0, backwardsJumps: 0,
  };
}

/**
 * Reference checks across the files of one upload: tests measured in this run are at hand;
 * those of earlier runs (before a mapping was saved, say) are measured again from storage.
 */
async function settleUpload(ctx: Context) {
  const rows = await Test.findAll({ where: { uploadId: ctx.upload.id }, order: [['sourceFileId', 'ASC'], ['firstLine', 'ASC']] });
  if (rows.length === 0) return;
  const files = new Map((await SourceFile.findAll({ where: { uploadId: ctx.upload.id } })).map((f) => [f.id, f]));
  const analysed: AnalysedTest[] = [];
  for (const row of rows) {
    let a = ctx.analysed.get(row.id);
    if (!a) {
      const file = files.get(row.sourceFileId)!;
      const test = await normalisedFromStore(row, file);
      const profile = file.profileId ? await profileOf(ctx, { id: file.profileId }) : null;
      if (!test || !profile) continue;
      a = measureTest(test, {
        register: ctx.register,
        params: await paramsOf(ctx, profile),
        // As lib/pipeline/analyse-file.ts names a given profile, so pairing sees one layout.
        profile: {
          name: profile.definition.name, source: 'given', referenceLink: profile.definition.referenceLink,
          layout: profile.definition.fingerprint ?? `profile:${profile.definition.name}`,
        },
      }).analysed;
    }
    // Keyed by row id: two uploaded files may share a name.
    analysed.push({ ...a, key: String(row.id) });
  }
  // Decision-table row 1: a field note "line out of service" on the trap in this survey.
  const lineOut = new Set((await FieldNote.findAll({ where: { surveyId: ctx.upload.surveyId, kind: 'line_out_of_service' }, attributes: ['trapId'] })).map((n) => n.trapId));
  const settled = settleTests(analysed, { lineOutOfService: (tag) => lineOut.has(ctx.trapIdByTag.get(tagKey(tag)) ?? 0) });
  const rowById = new Map(rows.map((r) => [r.id, r]));
  await writeTransaction(async (transaction) => {
    for (const s of settled) {
      // A reference linked across files now knows its trap.
      const trapTag = s.role === 'trap' ? s.tag : s.linkedTrapTag;
      const trapId = trapTag ? ctx.trapIdByTag.get(tagKey(trapTag)) ?? null : null;
      const row = rowById.get(Number(s.key))!;
      const columns = columnsOf(s);
      // Most tests have no reference to pair: their stored figures stand, and are not written again.
      const unchanged = row.linkedTrapTag === s.linkedTrapTag && (!trapId || row.trapId === trapId)
        && JSON.stringify(row.figures) === JSON.stringify(columns.figures);
      if (unchanged || row.matchStatus === 'ignored') continue;
      await Test.update(
        { ...columns, linkedTrapTag: s.linkedTrapTag, ...(trapId ? { trapId, matchStatus: 'matched' as const } : {}) },
        { where: { id: row.id }, transaction },
      );
    }
  });
}

async function finish(upload: Upload) {
  const waiting = await SourceFile.count({ where: { uploadId: upload.id, status: 'needs_mapping' } });
  const unmatched = await Test.count({ where: { uploadId: upload.id, matchStatus: 'unmatched' } });
  const files = await SourceFile.findAll({ where: { uploadId: upload.id, containerId: null }, attributes: ['status'] });
  const allFailed = files.length > 0 && files.every((f) => f.status === 'failed');
  await writeTransaction((transaction) => upload.update({
    status: waiting || unmatched ? 'waiting_for_mapping' : allFailed ? 'failed' : 'done',
    error: allFailed ? 'No file of this upload could be read; see each file\'s problems.' : null,
    finishedAt: new Date(),
  }, { transaction }));
}
