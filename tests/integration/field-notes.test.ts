// Field notes over HTTP: who may write and delete them, photos judged by their bytes and size,
// site scoping, the technician's field list, and decision-table row 1 (a "line out of service"
// note makes the suggested verdict "out of service" once the survey's tests are settled again).
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin, type SiteIds } from '../support/fixtures';
import { baseUrl, Client, unique } from '../support/http';
import { modelAFileFor, settled, upload } from '../support/uploads';
import { photoForm, TINY_PNG } from './samples/field-notes';

type Note = { id: number; kind: string; text: string | null; testId: number | null; canDelete: boolean; createdBy: string | null; surveyName: string | null; photo: { url: string; type: string } | null };
type Test = { id: number; trapId: number; tag: string; role: string; suggestedVerdict: string | null };

// A JPEG's first bytes (SOI, then an APP0 "JFIF" marker; ITU-T T.81 Annex B, JFIF 1.02): enough for the signature check.
const JPEG_HEAD = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x02, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0xff, 0xd9]);
const MB = 1024 * 1024;

describe('field notes', () => {
  let admin: Client;
  let own: SiteIds;
  let other: SiteIds;
  let siteId: number;
  let surveyId: number;
  let tech: Client;
  let techName: string;
  let otherTech: Client;
  let analyst: Client;
  let viewer: Client;
  let tested: Record<string, Test>;
  let untestedTrapId: number;
  const notesUrl = (trapId: number, survey = surveyId) => `/api/surveys/${survey}/traps/${trapId}/field-notes`;
  const testOf = async (id: number) => (await admin.get(`/api/tests/${id}`)).body.test as Test & { figures: { verdict: { reasons: string[] } } };

  beforeAll(async () => {
    admin = await signInAdmin();
    ({ own, other } = await demoSites(admin));
    siteId = own.siteId;
    surveyId = (await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Field notes'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    const sent = await upload(admin, surveyId, [modelAFileFor('FV-EVP-035'), modelAFileFor('FV-EVP-036')]);
    expect((await settled(admin, sent.body.id)).status).toBe('done');
    const tests = (await admin.get(`/api/sites/${siteId}/tests?surveyId=${surveyId}&role=trap`)).body.items as Test[];
    tested = Object.fromEntries(tests.map((t) => [t.tag, t]));
    expect(Object.keys(tested).sort()).toEqual(['FV-EVP-035', 'FV-EVP-036']);
    const traps = (await admin.get(`/api/sites/${siteId}/traps?pageSize=50&q=FV-EVP-04`)).body.items as { id: number; tag: string; status: string }[];
    untestedTrapId = traps.find((t) => t.tag === 'FV-EVP-044' && t.status === 'in_service')?.id
      ?? (await admin.post(`/api/sites/${siteId}/traps`, { tag: unique('FV-NR'), trapType: 'thermodynamic_disc', pressureBarg: 6 })).body.id;
    const t = await newUser(admin, 'technician', [siteId]);
    tech = t.client;
    techName = (await tech.get('/api/me')).body.name;
    otherTech = (await newUser(admin, 'technician', [siteId])).client;
    analyst = (await newUser(admin, 'analyst', [siteId])).client;
    viewer = (await newUser(admin, 'viewer', [siteId])).client;
  });

  it('a technician notes a trap on a test; the note lists under the trap, the test and the trap across surveys', async () => {
    const test = tested['FV-EVP-035'];
    const res = await tech.post(notesUrl(test.trapId), { kind: 'insulation_missing', text: 'bare bend before the trap', testId: test.id });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ kind: 'insulation_missing', text: 'bare bend before the trap', testId: test.id, trapId: test.trapId, createdBy: techName, canDelete: true, photo: null });

    const byTrap = await viewer.get(notesUrl(test.trapId));
    expect(byTrap.status).toBe(200);
    expect(byTrap.body.items.map((n: Note) => n.id)).toContain(res.body.id);
    expect(byTrap.body.canAdd).toBe(false); // viewers read, they do not write
    expect(byTrap.body.items.find((n: Note) => n.id === res.body.id).canDelete).toBe(false);

    const byTest = await tech.get(`/api/tests/${test.id}/field-notes`);
    expect(byTest.body.items.map((n: Note) => n.id)).toEqual([res.body.id]);
    expect(byTest.body.canAdd).toBe(true);

    const across = await viewer.get(`/api/traps/${test.trapId}/field-notes`);
    expect(across.body.items.find((n: Note) => n.id === res.body.id)).toMatchObject({ surveyName: expect.stringMatching(/^Field notes/) });

    expect((await viewer.post(notesUrl(test.trapId), { kind: 'remark', text: 'I was there too' })).status).toBe(403);
  });

  it('refuses notes it cannot make sense of, saying which field', async () => {
    const trapId = tested['FV-EVP-035'].trapId;
    const bare = await tech.post(notesUrl(trapId), { kind: 'remark' });
    expect(bare.status).toBe(422);
    expect(bare.body.error.details).toEqual(expect.arrayContaining([expect.objectContaining({ path: 'text' })]));
    expect((await tech.post(notesUrl(trapId), { kind: 'photo' })).status).toBe(422); // photos come through the photo route
    expect((await tech.post(notesUrl(trapId), { kind: 'leaky' })).status).toBe(422);
    const wrongTest = await tech.post(notesUrl(trapId), { kind: 'not_reachable', testId: tested['FV-EVP-036'].id });
    expect(wrongTest.status).toBe(422);
    expect(wrongTest.body.error.details[0]).toMatchObject({ path: 'testId' });
  });

  it('lets the author or an analyst delete a note, and nobody once the survey is published', async () => {
    const trapId = tested['FV-EVP-035'].trapId;
    const mine = (await tech.post(notesUrl(trapId), { kind: 'remark', text: 'mine to take back' })).body as Note;
    const theirs = (await otherTech.post(notesUrl(trapId), { kind: 'remark', text: 'a colleague\'s note' })).body as Note;
    const seen = (await tech.get(notesUrl(trapId))).body.items as Note[];
    expect(seen.find((n) => n.id === theirs.id)!.canDelete).toBe(false);

    const refused = await tech.delete(`/api/surveys/${surveyId}/field-notes/${theirs.id}`);
    expect(refused.status).toBe(403);
    expect((await viewer.delete(`/api/surveys/${surveyId}/field-notes/${mine.id}`)).status).toBe(403);
    expect((await tech.delete(`/api/surveys/${surveyId}/field-notes/${mine.id}`)).body).toEqual({ deleted: mine.id });
    expect((await analyst.delete(`/api/surveys/${surveyId}/field-notes/${theirs.id}`)).status).toBe(200);
    const left = ((await tech.get(notesUrl(trapId))).body.items as Note[]).map((n) => n.id);
    expect(left).not.toContain(mine.id);
    expect(left).not.toContain(theirs.id);
    // A note named under another survey than its own names nothing.
    const kept = (await tech.post(notesUrl(trapId), { kind: 'remark', text: 'stays' })).body as Note;
    expect((await tech.delete(`/api/surveys/${own.surveyId}/field-notes/${kept.id}`)).status).toBe(404);

    // A published survey keeps its notes as they were.
    const closed = (await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Closed'), startsOn: '2026-09-01', endsOn: '2026-09-02', status: 'in_progress' })).body.id as number;
    const before = (await tech.post(notesUrl(trapId, closed), { kind: 'not_reachable' })).body as Note;
    expect((await analyst.post(`/api/surveys/${closed}/publish`, { acceptUndecided: true })).status).toBe(200);
    const late = await tech.post(notesUrl(trapId, closed), { kind: 'remark', text: 'too late' });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toContain('published');
    expect((await analyst.delete(`/api/surveys/${closed}/field-notes/${before.id}`)).status).toBe(409);
    const list = (await tech.get(notesUrl(trapId, closed))).body;
    expect(list.canAdd).toBe(false);
    expect(list.items[0]).toMatchObject({ id: before.id, canDelete: false });
  });

  it("answers 404 for another site's trap, survey or note", async () => {
    const otherNote = (await admin.post(notesUrl(other.trapId, other.surveyId), { kind: 'remark', text: unique('terminal note') })).body as Note;
    expect((await tech.post(notesUrl(other.trapId), { kind: 'not_reachable' })).status).toBe(404); // own survey, other site's trap
    expect((await tech.get(notesUrl(other.trapId))).status).toBe(404);
    expect((await tech.post(notesUrl(other.trapId, other.surveyId), { kind: 'not_reachable' })).status).toBe(404);
    expect((await tech.get(`/api/traps/${other.trapId}/field-notes`)).status).toBe(404);
    expect((await tech.get(`/api/tests/${other.testId}/field-notes`)).status).toBe(404);
    expect((await analyst.delete(`/api/surveys/${other.surveyId}/field-notes/${otherNote.id}`)).status).toBe(404);
    expect((await tech.get(`/api/surveys/${other.surveyId}/field-work`)).status).toBe(404);
    expect((await tech.request('POST', `${notesUrl(other.trapId)}/photo`, photoForm(TINY_PNG))).status).toBe(404);
  });

  it('keeps a PNG or JPEG photo and serves it back within the site only', async () => {
    const trapId = tested['FV-EVP-035'].trapId;
    const png = await tech.request('POST', `${notesUrl(trapId)}/photo`, photoForm(TINY_PNG, 'outlet.png', { text: 'outlet side', testId: String(tested['FV-EVP-035'].id) }));
    expect(png.status, JSON.stringify(png.body)).toBe(201);
    expect(png.body).toMatchObject({ kind: 'photo', text: 'outlet side', testId: tested['FV-EVP-035'].id, photo: { type: 'image/png' } });
    const served = await rawGet(viewer, png.body.photo.url);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/png');
    expect(served.headers.get('x-content-type-options')).toBe('nosniff');
    expect(Buffer.from(await served.arrayBuffer()).equals(TINY_PNG)).toBe(true);

    // A JPEG named .bin is a JPEG: the bytes decide, not the name.
    const jpeg = await tech.request('POST', `${notesUrl(trapId)}/photo`, photoForm(JPEG_HEAD, 'camera.bin', { kind: 'insulation_missing' }));
    expect(jpeg.status, JSON.stringify(jpeg.body)).toBe(201);
    expect(jpeg.body).toMatchObject({ kind: 'insulation_missing', photo: { type: 'image/jpeg' } });

    const outsider = (await newUser(admin, 'viewer', [other.siteId])).client;
    const noteId = png.body.id as number;
    expect((await outsider.get(`/api/surveys/${surveyId}/field-notes/${noteId}/photo`)).status).toBe(404);
    const words = (await tech.post(notesUrl(trapId), { kind: 'remark', text: 'no picture' })).body as Note;
    expect((await tech.get(`/api/surveys/${surveyId}/field-notes/${words.id}/photo`)).status).toBe(404); // a note without a photo
  });

  it('refuses a text file renamed .jpg, and a photo over 10 MB with 413, keeping no note', async () => {
    const trapId = tested['FV-EVP-036'].trapId;
    const count = async () => (await tech.get(notesUrl(trapId))).body.items.length as number;
    const before = await count();
    const renamed = await tech.request('POST', `${notesUrl(trapId)}/photo`, photoForm('tag,level\nFV-EVP-036,40\n', 'photo.jpg'));
    expect(renamed.status).toBe(422);
    expect(renamed.body.error.message).toContain('not a PNG, JPEG or WebP image');
    const big = Buffer.alloc(10 * MB + 1);
    TINY_PNG.copy(big);
    const huge = await tech.request('POST', `${notesUrl(trapId)}/photo`, photoForm(big, 'huge.png'));
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe('too_large');
    expect(huge.body.error.message).toContain('10 MB');
    const notMultipart = await tech.post(`${notesUrl(trapId)}/photo`, { photo: 'x' });
    expect(notMultipart.status).toBe(422);
    expect(await count()).toBe(before);
  });

  it('turns the suggested verdict into "out of service" for a line-out-of-service note, and back when it goes', async () => {
    const test = tested['FV-EVP-036'];
    const original = (await testOf(test.id)).suggestedVerdict;
    expect(original).not.toBe('out_of_service');
    const note = await tech.post(notesUrl(test.trapId), { kind: 'line_out_of_service', text: 'isolated for a flange repair' });
    expect(note.status).toBe(201);
    await expect.poll(async () => (await testOf(test.id)).suggestedVerdict, { timeout: 20_000, interval: 200 }).toBe('out_of_service');
    const detail = await testOf(test.id);
    expect(detail.figures.verdict.reasons).toContain('a field note says the line is out of service');
    const queue = (await analyst.get(`/api/surveys/${surveyId}/review-queue`)).body.items as { tag: string; suggested: string }[];
    expect(queue.find((i) => i.tag === 'FV-EVP-036')!.suggested).toBe('out_of_service');
    // The other trap of the same upload is not touched.
    expect((await testOf(tested['FV-EVP-035'].id)).suggestedVerdict).toBe(tested['FV-EVP-035'].suggestedVerdict);

    expect((await tech.delete(`/api/surveys/${surveyId}/field-notes/${note.body.id}`)).status).toBe(200);
    await expect.poll(async () => (await testOf(test.id)).suggestedVerdict, { timeout: 20_000, interval: 200 }).toBe(original);
  });

  it("lists the technician's field work: re-tests asked for, traps not tested (and why), traps with notes", async () => {
    const retest = tested['FV-EVP-035'];
    expect((await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: retest.trapId, action: 'retest', reason: 'too short' })).status).toBe(200);
    expect((await tech.post(notesUrl(untestedTrapId), { kind: 'not_reachable', text: 'behind the scaffold' })).status).toBe(201);
    const work = await tech.get(`/api/surveys/${surveyId}/field-work`);
    expect(work.status).toBe(200);
    type Item = { trapId: number; tag: string; standing: string; tested: boolean; retestPending: boolean; notes: Note[] };
    const items = work.body.items as Item[];
    expect(items[0]).toMatchObject({ trapId: retest.trapId, standing: 're-test asked for', retestPending: true });
    expect(items.find((i) => i.trapId === untestedTrapId)).toMatchObject({ standing: 'not tested: not reachable', tested: false });
    // FV-EVP-036 is tested and not awaiting a re-test, yet listed: it carries notes (its line-out note was deleted; add one).
    await tech.post(notesUrl(tested['FV-EVP-036'].trapId), { kind: 'remark', text: 'drain valve passing' });
    const again = (await tech.get(`/api/surveys/${surveyId}/field-work`)).body;
    expect(again.items.find((i: Item) => i.trapId === tested['FV-EVP-036'].trapId)).toMatchObject({ standing: 'tested', tested: true });
    const untested = again.items.filter((i: Item) => !i.tested);
    expect(untested.length).toBe(again.counts.untested);
    expect(untested.length).toBeGreaterThan(10); // the rest of the register in service, still to test
    expect(again.counts.retestPending).toBe(1);
    expect(again.canAdd).toBe(true);
    expect((await viewer.get(`/api/surveys/${surveyId}/field-work`)).body.canAdd).toBe(false);
  });
});

/** A binary reply (a photo) with the client's session: the test client reads replies as text. */
function rawGet(client: Client, path: string) {
  const cookies = (client as unknown as { cookies: Map<string, string> }).cookies;
  return fetch(baseUrl() + path, { headers: { cookie: [...cookies].map(([k, v]) => `${k}=${v}`).join('; ') } });
}
