// A published survey e-mailed to the site's viewers: figures and links, never the file; only
// published surveys; access still checked when the link is opened.
import { beforeAll, describe, expect, it } from 'vitest';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { Client, DEMO, unique } from '../support/http';
import { mailTo } from '../support/mailbox';

describe('survey report by e-mail', () => {
  let admin: Client;
  let sites: Awaited<ReturnType<typeof demoSites>>;
  beforeAll(async () => {
    admin = await signInAdmin();
    sites = await demoSites(admin);
  });

  it("writes to every viewer of the site with the survey's figures and links", async () => {
    const surveys = (await admin.get(`/api/sites/${sites.own.siteId}/surveys`)).body.items as { id: number; name: string; status: string }[];
    const spring = surveys.find((s) => s.status === 'published' && s.name.startsWith('Spring'))!;
    const res = await admin.post(`/api/surveys/${spring.id}/report-email`);
    expect(res.status).toBe(200);
    expect(res.body.recipients).toContainEqual({ email: DEMO.viewer.email, sent: true });
    const [mail] = await mailTo(admin, DEMO.viewer.email, new RegExp(spring.name));
    const summary = (await admin.get(`/api/surveys/${spring.id}/summary`)).body;
    expect(mail.text).toContain(`${summary.figures.total.tested} of ${summary.figures.total.inService} in service`);
    expect(mail.text).toContain(`/api/surveys/${spring.id}/report?format=pdf`);
    expect(mail.html).not.toContain('%PDF');
    // The link is not a key: without a session it answers 401.
    const link = /(http\S+\/api\/surveys\/\d+\/report\?format=pdf)/.exec(mail.text)![1];
    expect((await fetch(link)).status).toBe(401);
  });

  it('refuses a draft survey, and a site without viewers', async () => {
    const draft = (await admin.post(`/api/sites/${sites.own.siteId}/surveys`, { name: unique('Draft'), startsOn: '2026-11-01', endsOn: '2026-11-02', status: 'in_progress' })).body;
    const refused = await admin.post(`/api/surveys/${draft.id}/report-email`);
    expect(refused.status).toBe(409);
    const lonely = (await admin.post('/api/sites', { name: unique('Quiet site'), code: `Q${Date.now().toString(36).slice(-6).toUpperCase()}`, timeZone: 'Europe/Paris', currency: 'EUR', unitSystem: 'si' })).body;
    const survey = (await admin.post(`/api/sites/${lonely.id}/surveys`, { name: 'Empty', startsOn: '2026-11-01', endsOn: '2026-11-02', status: 'in_progress' })).body;
    await admin.post(`/api/surveys/${survey.id}/publish`, { acceptUndecided: true });
    const none = await admin.post(`/api/surveys/${survey.id}/report-email`);
    expect(none.status).toBe(409);
    expect(none.body.error.message).toMatch(/no active viewer/);
    const analyst = (await newUser(admin, 'technician', [lonely.id])).client;
    expect((await analyst.post(`/api/surveys/${survey.id}/report-email`)).status).toBe(403);
  });
});
