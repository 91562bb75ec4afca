// Uploads over real HTTP: files kept as received, layouts recognised by their fingerprint, the
// mapping step for new layouts, problems by file and line, zips within limits, and held-back tags.
import fs from 'node:fs';
import path from 'node:path';
import JSZip from 'jszip';
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { fixtureFile, METERS, modelAFileFor, settled, upload } from '../support/uploads';

type FileRow = { id: number; name: string; entry: string | null; kind: string; status: string; testCount: number; hints: string[]; problems: { code: string; line?: number; severity: string; message: string }[]; fingerprint: string | null };

const expectedB = JSON.parse(fs.readFileSync(path.join(METERS, 'model-b/B_2025-04-08.csv.expected.json'), 'utf8'));

describe('uploads', () => {
  let analyst: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  let surveyId: number;
  const testsOf = async (uploadId: number) => (await analyst.get(`/api/sites/${sites.own.siteId}/tests?uploadId=${uploadId}&figures=full`)).body.items;

  beforeAll(async () => {
    const admin = await signInAdmin();
    sites = await demoSites(admin);
    surveyId = sites.own.surveyId;
    analyst = (await newUser(admin, 'analyst', [sites.own.siteId])).client;
  });

  it('holds a new layout for mapping, reads it once a profile is saved, and recognises it afterwards', async () => {
    // The demo seed knows model B; a meter whose preamble says "Surveyor" instead of "Operator" is a layout of its own.
    const original = fixtureFile('model-b/B_2025-04-08.csv');
    const bDay = { name: 'B_2025-04-08.csv', bytes: Buffer.from(Buffer.from(original.bytes).toString('latin1').replace('Operator:', 'Surveyor:'), 'latin1') };
    const sent = await upload(analyst, surveyId, [bDay]);
    expect(sent.status).toBe(201);
    const waiting = await settled(analyst, sent.body.id);
    expect(waiting.status).toBe('waiting_for_mapping');
    const [file] = waiting.files as FileRow[];
    expect(file.status).toBe('needs_mapping');
    expect(waiting.unknownLayouts).toHaveLength(1);
    expect(waiting.unknownLayouts[0]).toMatchObject({ fingerprint: file.fingerprint, fileIds: [file.id] });
    expect(waiting.unknownLayouts[0].detection).toMatchObject({ delimiter: ';', decimalMark: ',' });

    const definition = JSON.parse(fs.readFileSync(path.join(METERS, 'model-b/model-b.profile.json'), 'utf8'));
    definition.preambleKeys = definition.preambleKeys.map((k: string) => (k === 'Operator' ? 'Surveyor' : k));
    const profile = await analyst.post('/api/instrument-profiles', { name: unique('Model B'), definition });
    expect(profile.status).toBe(201);
    expect(profile.body.fingerprint).toBe(file.fingerprint);
    const applied = await analyst.post(`/api/uploads/${sent.body.id}/apply-profile`, { profileId: profile.body.id });
    expect(applied.status).toBe(200);
    const done = await settled(analyst, sent.body.id);
    expect(done.status).toBe('done');
    const read = (done.files as FileRow[])[0];
    expect(read).toMatchObject({ status: 'processed', testCount: expectedB.tests.length });
    // Every planted problem, at its line (fixtures/meters/model-b/*.expected.json).
    const found = read.problems.map((p) => [p.code, p.line]);
    for (const p of expectedB.problems) expect(found).toContainEqual([p.code, p.line]);

    const tests = await testsOf(sent.body.id);
    expect(tests.map((t: { tag: string; role: string; sampleCount: number }) => [t.tag, t.role, t.sampleCount]))
      .toEqual(expectedB.tests.map((t: { tag: string; role: string; sampleCount: number }) => [t.tag, t.role, t.sampleCount]));
    expect(tests.every((t: { matchStatus: string }) => t.matchStatus === 'matched')).toBe(true);
    const trap7 = tests.find((t: { tag: string; role: string }) => t.tag === 'FV-CIP-007' && t.role === 'trap');
    expect(trap7.figures.reference.available).toBe(true);
    expect(trap7.figures.trap.inRegister).toBe(true);
    expect(trap7.figures.temperature.tsatC).toBeGreaterThan(100);
    expect(trap7.suggestedVerdict).toEqual(trap7.figures.verdict.suggested);

    // The same bytes again are recognised and not counted twice.
    const again = await settled(analyst, (await upload(analyst, surveyId, [bDay])).body.id);
    expect((again.files as FileRow[])[0].status).toBe('duplicate');
    expect(await testsOf(again.id)).toHaveLength(0);

    // Other bytes of the same layout go straight through, no mapping asked.
    const text = Buffer.from(bDay.bytes).toString('latin1').replace('FV-CIP-011', 'FV-CIP-012');
    const next = await settled(analyst, (await upload(analyst, surveyId, [{ name: 'B_next.csv', bytes: Buffer.from(text, 'latin1') }])).body.id);
    expect((next.files as FileRow[])[0]).toMatchObject({ status: 'processed', fingerprint: file.fingerprint });
    expect((await testsOf(next.id)).some((t: { tag: string }) => t.tag === 'FV-CIP-012')).toBe(true);
  });

  it('refuses bad files one by one, with their reasons, without blocking the good one', async () => {
    const sent = await upload(analyst, surveyId, [
      fixtureFile('bad/photo.csv'), fixtureFile('bad/empty.csv'), fixtureFile('bad/header-only.csv'), modelAFileFor('FV-EVP-033'),
    ]);
    const done = await settled(analyst, sent.body.id);
    const byName = new Map((done.files as FileRow[]).map((f) => [f.name, f]));
    expect(byName.get('photo.csv')).toMatchObject({ status: 'failed' });
    expect(byName.get('photo.csv')!.problems.map((p) => p.code)).toContain('file-not-text');
    expect(byName.get('empty.csv')!.status).toBe('failed');
    expect(byName.get('empty.csv')!.problems[0].message).toMatch(/empty/i);
    expect(byName.get('header-only.csv')!.status).toBe('failed');
    const good = (done.files as FileRow[]).find((f) => f.name.startsWith('A_FV-EVP-033'))!;
    expect(good).toMatchObject({ status: 'processed', testCount: 1 });
  });

  it('treats zip entry names as labels: traversal names refused, safe entries read with their folders as hints', async () => {
    const done = await settled(analyst, (await upload(analyst, surveyId, [fixtureFile('zips/traversal.zip')])).body.id);
    const zip = (done.files as FileRow[]).find((f) => f.kind === 'zip')!;
    expect(zip.status).toBe('unpacked');
    const refusedNames = zip.problems.filter((p) => p.severity === 'error').map((p) => p.message).join('\n');
    for (const name of ['../../etc/cron.d/evil.csv', '/var/tmp/abs.csv', 'area/../../up.csv']) expect(refusedNames).toContain(name);
    const entries = (done.files as FileRow[]).filter((f) => f.kind === 'entry');
    expect(entries.map((e) => e.entry)).toEqual(['Tank Farm Tracing/F_SM-TRC-120.txt']);
    expect(entries[0].hints).toEqual(['Tank Farm Tracing']);
    expect(fs.existsSync('/etc/cron.d/evil.csv')).toBe(false);
  });

  it('unpacks a zip of a day in one go: bytes already in the survey, or twice in the zip, are kept once', async () => {
    // A survey of its own: other tests send the same files into the shared one.
    const ownSurvey = await analyst.post(`/api/sites/${sites.own.siteId}/surveys`, { name: unique('Zip day'), startsOn: '2027-05-03', endsOn: '2027-05-04' });
    expect(ownSurvey.status).toBe(201);
    const daySurvey = ownSurvey.body.id as number;
    const loose = modelAFileFor('FV-EVP-031');
    const first = await settled(analyst, (await upload(analyst, daySurvey, [loose])).body.id);
    const looseId = (first.files as FileRow[])[0].id;
    const twice = modelAFileFor('FV-EVP-032');
    const other = modelAFileFor('FV-EVP-033');
    const day = new JSZip();
    day.file('Evaporators/first.csv', twice.bytes);
    day.file('Evaporators/again.csv', twice.bytes);
    day.file('Evaporators/sent-before.csv', loose.bytes);
    day.file('Evaporators/other.csv', other.bytes);
    const bytes = await day.generateAsync({ type: 'uint8array', compression: 'DEFLATE' });
    const done = await settled(analyst, (await upload(analyst, daySurvey, [{ name: 'day.zip', bytes }])).body.id);
    expect(done.status).toBe('done');
    const entries = new Map((done.files as (FileRow & { duplicateOf: number | null })[]).filter((f) => f.kind === 'entry').map((f) => [f.entry, f]));
    const firstEntry = entries.get('Evaporators/first.csv')!;
    expect(firstEntry).toMatchObject({ status: 'processed', testCount: 1, hints: ['Evaporators'], duplicateOf: null });
    expect(entries.get('Evaporators/again.csv')).toMatchObject({ status: 'duplicate', testCount: 0, duplicateOf: firstEntry.id });
    expect(entries.get('Evaporators/sent-before.csv')).toMatchObject({ status: 'duplicate', testCount: 0, duplicateOf: looseId });
    expect(entries.get('Evaporators/other.csv')).toMatchObject({ status: 'processed', testCount: 1 });
    // The zip and its two new entries are counted; duplicates are not.
    expect(done.progress).toMatchObject({ filesTotal: 3, filesDone: 3, tests: 2 });
    expect((await testsOf(done.id)).map((t: { tag: string }) => t.tag).sort()).toEqual(['FV-EVP-032', 'FV-EVP-033']);
  });

  it('reports a truncated zip and stops a zip bomb while it inflates', async () => {
    const bomb = new JSZip();
    bomb.file('day/bomb.csv', new Uint8Array(64 * 1024 * 1024)); // zeros: ~64 KB compressed
    const bombBytes = await bomb.generateAsync({ type: 'uint8array', compression: 'DEFLATE', compressionOptions: { level: 9 } });
    expect(bombBytes.length).toBeLessThan(1024 * 1024);
    const done = await settled(analyst, (await upload(analyst, surveyId, [fixtureFile('zips/truncated.zip'), { name: 'bomb.zip', bytes: bombBytes }])).body.id);
    const byName = new Map((done.files as FileRow[]).filter((f) => f.kind === 'zip').map((f) => [f.name, f]));
    expect(byName.get('truncated.zip')!.status).toBe('failed');
    const bombRow = byName.get('bomb.zip')!;
    expect(bombRow.problems.some((p) => p.severity === 'error' && /200|ratio|inflat/i.test(p.message))).toBe(true);
    expect((done.files as FileRow[]).filter((f) => f.kind === 'entry' && f.name === 'bomb.zip')).toHaveLength(0);
  });

  it('answers 413 for a file or an upload over the limits, and keeps nothing of it', async () => {
    const before = (await analyst.get(`/api/sites/${sites.own.siteId}/uploads`)).body.items.length;
    const big = await upload(analyst, surveyId, [{ name: 'big.csv', bytes: new Uint8Array(9 * 1024 * 1024) }]);
    expect(big.status).toBe(413);
    expect(big.body.error.message).toContain('8 MB');
    const many = await upload(analyst, surveyId, Array.from({ length: 61 }, (_, i) => ({ name: `f${i}.csv`, bytes: `t,${i}\n` })));
    expect(many.status).toBe(413);
    expect(many.body.error.message).toContain('60 files');
    expect((await analyst.get(`/api/sites/${sites.own.siteId}/uploads`)).body.items.length).toBe(before);
  });

  it('refuses uploads into a published survey', async () => {
    const surveys = (await analyst.get(`/api/sites/${sites.own.siteId}/surveys`)).body.items;
    const published = surveys.find((s: { status: string }) => s.status === 'published');
    const res = await upload(analyst, published.id, [modelAFileFor('FV-EVP-034')]);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/published/);
  });

  it('holds back a tag the register does not know until it is created as a trap', async () => {
    const tag = unique('FV-NEW').toUpperCase();
    const sent = await upload(analyst, surveyId, [modelAFileFor(tag)]);
    const waiting = await settled(analyst, sent.body.id);
    expect(waiting.status).toBe('waiting_for_mapping');
    expect(waiting.unmatchedTags).toEqual([{ tag, tests: 1, roles: ['trap'] }]);
    const [before] = await testsOf(sent.body.id);
    expect(before).toMatchObject({ matchStatus: 'unmatched', trapId: null });
    expect(before.figures.trap.inRegister).toBe(false);

    const decided = await analyst.post(`/api/uploads/${sent.body.id}/tags`, { tag, action: 'create', trap: { trapType: 'inverted_bucket', pressureBarg: 10 } });
    expect(decided.status).toBe(200);
    const done = await settled(analyst, sent.body.id);
    expect(done.status).toBe('done');
    const [after] = await testsOf(sent.body.id);
    expect(after.matchStatus).toBe('matched');
    expect(after.figures.trap).toMatchObject({ inRegister: true, type: 'inverted_bucket', pressureBarg: 10 });
    expect(after.figures.temperature.tsatC).toBeCloseTo(184.1, 0); // IF97 Tsat at 11.01 bar abs (references: 10 barg → 184.12 °C)
    const trap = (await analyst.get(`/api/traps/${after.trapId}`)).body;
    expect(trap.tag).toBe(tag);
  });

  it('sends a decimated series for the plot and every reading inside a window', async () => {
    const [test] = await testsOf(sites.own.uploadId);
    const whole = await analyst.get(`/api/tests/${test.id}/series?points=20`);
    expect(whole.body).toMatchObject({ testId: test.id, sampleCount: test.sampleCount, decimated: true });
    expect(whole.body.t.length).toBeLessThanOrEqual(40);
    expect(whole.body.levelDb.length).toBe(whole.body.t.length);
    const window = await analyst.get(`/api/tests/${test.id}/series?from=1&to=2`);
    expect(window.body.decimated).toBe(false);
    expect(window.body.t.every((t: number) => t >= 1 && t <= 2)).toBe(true);
    expect(window.body.t.length).toBe(Math.round(test.sampleRateHz) + 1);
  });
});
