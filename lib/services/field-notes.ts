import 'server-only';
import fs from 'node:fs';
import { errors as formidableErrors } from 'formidable';
import { Op, type Transaction } from 'sequelize';
import {
  fieldPhotoFieldsSchema, PHOTO_MAX_BYTES, type FieldNoteInput, type FieldNoteKindCode, type PHOTO_TYPES,
} from '@/lib/api/field-note-routes';
import type { Actor } from '@/lib/auth/actor';
import { roleMay } from '@/lib/auth/permissions';
import { writeTransaction } from '@/lib/db';
import type { Role } from '@/lib/domain/vocabulary';
import { AppError, notFound } from '@/lib/http/errors';
import { fieldIssues } from '@/lib/http/zod-issues';
import { kickImportWorker } from '@/lib/server/import-worker';
import { receiveParts, storageRefusal } from '@/lib/server/receive-upload';
import { adopt, readStored } from '@/lib/server/upload-store';
import { Area, FieldNote, Survey, Test, Trap, Upload, User } from '@/models';
import { FIELD_NOTE_KINDS } from '@/models/FieldNote';
import { recordAudit } from './audit';
import { reviewQueue } from './review';

// The route file's kind list and the model's are one list: this fails to compile if they drift.
type SameKinds<A, B> = [A] extends [B] ? ([B] extends [A] ? true : never) : never;
const sameKinds: SameKinds<(typeof FIELD_NOTE_KINDS)[number], FieldNoteKindCode> = true;
void sameKinds;
type PhotoType = (typeof PHOTO_TYPES)[number];

/** Besides its author, who may delete a note (BRIEF §1: analysts review what the field reports). */
const DELETES_ANY_NOTE: readonly Role[] = ['admin', 'analyst'];

// ——— site resolution (the wrapper checks membership; a mismatch names no record: 404) ———

/** The site of a survey, when the trap belongs to it too. */
export async function siteIdOfSurveyTrap(surveyId: number, trapId: number): Promise<number | null> {
  const [survey, trap] = await Promise.all([
    Survey.findByPk(surveyId, { attributes: ['siteId'] }),
    Trap.findByPk(trapId, { attributes: ['siteId'] }),
  ]);
  return survey && trap && survey.siteId === trap.siteId ? survey.siteId : null;
}

/** The site of a note, when it belongs to the survey named in the path. */
export async function siteIdOfSurveyNote(surveyId: number, noteId: number): Promise<number | null> {
  const note = await FieldNote.findByPk(noteId, { attributes: ['siteId', 'surveyId'] });
  return note && note.surveyId === surveyId ? note.siteId : null;
}

// ——— reading ———

type NoteRow = FieldNote;
type Lookups = { users: Map<number, string>; surveys: Map<number, { name: string; status: string }>; traps: Map<number, string> };

async function lookupsFor(notes: NoteRow[]): Promise<Lookups> {
  const ids = (pick: (n: NoteRow) => number | null) => [...new Set(notes.map(pick).filter((v): v is number => v != null))];
  const [users, surveys, traps] = await Promise.all([
    User.findAll({ where: { id: { [Op.in]: ids((n) => n.createdBy) } }, attributes: ['id', 'name'] }),
    Survey.findAll({ where: { id: { [Op.in]: ids((n) => n.surveyId) } }, attributes: ['id', 'name', 'status'] }),
    Trap.findAll({ where: { id: { [Op.in]: ids((n) => n.trapId) } }, attributes: ['id', 'tag'] }),
  ]);
  return {
    users: new Map(users.map((u) => [u.id, u.name])),
    surveys: new Map(surveys.map((s) => [s.id, { name: s.name, status: s.status }])),
    traps: new Map(traps.map((t) => [t.id, t.tag])),
  };
}

function mayDelete(actor: Actor, note: NoteRow, surveyStatus: string | undefined) {
  if (surveyStatus === 'published' || !roleMay(actor.role, 'fieldnote.write') || actor.readOnly) return false;
  return note.createdBy === actor.userId || DELETES_ANY_NOTE.includes(actor.role);
}

function noteDto(actor: Actor, note: NoteRow, l: Lookups) {
  const survey = l.surveys.get(note.surveyId);
  return {
    id: note.id, siteId: note.siteId, surveyId: note.surveyId, surveyName: survey?.name ?? null, trapId: note.trapId,
    trapTag: l.traps.get(note.trapId) ?? null, testId: note.testId ?? null, kind: note.kind, text: note.text ?? null,
    photo: note.photoSha256 && note.photoType
      ? { url: `/api/surveys/${note.surveyId}/field-notes/${note.id}/photo`, type: note.photoType }
      : null,
    createdBy: note.createdBy ? l.users.get(note.createdBy) ?? null : null, createdById: note.createdBy ?? null,
    createdAt: note.createdAt.toISOString(), canDelete: mayDelete(actor, note, survey?.status),
  };
}
export type FieldNoteDto = ReturnType<typeof noteDto>;

