// Script injection through names, in real Chromium: markup typed into a site, area, survey and
// trap location through the API is shown as the text it is on every page that renders it. No
// element is made from it, no dialog opens, no script of it runs, and the pages report no content
// security policy violation (React escapes the text; the policy would block what got through).
import type { BrowserContext, Dialog, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectNoCspViolations, launch, signInThroughPage } from '../support/browser';
import { signInAdmin } from '../support/fixtures';
import { baseUrl, DEMO } from '../support/http';
import { photoForm, TINY_PNG } from '../integration/samples/field-notes';

declare global {
  interface Window { __plumewardPwned?: string[] }
}

const PAYLOAD = {
  site: `<img src=x onerror="(window.__plumewardPwned ||= []).push('site');alert('site')"> Injection Works`,
  area: `</script><script>(window.__plumewardPwned ||= []).push('area');alert('area')</script>`,
  survey: `"><svg onload="(window.__plumewardPwned ||= []).push('survey');alert('survey')"></svg>`,
  location: `<iframe srcdoc="<script>parent.alert('location')</script>"></iframe>{{7*7}}`,
  note: `<img src=x onerror="(window.__plumewardPwned ||= []).push('note')"> outlet side`,
};

/** Elements a payload would have made, had it been parsed as markup. */
const INJECTED = 'img[src="x"], svg[onload], iframe[srcdoc], script:not([src]):not([nonce]):not([type="application/json"])';

describe('script injection through names', () => {
  let context: BrowserContext;
  let siteId: number;
  let surveyId: number;
  let trapId: number;
  let photoUrl: string;
  const dialogs: string[] = [];

  beforeAll(async () => {
    const admin = await signInAdmin();
    const site = await admin.post('/api/sites', {
      name: PAYLOAD.site, code: `XS${Date.now().toString(36).slice(-6).toUpperCase()}`, timeZone: 'Europe/Lisbon', currency: 'EUR', unitSystem: 'si',
    });
    expect(site.status, JSON.stringify(site.body)).toBe(201);
    siteId = site.body.id;
    const area = await admin.post(`/api/sites/${siteId}/areas`, { name: PAYLOAD.area });
    expect(area.body.name).toBe(PAYLOAD.area);
    const trap = await admin.post(`/api/sites/${siteId}/traps`, {
      tag: 'XS-001', areaId: area.body.id, location: PAYLOAD.location, trapType: 'inverted_bucket', pressureBarg: 6,
    });
    expect(trap.status, JSON.stringify(trap.body)).toBe(201);
    trapId = trap.body.id;
    const survey = await admin.post(`/api/sites/${siteId}/surveys`, { name: PAYLOAD.survey, startsOn: '2026-05-01', endsOn: '2026-05-31', status: 'in_progress' });
    expect(survey.status, JSON.stringify(survey.body)).toBe(201);
    surveyId = survey.body.id;
    const note = await admin.request('POST', `/api/surveys/${surveyId}/traps/${trapId}/field-notes/photo`, photoForm(TINY_PNG, 'outlet.png', { text: PAYLOAD.note }));
    expect(note.status, JSON.stringify(note.body)).toBe(201);
    photoUrl = note.body.photo.url;
    ({ context } = await launch());
  });
  afterAll(async () => {
    await context?.close();
  });

  async function adminPage(): Promise<Page> {
    const page = await context.newPage();
    page.on('dialog', (dialog: Dialog) => {
      dialogs.push(`${page.url()}: ${dialog.message()}`);
      void dialog.dismiss();
    });
    await signInThroughPage(page, DEMO.admin.email, DEMO.admin.password);
    return page;
  }

  async function expectLiteral(page: Page, path: string, shown: (keyof typeof PAYLOAD)[]) {
    await page.goto(`${baseUrl()}${path}`);
    await page.waitForLoadState('networkidle');
    const text = (await page.locator('body').textContent()) ?? '';
    for (const key of shown) expect(text, `${path} shows the ${key} name as text`).toContain(PAYLOAD[key]);
    expect(await page.locator(INJECTED).count(), `${path}: elements made from a name`).toBe(0);
    expect(await page.evaluate(() => window.__plumewardPwned ?? []), `${path}: payload scripts that ran`).toEqual([]);
  }

  it('every page that renders the names shows them literally, and nothing of them runs', async () => {
    const page = await adminPage();
    // The register is filled in by the client from the JSON API: wait for its row.
    await page.goto(`${baseUrl()}/sites/${siteId}/traps`);
    await page.locator('[data-testid=trap-table] tbody tr').filter({ hasText: 'XS-001' }).waitFor();

    await expectLiteral(page, '/', ['site']);
    await expectLiteral(page, `/sites/${siteId}`, ['site', 'survey']);
    await expectLiteral(page, `/sites/${siteId}/traps`, ['site', 'area', 'location']);
    await expectLiteral(page, `/sites/${siteId}/traps/${trapId}`, ['site', 'area', 'location', 'note']);
    // The note's photo, from our own API, is drawn under the page policy (img-src 'self').
    const photo = page.locator(`img[src="${photoUrl}"]`);
    await photo.scrollIntoViewIfNeeded();
    await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(1);
    expect(await photo.getAttribute('alt')).toBe(`Photo of XS-001: ${PAYLOAD.note}`);
    await expectLiteral(page, `/sites/${siteId}/traps/${trapId}/edit`, ['site']);
    await expectLiteral(page, `/sites/${siteId}/areas`, ['site', 'area']);
    await expectLiteral(page, `/sites/${siteId}/surveys`, ['site', 'survey']);
    await expectLiteral(page, `/sites/${siteId}/surveys/${surveyId}`, ['site', 'survey']);
    await expectLiteral(page, `/sites/${siteId}/surveys/${surveyId}/review`, ['site', 'survey']);
    await expectLiteral(page, `/sites/${siteId}/surveys/${surveyId}/field`, ['site', 'survey']);

    // The edit form holds the location as the input's value, not as markup.
    await page.goto(`${baseUrl()}/sites/${siteId}/traps/${trapId}/edit`);
    expect(await page.getByLabel('Location').inputValue()).toBe(PAYLOAD.location);

    // Opened on its own, as the thumbnail's link does, under the API's policy (sandbox, nothing runs).
    await page.goto(`${baseUrl()}${photoUrl}`);
    expect(await page.evaluate(() => (document.querySelector('img') as HTMLImageElement | null)?.naturalWidth)).toBe(1);

    expect(dialogs).toEqual([]);
    expectNoCspViolations(page);
    await page.close();
  });
});
