// Records the app tests build on, created through the API as an admin would.
import type { Role } from '@/lib/domain/vocabulary';
import { Client, DEMO, signedIn, unique } from './http';
import { ensureProfile, modelAFileFor, settled, upload } from './uploads';

export type SiteIds = { siteId: number; areaId: number; trapId: number; surveyId: number; uploadId: number; testId: number };

export const MODEL_A = { file: 'model-a/model-a.profile.json', name: 'Model A (tests)' };

/** The demo's two sites by code, with one area, trap and survey each (FV = own, SM = other). */
export async function demoSites(admin: Client): Promise<{ own: SiteIds; other: SiteIds }> {
  const sites = (await admin.get('/api/sites')).body.items as { id: number; code: string }[];
  const ids = async (code: string): Promise<SiteIds> => {
    const siteId = sites.find((s) => s.code === code)!.id;
    const areaId = (await admin.get(`/api/sites/${siteId}/areas`)).body.items[0].id;
    const trapId = (await admin.get(`/api/sites/${siteId}/traps?pageSize=1`)).body.items[0].id;
    const surveys = (await admin.get(`/api/sites/${siteId}/surveys`)).body.items as { id: number; status: string }[];
    const surveyId = surveys.find((s) => s.status === 'in_progress')!.id;
    // One imported test per site, of a tag the register knows, in an upload of the admin's own
    // (the demo seed's uploads are the analyst's). Imported once per run: the same bytes again
    // would only be recognised as a duplicate.
    const tests = (await admin.get(`/api/sites/${siteId}/tests?surveyId=${surveyId}&trapId=${trapId}`)).body.items as { id: number; uploadId: number }[];
    let test: { id: number; uploadId: number } | undefined;
    for (const t of tests) {
      // An earlier test file may have asked for the upload to be read again: wait until it is.
      const detail = await settled(admin, t.uploadId, 60_000);
      if (detail.createdBy === 'Demo Admin') {
        test = (await admin.get(`/api/sites/${siteId}/tests?uploadId=${t.uploadId}&trapId=${trapId}`)).body.items[0];
        if (test) break;
      }
    }
    if (!test) {
      const trapTag = (await admin.get(`/api/traps/${trapId}`)).body.tag;
      // Bytes of their own (a later day), so an earlier run's copy cannot make it a duplicate.
      const file = modelAFileFor(trapTag);
      const stamp = new Date(Date.now()).toISOString().slice(0, 13);
      const bytes = (file.bytes as string).replaceAll('2025-04-08T09', stamp);
      const sent = await upload(admin, surveyId, [{ name: file.name, bytes }]);
      const done = await settled(admin, sent.body.id);
      test = (await admin.get(`/api/sites/${siteId}/tests?uploadId=${done.id}`)).body.items[0];
    }
    if (!test) throw new Error(`No test of trap ${trapId} could be imported for site ${siteId}.`);
    return { siteId, areaId, trapId, surveyId, uploadId: test.uploadId, testId: test.id };
  };
  await ensureProfile(admin, MODEL_A.file, MODEL_A.name);
  return { own: await ids('FV'), other: await ids('SM') };
}

/** A new user of a role, member of the given sites, already signed in. */
export async function newUser(admin: Client, role: Role, siteIds: number[]) {
  const email = `${unique(role)}@plumeward.example`.toLowerCase();
  const password = 'a-long-test-password';
  const created = await admin.post('/api/users', { email, name: `Test ${role}`, role, password, siteIds });
  if (created.status !== 201) throw new Error(`Could not create user: ${JSON.stringify(created.body)}`);
  return { id: created.body.id as number, email, password, client: await signedIn(email, password) };
}

export const signInAdmin = () => signedIn(DEMO.admin.email, DEMO.admin.password);
