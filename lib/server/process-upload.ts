import 'server-only';
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import { writeTransaction } from '@/lib/db';
import { DETECT_SAMPLE_BYTES, detectLayout, detectShape, type LayoutDetection } from '@/lib/import/detect-layout';
import type { NormalisedTest } from '@/lib/import/normalised-test';
import { readZip } from '@/lib/import/zip-read';
import { measureTest, type AnalysedTest } from '@/lib/pipeline/analysed-test';
import { analyseFile } from '@/lib/pipeline/analyse-file';
import { settleTests } from '@/lib/pipeline/settle';
import { registerFromTraps, tagKey, type TrapRegister } from '@/lib/pipeline/trap-register';
import { FieldNote, InstrumentProfile, Site, SourceFile, Test, TestSeries, Trap, Upload } from '@/models';
import { settleWorkOrdersAfterUpload } from '@/lib/services/work-orders';
import { unpackFloat32, unpackFloat64 } from './series-codec';
import { createImportBatch, testColumns, type ImportBatch, type StoredAnalysis } from './import-batch';
import { analysisParamsFor } from './analysis-params';
import { uploadLimits } from './upload-limits';
import { readStored } from './upload-store';
import { assertStillHeld, startProcessing, UploadClaimLost } from './upload-claim';

type Context = {
  upload: Upload;
  site: Site;
  register: TrapRegister;
  trapIdByTag: Map<string, number>;
  /** Tests stored in this run by test id, for settling reference checks across files. */
  analysed: Map<number, StoredAnalysis>;
  /** Per upload: profiles by fingerprint or id, and the analysis parameters of each profile. */
  profiles: Map<string, InstrumentProfile | null>;
  params: Map<number, Awaited<ReturnType<typeof analysisParamsFor>>>;
  /** Files' outcomes waiting to be written, several to a transaction. */
  batch: ImportBatch;
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

/**
 * Between files, lets the event loop run: analysing is synchronous, and the promises between
 * files settle without it, so without this the batch being written (its transaction waits for
 * the database's callbacks) and the server's requests would wait for the whole upload.
 */
const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Processes every waiting file of an upload, then settles reference checks across its files. */
export async function processUpload(uploadId: number) {
  const upload = await Upload.findByPk(uploadId);
  if (!upload) return;
  const site = (await Site.findByPk(upload.siteId))!;
  if (!(await writeTransaction((transaction) => startProcessing(uploadId, transaction, upload.startedAt ?? new Date())))) throw new UploadClaimLost(uploadId);
  const { register, trapIdByTag } = await loadRegister(site.id);
  const analysed = new Map<number, StoredAnalysis>();
  const ctx: Context = {
    upload, site, register, trapIdByTag, analysed, profiles: new Map(), params: new Map(),
    batch: createImportBatch({ upload, trapIdByTag, onStored: (id, stored) => analysed.set(id, stored) }),
  };

  // A zip still "pending" was interrupted while unpacking: its entries are made again.
  for (const zip of await SourceFile.findAll({ where: { uploadId, kind: 'zip', status: 'pending' } })) {
    await writeTransaction(async (transaction) => {
      await assertStillHeld(uploadId, transaction);
      await SourceFile.destroy({ where: { containerId: zip.id }, transaction });
    });
    await unpackZip(ctx, zip);
  }
  await ctx.batch.flush(); // the entries just unpacked and read are no longer pending
  const files = await SourceFile.findAll({ where: { uploadId, kind: { [Op.in]: ['file', 'entry'] }, status: 'pending' }, order: [['id', 'ASC']] });
  for (const file of files) {
    const bytes = file.kind === 'file' ? await readStored(file.sha256) : await entryBytes(file);
    await processFile(ctx, file, bytes);
    await yieldToEventLoop();
  }
  await ctx.batch.flush();
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
  const read: { name: string; hints: string[]; bytes: Uint8Array; sha256: string }[] = [];
  for (const entry of contents.entries) {
    const r = entry.read();
    if (!r.ok) problems.push(r.problem);
    else read.push({ name: entry.name, hints: entry.hints, bytes: r.bytes, sha256: createHash('sha256').update(r.bytes).digest('hex') });
  }
  // The same bytes already in this survey (or earlier in this zip) are kept as a duplicate of the first.
  const firstWith = new Map<string, number>();
  for (const f of await SourceFile.findAll({
    where: { surveyId: zip.surveyId, sha256: [...new Set(read.map((e) => e.sha256))], status: { [Op.in]: ['pending', 'needs_mapping', 'processed'] } },
    attributes: ['id', 'sha256'], order: [['id', 'ASC']],
  })) if (!firstWith.has(f.sha256)) firstWith.set(f.sha256, f.id);
  const fresh = new Set<string>();
  const firsts = read.filter((e) => !firstWith.has(e.sha256) && !fresh.has(e.sha256) && fresh.add(e.sha256));
  const duplicates = read.filter((e) => !firsts.includes(e));
  const refused = contents.problems.some((p) => p.severity === 'error') && contents.entries.length === 0;
  const entryRow = (e: (typeof read)[number], duplicateOf: number | null) => ({
    uploadId: zip.uploadId, siteId: zip.siteId, surveyId: zip.surveyId, containerId: zip.id, name: zip.name, entry: e.name,
    kind: 'entry' as const, sha256: e.sha256, size: e.bytes.length, status: duplicateOf ? 'duplicate' as const : 'pending' as const,
    profileId: null, duplicateOf, hints: e.hints,
  });
  const entries = await writeTransaction(async (transaction) => {
    await assertStillHeld(ctx.upload.id, transaction);
    const rows = await SourceFile.bulkCreate(firsts.map((e) => entryRow(e, null)), { transaction });
    for (const row of rows) firstWith.set(row.sha256, row.id);
    await SourceFile.bulkCreate(duplicates.map((e) => entryRow(e, firstWith.get(e.sha256)!)), { transaction });
    await zip.update({ status: refused ? 'failed' : 'unpacked', problems }, { transaction });
    await ctx.upload.increment({ filesTotal: firsts.length, filesDone: 1 }, { transaction });
    return rows.map((row, i) => ({ row, bytes: firsts[i].bytes }));
  });
  for (const { row, bytes } of entries) {
    await processFile(ctx, row, bytes);
    await yieldToEventLoop();
  }
}

async function processFile(ctx: Context, file: SourceFile, bytes: Uint8Array) {
  const place = { fileName: file.name, ...(file.entry ? { entry: file.entry } : {}), hints: file.hints ?? [] };
  const head = bytes.length > DETECT_SAMPLE_BYTES ? bytes.subarray(0, DETECT_SAMPLE_BYTES) : bytes;
  const detectOptions = { ...place, isWholeFile: bytes.length <= DETECT_SAMPLE_BYTES };
  // The shape alone recognises a known layout; the full detection is for the wizard.
  const shape = detectShape(head, detectOptions);
  if (!shape.ok) {
    await ctx.batch.add({ file, changes: { status: 'failed', fingerprint: shape.fingerprint, detection: null, problems: shape.problems }, tests: [] });
    return;
  }
  const profile = await profileOf(ctx, file.profileId ? { id: file.profileId } : { fingerprint: shape.fingerprint });
  if (!profile) {
    // A layout no profile knows: the file waits for an analyst to map it in the wizard.
    const detection = detectLayout(head, detectOptions);
    await ctx.batch.add({
      file, changes: { status: 'needs_mapping', fingerprint: detection.fingerprint, detection: detectionSummary(detection), problems: detection.problems }, tests: [],
    });
    return;
  }
  const series = new Map<string, NormalisedTest>();
  const result = analyseFile(bytes, {
    ...place, profile: profile.definition, timeZone: ctx.site.timeZone, register: ctx.register,
    params: await paramsOf(ctx, profile), shape,
    onTest: (analysed, test) => series.set(analysed.key, test),
  });
  await ctx.batch.add({
    file,
    changes: {
      status: result.refused ? 'failed' : 'processed', fingerprint: shape.fingerprint, profileId: profile.id,
      profileRevision: profile.revision, problems: result.problems, rowCounts: (result.rowCounts ?? null) as Record<string, number> | null,
      testCount: result.tests.length,
    },
    // Settled within the file (its own reference checks); none when the file was refused.
    tests: result.tests.map((analysed) => ({ analysed, test: series.get(analysed.key)! })),
  });
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
  const rows = await Test.findAll({
    where: { uploadId: ctx.upload.id }, order: [['sourceFileId', 'ASC'], ['firstLine', 'ASC']],
    attributes: ['id', 'sourceFileId', 'firstLine', 'linkedTrapTag', 'trapId', 'matchStatus'],
  });
  if (rows.length === 0) return;
  const measured = await measureEarlierTests(ctx, rows.filter((r) => !ctx.analysed.has(r.id)).map((r) => r.id));
  const analysed: AnalysedTest[] = [];
  for (const row of rows) {
    const a = ctx.analysed.get(row.id)?.analysed ?? measured.get(row.id)?.analysed;
    // Keyed by row id: two uploaded files may share a name.
    if (a) analysed.push({ ...a, key: String(row.id) });
  }
  // Decision-table row 1: a field note "line out of service" on the trap in this survey.
  const lineOut = new Set((await FieldNote.findAll({ where: { surveyId: ctx.upload.surveyId, kind: 'line_out_of_service' }, attributes: ['trapId'] })).map((n) => n.trapId));
  const settled = settleTests(analysed, { lineOutOfService: (tag) => lineOut.has(ctx.trapIdByTag.get(tagKey(tag)) ?? 0) });
  const rowById = new Map(rows.map((r) => [r.id, r]));
  const changes = settled.flatMap((s) => {
    const row = rowById.get(Number(s.key))!;
    // A reference linked across files now knows its trap.
    const trapTag = s.role === 'trap' ? s.tag : s.linkedTrapTag;
    const trapId = trapTag ? ctx.trapIdByTag.get(tagKey(trapTag)) ?? null : null;
    const columns = testColumns(s);
    const storedFigures = ctx.analysed.get(row.id)?.figuresJson ?? measured.get(row.id)?.figuresJson;
    // Most tests have no reference to pair: their stored figures stand, and are not written again.
    const unchanged = row.linkedTrapTag === s.linkedTrapTag && (!trapId || row.trapId === trapId)
      && storedFigures === JSON.stringify(columns.figures);
    if (unchanged || row.matchStatus === 'ignored') return [];
    return [{ id: row.id, values: { ...columns, linkedTrapTag: s.linkedTrapTag, ...(trapId ? { trapId, matchStatus: 'matched' as const } : {}) } }];
  });
  if (changes.length === 0) return;
  await writeTransaction(async (transaction) => {
    await assertStillHeld(ctx.upload.id, transaction);
    for (const c of changes) await Test.update(c.values, { where: { id: c.id }, transaction });
  });
}

/** Tests of an earlier run of this upload (before a mapping was saved, say), measured again from storage. */
async function measureEarlierTests(ctx: Context, ids: number[]): Promise<Map<number, StoredAnalysis>> {
  const out = new Map<number, StoredAnalysis>();
  if (ids.length === 0) return out;
  const files = new Map((await SourceFile.findAll({ where: { uploadId: ctx.upload.id } })).map((f) => [f.id, f]));
  for (const row of await Test.findAll({ where: { id: ids } })) {
    const file = files.get(row.sourceFileId)!;
    const test = await normalisedFromStore(row, file);
    const profile = file.profileId ? await profileOf(ctx, { id: file.profileId }) : null;
    if (!test || !profile) continue;
    const { analysed } = measureTest(test, {
      register: ctx.register,
      params: await paramsOf(ctx, profile),
      // As lib/pipeline/analyse-file.ts names a given profile, so pairing sees one layout.
      profile: {
        name: profile.definition.name, source: 'given', referenceLink: profile.definition.referenceLink,
        layout: profile.definition.fingerprint ?? `profile:${profile.definition.name}`,
      },
    });
    out.set(row.id, { analysed, figuresJson: JSON.stringify(row.figures) });
  }
  return out;
}

async function finish(upload: Upload) {
  const waiting = await SourceFile.count({ where: { uploadId: upload.id, status: 'needs_mapping' } });
  const unmatched = await Test.count({ where: { uploadId: upload.id, matchStatus: 'unmatched' } });
  const files = await SourceFile.findAll({ where: { uploadId: upload.id, containerId: null }, attributes: ['status'] });
  const allFailed = files.length > 0 && files.every((f) => f.status === 'failed');
  await writeTransaction(async (transaction) => {
    await assertStillHeld(upload.id, transaction);
    await upload.update({
      status: waiting || unmatched ? 'waiting_for_mapping' : allFailed ? 'failed' : 'done',
      error: allFailed ? 'No file of this upload could be read; see each file\'s problems.' : null,
      finishedAt: new Date(),
    }, { transaction });
  });
}