async function dtos(actor: Actor, notes: NoteRow[]) {
  const l = await lookupsFor(notes);
  return notes.map((n) => noteDto(actor, n, l));
}

const newestFirst: [string, string][] = [['createdAt', 'DESC'], ['id', 'DESC']];

const mayAdd = (actor: Actor, surveyStatus: string | null | undefined) =>
  roleMay(actor.role, 'fieldnote.write') && !actor.readOnly && surveyStatus !== 'published';

export async function listTrapFieldNotes(actor: Actor, surveyId: number, trapId: number) {
  const survey = await Survey.findByPk(surveyId, { attributes: ['status'] });
  if (!survey) throw notFound('survey');
  const notes = await FieldNote.findAll({ where: { surveyId, trapId }, order: newestFirst });
  return { items: await dtos(actor, notes), canAdd: mayAdd(actor, survey.status) };
}

export async function listTestFieldNotes(actor: Actor, testId: number) {
  const test = await Test.findByPk(testId, { attributes: ['id', 'surveyId'] });
  if (!test) throw notFound('test');
  const survey = await Survey.findByPk(test.surveyId, { attributes: ['status'] });
  const notes = await FieldNote.findAll({ where: { testId }, order: newestFirst });
  return { items: await dtos(actor, notes), canAdd: mayAdd(actor, survey?.status) };
}

/** Every note on a trap, across the surveys of its site (the trap page). Adding happens in a survey. */
export async function listTrapNotesAcrossSurveys(actor: Actor, trapId: number) {
  const notes = await FieldNote.findAll({ where: { trapId }, order: newestFirst });
  return { items: await dtos(actor, notes), canAdd: false };
}

// ——— writing ———

async function openSurvey(surveyId: number, transaction?: Transaction) {
  const survey = await Survey.findByPk(surveyId, { transaction });
  if (!survey) throw notFound('survey');
  if (survey.status === 'published') {
    throw new AppError('conflict', `${survey.name} is published: its field notes are part of the report and no longer change.`);
  }
  return survey;
}

async function assertTestOfTrap(testId: number | null | undefined, surveyId: number, trapId: number) {
  if (testId == null) return null;
  const test = await Test.findByPk(testId, { attributes: ['id', 'surveyId', 'trapId'] });
  if (!test || test.surveyId !== surveyId || test.trapId !== trapId) {
    throw new AppError('invalid', 'Invalid request body.', [{ path: 'testId', message: 'Not a test of this trap in this survey.' }]);
  }
  return test.id;
}

type NewNote = { kind: FieldNoteKindCode; text?: string | null; testId?: number | null; photoSha256?: string | null; photoType?: string | null };

async function insertNote(actor: Actor, surveyId: number, trapId: number, input: NewNote) {
  const testId = await assertTestOfTrap(input.testId, surveyId, trapId);
  const note = await writeTransaction(async (transaction) => {
    const survey = await openSurvey(surveyId, transaction);
    const row = await FieldNote.create({
      siteId: survey.siteId, surveyId, trapId, testId, kind: input.kind, text: input.text?.trim() || null,
      photoSha256: input.photoSha256 ?? null, photoType: input.photoType ?? null, createdBy: actor.userId,
    }, { transaction });
    await recordAudit(actor, {
      siteId: survey.siteId, action: 'fieldnote.create', entityType: 'field_note', entityId: row.id,
      after: { surveyId, trapId, testId, kind: row.kind, text: row.text, photoSha256: row.photoSha256 },
    }, transaction);
    return row;
  });
  if (note.kind === 'line_out_of_service') await settleTrapAgain(surveyId, trapId);
  return (await dtos(actor, [note]))[0];
}

export async function createFieldNote(actor: Actor, surveyId: number, trapId: number, input: FieldNoteInput) {
  return insertNote(actor, surveyId, trapId, input);
}

