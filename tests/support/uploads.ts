// Uploading meter files to the running app, as the upload page and scripts do.
import fs from 'node:fs';
import path from 'node:path';
import type { Client } from './http';

export const METERS = path.resolve(__dirname, '../../fixtures/meters');

export type FilePart = { name: string; bytes: Uint8Array | string };

export function fixtureFile(relative: string): FilePart {
  return { name: path.basename(relative), bytes: fs.readFileSync(path.join(METERS, relative)) };
}

export function multipart(files: FilePart[]): FormData {
  const form = new FormData();
  for (const f of files) form.append('files', new Blob([typeof f.bytes === 'string' ? f.bytes : Buffer.from(f.bytes)]), f.name);
  return form;
}

export async function upload(client: Client, surveyId: number, files: FilePart[]) {
  return client.request('POST', `/api/surveys/${surveyId}/uploads`, multipart(files));
}

const BUSY = new Set(['received', 'queued', 'processing']);

/** Polls an upload until the background import has finished with it. */
export async function settled(client: Client, uploadId: number, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await client.get(`/api/uploads/${uploadId}`);
    if (res.status !== 200) throw new Error(`upload ${uploadId}: ${res.status} ${JSON.stringify(res.body)}`);
    if (!BUSY.has(res.body.status)) return res.body;
    if (Date.now() > deadline) throw new Error(`upload ${uploadId} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** The profile of a fixture layout (its exported JSON), saved once under a given name. */
export async function ensureProfile(client: Client, fixtureProfile: string, name: string) {
  const existing = (await client.get('/api/instrument-profiles')).body.items.find((p: { name: string }) => p.name === name);
  if (existing) return existing;
  const definition = JSON.parse(fs.readFileSync(path.join(METERS, fixtureProfile), 'utf8'));
  const res = await client.post('/api/instrument-profiles', { name, fingerprint: definition.fingerprint, definition });
  if (res.status !== 201) throw new Error(`profile ${name}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** A model A file (one test per file) for a tag of our choosing. */
export function modelAFileFor(tag: string): FilePart {
  const source = fixtureFile('model-a/A_FV-EVP-032_20250408T092010.csv');
  const text = Buffer.from(source.bytes).toString('utf8').replaceAll('FV-EVP-032', tag);
  return { name: `A_${tag}_${Date.now()}.csv`, bytes: text };
}

/**
 * A large upload for a site's demo survey of its own: `count` model A files, each a different
 * test (the site's traps in service, read again later in the day), so that an import of it takes
 * long enough for a test to step in while files are still waiting.
 */
export async function startLargeUpload(client: Client, siteCode: string, label: string, count = 400) {
  const site = (await client.get('/api/sites')).body.items.find((s: { code: string }) => s.code === siteCode);
  const survey = (await client.post(`/api/sites/${site.id}/surveys`, { name: `${label} survey`, startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body;
  const tags = (await client.get(`/api/sites/${site.id}/traps?status=in_service&pageSize=500`)).body.items.map((t: { tag: string }) => t.tag);
  const files: FilePart[] = [];
  for (let round = 0; files.length < count; round++) {
    for (const tag of tags) {
      if (files.length >= count) break;
      const file = modelAFileFor(tag);
      files.push({ name: `${label}-${round}-${file.name}`, bytes: (file.bytes as string).replaceAll('2025-04-08T09:', `2025-04-08T1${round}:`) });
    }
  }
  const sent = await upload(client, survey.id, files);
  if (sent.status !== 201) throw new Error(`upload: ${sent.status} ${JSON.stringify(sent.body)}`);
  const uploadId = sent.body.id as number;
  // Returns once a few files are in: the rest are still waiting.
  const deadline = Date.now() + 30_000;
  while ((await client.get(`/api/uploads/${uploadId}`)).body.progress.filesDone < 5 && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, 20));
  }
  return { files, uploadId };
}
