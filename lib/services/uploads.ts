import 'server-only';
import fs from 'node:fs';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import type { SourceFileStatus } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import type { ReceivedFile } from '@/lib/server/receive-upload';
import { storedPath } from '@/lib/server/upload-store';
import { SourceFile, Survey, Test, Upload, User } from '@/models';
import { recordAudit } from './audit';

const ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x03, 0x04]);
const EMPTY_ZIP_MAGIC = Buffer.from([0x50, 0x4b, 0x05, 0x06]);

/** A zip by its first bytes or its name (a zip renamed .csv is still a zip; a CSV named .zip is reported by the reader). */
function isZip(file: ReceivedFile): boolean {
  const fd = fs.openSync(storedPath(file.sha256), 'r');
  try {
    const head = Buffer.alloc(4);
    fs.readSync(fd, head, 0, 4, 0);
    return head.equals(ZIP_MAGIC) || head.equals(EMPTY_ZIP_MAGIC) || /\.zip$/i.test(file.name);
  } finally {
    fs.closeSync(fd);
  }
}

/** Statuses of a file that counts: an earlier copy in one of these makes a new copy a duplicate. */
const COUNTED: SourceFileStatus[] = ['pending', 'needs_mapping', 'processed', 'unpacked'];

export async function createUpload(actor: Actor, surveyId: number, files: ReceivedFile[]) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  if (survey.status === 'published') {
    throw new AppError('conflict', `${survey.name} is published; its results are frozen. Upload re-tests into a survey in progress.`);
  }
  const uploadId = await writeTransaction(async (transaction) => {
    const upload = await Upload.create(
      { siteId: survey.siteId, surveyId, createdBy: actor.userId, status: 'queued', filesTotal: 0 },
      { transaction },
    );
    let toProcess = 0;
    for (const file of files) {
      const earlier = await SourceFile.findOne({
        where: { surveyId, sha256: file.sha256, status: { [Op.in]: COUNTED } },
        order: [['id', 'ASC']],
        transaction,
      });
      const kind = isZip(file) ? 'zip' : 'file';
      await SourceFile.create(
        {
          uploadId: upload.id, siteId: survey.siteId, surveyId, containerId: null, name: file.name, entry: null, kind,
          sha256: file.sha256, size: file.size, status: earlier ? 'duplicate' : 'pending', profileId: null,
          duplicateOf: earlier?.id ?? null,
        },
        { transaction },
      );
      if (!earlier) toProcess++;
    }
    await upload.update({ filesTotal: toProcess, status: toProcess ? 'queued' : 'done', finishedAt: toProcess ? null : new Date() }, { transaction });
    await recordAudit(actor, {
      siteId: survey.siteId, action: 'upload.create', entityType: 'upload', entityId: upload.id,
      after: { surveyId, files: files.map((f) => ({ name: f.name, size: f.size, sha256: f.sha256 })) },
    }, transaction);
    return upload.id;
  });
  return getUpload(uploadId);
}

export async function siteIdOfUpload(uploadId: number): Promise<number | null> {
  return (await Upload.findByPk(uploadId, { attributes: ['siteId'] }))?.siteId ?? null;
}

function fileDto(f: SourceFile) {
  return {
    id: f.id, containerId: f.containerId, name: f.name, entry: f.entry, kind: f.kind, sha256: f.sha256, size: Number(f.size),
    status: f.status, fingerprint: f.fingerprint ?? null, profileId: f.profileId ?? null, profileRevision: f.profileRevision ?? null,
    testCount: f.testCount, duplicateOf: f.duplicateOf ?? null, hints: f.hints ?? [], rowCounts: f.rowCounts ?? null,
    problems: (f.problems ?? []) as Record<string, unknown>[],
  };
}
export type SourceFileDto = ReturnType<typeof fileDto>;