export async function deleteFieldNote(actor: Actor, surveyId: number, noteId: number) {
  const note = await FieldNote.findByPk(noteId);
  if (!note || note.surveyId !== surveyId) throw notFound('field note');
  await writeTransaction(async (transaction) => {
    const survey = await openSurvey(surveyId, transaction);
    if (!mayDelete(actor, note, survey.status)) {
      throw new AppError('forbidden', 'Only the note\'s author or an analyst may delete it.');
    }
    await note.destroy({ transaction });
    await recordAudit(actor, {
      siteId: note.siteId, action: 'fieldnote.delete', entityType: 'field_note', entityId: note.id,
      before: { surveyId, trapId: note.trapId, testId: note.testId, kind: note.kind, text: note.text, photoSha256: note.photoSha256 },
    }, transaction);
  });
  if (note.kind === 'line_out_of_service') await settleTrapAgain(surveyId, note.trapId);
  return { deleted: note.id };
}

/**
 * Decision-table row 1 reads the survey's "line out of service" notes when an upload's tests are
 * settled (lib/server/process-upload.ts). A note added or removed later re-queues the uploads
 * that hold this trap's tests in the survey, as deciding a tag does: the worker settles them again
 * in the background, in order with any other import, with the same code that settled them first.
 * An upload being processed right now settles at its end and reads the notes then, so it is left alone.
 */
async function settleTrapAgain(surveyId: number, trapId: number) {
  const tests = await Test.findAll({ where: { surveyId, trapId }, attributes: ['uploadId'] });
  const uploadIds = [...new Set(tests.map((t) => t.uploadId))];
  if (uploadIds.length === 0) return;
  const [queued] = await Upload.update(
    { status: 'queued' },
    { where: { id: { [Op.in]: uploadIds }, status: { [Op.in]: ['done', 'waiting_for_mapping'] } } },
  );
  if (queued > 0) kickImportWorker();
}

// ——— photos ———

/** The image type from a file's first bytes, or null: PNG, JPEG and WebP signatures (their specifications). */
export function imageTypeOf(head: Uint8Array): PhotoType | null {
  const starts = (sig: number[], at = 0) => sig.every((b, i) => head[at + i] === b);
  // PNG: 89 50 4E 47 0D 0A 1A 0A (ISO/IEC 15948 §5.2).
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return 'image/png';
  // JPEG: SOI marker FF D8 followed by another marker FF (ITU-T T.81 Annex B).
  if (starts([0xff, 0xd8, 0xff])) return 'image/jpeg';
  // WebP: "RIFF" size "WEBP" (RFC 9649 §2).
  if (starts([0x52, 0x49, 0x46, 0x46]) && starts([0x57, 0x45, 0x42, 0x50], 8)) return 'image/webp';
  return null;
}

