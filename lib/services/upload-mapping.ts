import 'server-only';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import type { MatchStatus } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import { kickImportWorker } from '@/lib/server/import-worker';
import type { TrapInput } from '@/lib/validation/trap';
import { InstrumentProfile, SourceFile, Test, Trap, Upload } from '@/models';
import { recordAudit } from './audit';
import { createTrap } from './traps';
import { getUpload } from './uploads';

/**
 * Reads an upload's files with a profile: the files waiting for a mapping of that layout, or
 * with `reprocess`, every file the profile read before (an explicit choice after an edit:
 * editing a profile never silently changes past imports).
 */
export async function applyProfileToUpload(actor: Actor, uploadId: number, profileId: number, reprocess: boolean) {
  const profile = await InstrumentProfile.findByPk(profileId);
  if (!profile) throw new AppError('invalid', 'Invalid request body.', [{ path: 'profileId', message: 'No such instrument profile.' }]);
  const upload = await Upload.findByPk(uploadId);
  if (!upload) throw notFound('upload');
  await writeTransaction(async (transaction) => {
    // Re-processing reads again every file of the profile's layout, whichever profile read it before.
    const where = reprocess
      ? { uploadId, kind: { [Op.in]: ['file', 'entry'] }, fingerprint: profile.fingerprint, status: { [Op.in]: ['processed', 'needs_mapping', 'failed'] } }
      : { uploadId, status: 'needs_mapping', fingerprint: profile.fingerprint };
    const files = await SourceFile.findAll({ where, transaction });
    if (files.length === 0) throw new AppError('conflict', `No file of this upload has the layout of "${profile.name}".`);
    await SourceFile.update({ status: 'pending', profileId }, { where: { id: { [Op.in]: files.map((f) => f.id) } }, transaction });
    await upload.update({ status: 'queued', finishedAt: null, filesDone: Math.max(0, upload.filesDone - files.length) }, { transaction });
    await recordAudit(actor, {
      siteId: upload.siteId, action: reprocess ? 'upload.reprocess' : 'upload.apply_profile', entityType: 'upload', entityId: uploadId,
      after: { profileId, profileRevision: profile.revision, files: files.map((f) => f.id) },
    }, transaction);
  });
  kickImportWorker();
  return getUpload(uploadId);
}

type TagDecision =
  | { tag: string; action: 'map'; trapId: number }
  | { tag: string; action: 'create'; trap: Omit<TrapInput, 'tag'> }
  | { tag: string; action: 'ignore' };

/** Resolves one tag the register did not know, for every test of the upload that carries it. */
export async function decideUploadTag(actor: Actor, uploadId: number, decision: TagDecision) {
  const upload = await Upload.findByPk(uploadId);
  if (!upload) throw notFound('upload');
  const tests = await Test.findAll({ where: { uploadId, matchStatus: { [Op.ne]: 'matched' } } });
  const mine = tests.filter((t) => (t.role === 'trap' ? t.tag : t.linkedTrapTag ?? t.tag).toUpperCase() === decision.tag.trim().toUpperCase());
  if (mine.length === 0) throw new AppError('conflict', `No test of this upload waits on tag ${decision.tag}.`);

  let trapId: number | null = null;
  if (decision.action === 'map') {
    const trap = await Trap.findByPk(decision.trapId);
    if (!trap || trap.siteId !== upload.siteId) {
      throw new AppError('invalid', 'Invalid request body.', [{ path: 'trapId', message: 'No such trap on this site.' }]);
    }
    trapId = trap.id;
  } else if (decision.action === 'create') {
    trapId = (await createTrap(actor, upload.siteId, { ...decision.trap, tag: decision.tag.trim() })).id;
  }
  const matchStatus: MatchStatus = decision.action === 'ignore' ? 'ignored' : 'matched';
  await writeTransaction(async (transaction) => {
    await Test.update({ trapId, matchStatus }, { where: { id: { [Op.in]: mine.map((t) => t.id) } }, transaction });
    await recordAudit(actor, {
      siteId: upload.siteId, action: `upload.tag_${decision.action}`, entityType: 'upload', entityId: uploadId,
      after: { tag: decision.tag, trapId, tests: mine.length },
    }, transaction);
  });
  // The register now knows this trap: measure its tests again with its type and pressure.
  if (trapId) {
    await Upload.update({ status: 'queued' }, { where: { id: uploadId } });
    kickImportWorker();
  }
  return { tag: decision.tag, matchStatus, tests: mine.length };
}