function uploadDto(u: Upload & { creator?: User; survey?: Survey }) {
  return {
    id: u.id, siteId: u.siteId, surveyId: u.surveyId, surveyName: u.survey?.name ?? null, status: u.status,
    createdBy: u.creator?.name ?? null, createdAt: u.createdAt.toISOString(),
    startedAt: u.startedAt?.toISOString() ?? null, finishedAt: u.finishedAt?.toISOString() ?? null,
    progress: { filesTotal: u.filesTotal, filesDone: u.filesDone, tests: u.testCount, samples: u.sampleCount },
    error: u.error ?? null,
  };
}
export type UploadDto = ReturnType<typeof uploadDto>;

const uploadInclude = [
  { model: User, as: 'creator', attributes: ['name'] },
  { model: Survey, as: 'survey', attributes: ['name'] },
];

export async function listUploads(siteId: number, limit = 50) {
  const uploads = await Upload.findAll({ where: { siteId }, include: uploadInclude, order: [['id', 'DESC']], limit });
  return uploads.map(uploadDto);
}

/** An upload with every file (zip entries under their zip), detection and problems. */
export async function getUpload(uploadId: number) {
  const upload = await Upload.findByPk(uploadId, { include: uploadInclude });
  if (!upload) throw notFound('upload');
  const files = await SourceFile.findAll({ where: { uploadId }, order: [['id', 'ASC']] });
  return {
    ...uploadDto(upload),
    files: files.map(fileDto),
    /** Layouts no profile knows yet, one per fingerprint, with what detection suggests. */
    unknownLayouts: unknownLayouts(files),
    unmatchedTags: await unmatchedTags(uploadId),
    mappingDraft: (upload.mappingDraft ?? null) as Record<string, { step: string; profile: unknown; updatedBy: string; updatedAt: string }> | null,
  };
}
export type UploadDetail = Awaited<ReturnType<typeof getUpload>>;

async function unmatchedTags(uploadId: number) {
  const tests = await Test.findAll({ where: { uploadId, matchStatus: 'unmatched' }, attributes: ['tag', 'role', 'linkedTrapTag'] });
  const byTag = new Map<string, { tag: string; tests: number; roles: Set<'trap' | 'reference'> }>();
  for (const t of tests) {
    const tag = t.role === 'trap' ? t.tag : t.linkedTrapTag ?? t.tag;
    const entry = byTag.get(tag.toUpperCase()) ?? { tag, tests: 0, roles: new Set() };
    entry.tests++;
    entry.roles.add(t.role);
    byTag.set(tag.toUpperCase(), entry);
  }
  return [...byTag.values()].map((e) => ({ tag: e.tag, tests: e.tests, roles: [...e.roles] })).sort((a, b) => a.tag.localeCompare(b.tag));
}

/** Saves the wizard's state for one layout (keyed by fingerprint) on the upload. */
export async function saveMappingDraft(actor: Actor, uploadId: number, draft: { fingerprint: string; step: string; profile: Record<string, unknown> }) {
  await writeTransaction(async (transaction) => {
    const upload = await Upload.findByPk(uploadId, { transaction });
    if (!upload) throw notFound('upload');
    const drafts = { ...(upload.mappingDraft ?? {}) };
    drafts[draft.fingerprint] = { step: draft.step, profile: draft.profile, updatedBy: actor.name, updatedAt: new Date().toISOString() };
    await upload.update({ mappingDraft: drafts }, { transaction });
  });
  return { saved: true as const };
}

function unknownLayouts(files: SourceFile[]) {
  const byFingerprint = new Map<string, { fingerprint: string; fileIds: number[]; detection: Record<string, unknown> | null }>();
  for (const f of files) {
    if (f.status !== 'needs_mapping' || !f.fingerprint) continue;
    const entry = byFingerprint.get(f.fingerprint) ?? { fingerprint: f.fingerprint, fileIds: [], detection: f.detection ?? null };
    entry.fileIds.push(f.id);
    byFingerprint.set(f.fingerprint, entry);
  }
  return [...byFingerprint.values()];
}
