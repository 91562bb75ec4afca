import type { FIELD_NOTE_ROUTES } from '@/lib/api/field-note-routes';
import { Client, unique } from '../../support/http';
import type { SiteIds } from '../../support/fixtures';
import type { Sample, SampleContext } from './sample';

/** A 1×1 PNG (the smallest image the photo route accepts). */
export const TINY_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64');

export function photoForm(bytes: Uint8Array | string, name = 'trap.png', fields: Record<string, string> = {}): FormData {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('photo', new Blob([typeof bytes === 'string' ? bytes : Buffer.from(bytes)]), name);
  return form;
}

/** Looked up at call time: re-processing an upload (another sample) stores its tests anew. */
async function currentTestId(admin: Client, s: SiteIds): Promise<number> {
  const tests = (await admin.get(`/api/sites/${s.siteId}/tests?surveyId=${s.surveyId}&trapId=${s.trapId}&role=trap&pageSize=1`)).body.items as { id: number }[];
  return tests[0]?.id ?? s.testId;
}

const notesOf = (s: SiteIds) => `/api/surveys/${s.surveyId}/traps/${s.trapId}/field-notes`;

async function remark(client: Client, s: SiteIds) {
  const res = await client.post(notesOf(s), { kind: 'remark', text: unique('lagging loose at the inlet') });
  return res.status === 201 ? (res.body.id as number) : null;
}

/**
 * A note the caller of the matrix may delete. Technicians delete only their own notes, and the
 * matrix's technician is the newest technician of the site (its users are made just before it
 * runs, and app test files run one at a time): the note is written with an API token of theirs.
 * Admins and analysts may delete any note, so theirs is the same note.
 */
async function deletableNote(s: SiteIds, { admin }: SampleContext) {
  const users = (await admin.get('/api/users')).body.items as { id: number; role: string; status: string; siteIds: number[] }[];
  const technician = users.filter((u) => u.role === 'technician' && u.status === 'active' && u.siteIds.includes(s.siteId)).sort((a, b) => b.id - a.id)[0];
  if (technician) {
    const token = await admin.post('/api/api-tokens', { name: unique('field-notes sample'), userId: technician.id });
    const id = await remark(new Client(token.body.secret), s);
    if (id) return id;
  }
  return (await remark(admin, s))!;
}

export const FIELD_NOTE_SAMPLES: Record<keyof typeof FIELD_NOTE_ROUTES, Sample> = {
  createFieldNote: async (s, { admin }) => ({ params: { surveyId: s.surveyId, trapId: s.trapId }, body: { kind: 'insulation_missing', text: unique('bare elbow'), testId: await currentTestId(admin, s) } }),
  listTrapFieldNotes: (s) => ({ params: { surveyId: s.surveyId, trapId: s.trapId } }),
  uploadFieldNotePhoto: (s) => ({ params: { surveyId: s.surveyId, trapId: s.trapId }, body: photoForm(TINY_PNG, 'trap.png', { text: 'outlet side' }) }),
  listTestFieldNotes: async (s, { admin }) => ({ params: { testId: await currentTestId(admin, s) } }),
  listTrapNotesAcrossSurveys: (s) => ({ params: { trapId: s.trapId } }),
  getFieldNotePhoto: async (s, { admin }) => {
    const res = await admin.request('POST', `${notesOf(s)}/photo`, photoForm(TINY_PNG));
    return { params: { surveyId: s.surveyId, noteId: res.body.id } };
  },
  deleteFieldNote: async (s, ctx) => ({ params: { surveyId: s.surveyId, noteId: await deletableNote(s, ctx) } }),
  fieldWork: (s) => ({ params: { surveyId: s.surveyId } }),
};