async function readHead(file: string, bytes = 16): Promise<Uint8Array> {
  const handle = await fs.promises.open(file, 'r');
  try {
    const buffer = Buffer.alloc(bytes);
    const { bytesRead } = await handle.read(buffer, 0, bytes, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/**
 * A photo as multipart/form-data, streamed to disk with formidable (never held in memory), at
 * most 10 MB, and kept only when its first bytes say PNG, JPEG or WebP: a renamed text file is refused.
 */
export async function addFieldPhoto(actor: Actor, surveyId: number, trapId: number, request: Request) {
  if (!request.body || !request.headers.get('content-type')?.startsWith('multipart/form-data')) {
    throw new AppError('invalid', 'Send the photo as multipart/form-data with one file part named "photo".');
  }
  await openSurvey(surveyId);
  const { fields, files, parts, discard } = await receiveParts(request, {
    maxFileSize: PHOTO_MAX_BYTES, maxTotalFileSize: PHOTO_MAX_BYTES, maxFiles: 1, maxFields: 5, maxFieldsSize: 64 * 1024,
    allowEmptyFiles: false, minFileSize: 1,
  }, (err) => {
    const code = (err as { code?: number }).code;
    if (code === formidableErrors.biggerThanMaxFileSize || code === formidableErrors.biggerThanTotalMaxFileSize) {
      return new AppError('too_large', `A photo is at most ${PHOTO_MAX_BYTES / (1024 * 1024)} MB. Send a smaller one (most phones can share a reduced size).`);
    }
    if (code === formidableErrors.maxFilesExceeded) return new AppError('invalid', 'Send one photo at a time.');
    if (code === formidableErrors.smallerThanMinFileSize) return new AppError('invalid', 'The photo is empty.');
    return new AppError('invalid', 'The photo upload could not be read; send it as multipart/form-data with a part named "photo".');
  });
  const part = files.photo?.[0] ?? parts[0];
  if (!part) throw new AppError('invalid', 'The upload holds no photo: add a file part named "photo".');
  const type = imageTypeOf(await readHead(part.filepath));
  if (!type) {
    await discard();
    throw new AppError('invalid', `${part.originalFilename || 'The file'} is not a PNG, JPEG or WebP image (judged by its content, not its name).`, [{ path: 'photo', message: 'Expected a PNG, JPEG or WebP image.' }]);
  }
  const one = (v: string[] | undefined) => (v && v.length ? v[0] : undefined);
  const parsed = fieldPhotoFieldsSchema.safeParse({
    kind: one(fields.kind) || undefined, text: one(fields.text), testId: one(fields.testId) || undefined,
  });
  if (!parsed.success) {
    await discard();
    throw new AppError('invalid', 'Invalid request body.', fieldIssues(parsed.error));
  }
  const sha256 = String(part.hash);
  try {
    await adopt(part.filepath, sha256);
  } catch (err) {
    await discard();
    throw storageRefusal(err) ?? err;
  }
  return insertNote(actor, surveyId, trapId, { ...parsed.data, photoSha256: sha256, photoType: type });
}

export async function fieldNotePhoto(surveyId: number, noteId: number): Promise<Response> {
  const note = await FieldNote.findByPk(noteId);
  if (!note || note.surveyId !== surveyId || !note.photoSha256 || !note.photoType) throw notFound('photo');
  const bytes = await readStored(note.photoSha256);
  return new Response(new Uint8Array(bytes), {
    headers: {
      'content-type': note.photoType, 'content-length': String(bytes.length),
      // Stored by hash, so the bytes behind this address never change; private: it is a site's record.
      'cache-control': 'private, max-age=86400', 'x-content-type-options': 'nosniff',
      'content-disposition': `inline; filename="field-note-${note.id}.${note.photoType.split('/')[1]}"`,
    },
  });
}

// ——— the technician's list ———

/**
 * What a technician walks to in a survey: traps with a re-test asked for, traps in service that
 * have no trap-point test yet, and traps that carry notes. A trap not tested with a "not reachable"
 * (or "line out of service") note says so in its standing.
 */
export async function fieldWork(actor: Actor, surveyId: number) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  const [queue, traps, notes] = await Promise.all([
    reviewQueue(surveyId, { page: 1, pageSize: Number.MAX_SAFE_INTEGER }),
    Trap.findAll({ where: { siteId: survey.siteId, status: { [Op.ne]: 'removed' } }, include: [{ model: Area, as: 'area', attributes: ['name'] }], order: [['tag', 'ASC']] }),
    FieldNote.findAll({ where: { surveyId }, order: newestFirst }),
  ]);
  const tested = new Map(queue.items.map((i) => [i.trapId, i]));
  const noteDtos = await dtos(actor, notes);
  const notesOf = new Map<number, FieldNoteDto[]>();
  for (const n of noteDtos) notesOf.set(n.trapId, [...(notesOf.get(n.trapId) ?? []), n]);

  const items = traps.flatMap((trap) => {
    const t = tested.get(trap.id);
    const mine = notesOf.get(trap.id) ?? [];
    const retestPending = t?.state === 'retest_pending';
    const untested = !t && trap.status === 'in_service';
    if (!retestPending && !untested && mine.length === 0) return [];
    const why = !t && mine.find((n) => n.kind === 'not_reachable' || n.kind === 'line_out_of_service');
    const standing = retestPending ? 're-test asked for' : t ? 'tested' : why ? `not tested: ${why.kind === 'not_reachable' ? 'not reachable' : 'line out of service'}` : 'not tested';
    return [{
      trapId: trap.id, tag: trap.tag, areaName: trap.area?.name ?? null, location: trap.location ?? null, trapType: trap.trapType,
      pressureBarg: trap.pressureBarg, tested: !!t, retestPending, latestTestId: t?.latestTestId ?? null, standing, notes: mine,
    }];
  });
  // Re-tests first (someone is waiting on them), then traps still to test, then the rest; by area and tag within.
  const rank = (i: (typeof items)[number]) => (i.retestPending ? 0 : !i.tested ? 1 : 2);
  items.sort((a, b) => rank(a) - rank(b) || (a.areaName ?? '').localeCompare(b.areaName ?? '') || a.tag.localeCompare(b.tag));
  return {
    items, canAdd: mayAdd(actor, survey.status),
    counts: {
      retestPending: items.filter((i) => i.retestPending).length,
      untested: items.filter((i) => !i.tested).length,
      withNotes: items.filter((i) => i.notes.length > 0).length,
    },
  };
}
export type FieldWork = Awaited<ReturnType<typeof fieldWork>>;
