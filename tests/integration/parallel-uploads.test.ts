// Ten uploads at once from ten sessions: all complete, and SQLITE_BUSY never reaches a user.
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, unique } from '../support/http';
import { modelAFileFor, settled, upload } from '../support/uploads';

describe('parallel uploads', () => {
  let sessions: Client[];
  let surveyId: number;
  let tags: string[];
  beforeAll(async () => {
    const admin = await signInAdmin();
    const sites = await demoSites(admin);
    surveyId = (await admin.post(`/api/sites/${sites.own.siteId}/surveys`, { name: unique('Parallel'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    sessions = await Promise.all(Array.from({ length: 10 }, () => newUser(admin, 'technician', [sites.own.siteId]).then((u) => u.client)));
    tags = (await admin.get(`/api/sites/${sites.own.siteId}/traps?status=in_service&pageSize=50`)).body.items.map((t: { tag: string }) => t.tag);
  });

  it('completes every one of them with all their tests', async () => {
    const replies = await Promise.all(sessions.map((client, i) =>
      upload(client, surveyId, tags.slice(i * 5, i * 5 + 5).map((tag) => {
        const f = modelAFileFor(tag);
        return { name: `p${i}-${f.name}`, bytes: (f.bytes as string).replaceAll('2025-04-08T09:', `2025-04-09T0${i}:`) };
      }))));
    expect(replies.map((r) => r.status)).toEqual(Array(10).fill(201));
    const done = await Promise.all(replies.map((r, i) => settled(sessions[i], r.body.id, 60_000)));
    for (const d of done) {
      expect(d.status).toBe('done');
      expect(d.progress.tests).toBe(5);
    }
  });
});
