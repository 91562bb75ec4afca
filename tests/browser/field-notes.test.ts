// The field view in real Chromium: a technician marks a trap "not reachable" from the survey's
// field list, and the analyst sees that note in the review queue's test panel.
import fs from 'node:fs';
import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, screenshot, signInThroughPage } from '../support/browser';
import { demoSites, newUser, signInAdmin } from '../support/fixtures';
import { baseUrl, DEMO, signedIn, unique } from '../support/http';
import { modelAFileFor, settled, upload } from '../support/uploads';

describe('field notes in the browser', () => {
  let context: BrowserContext;
  let userDataDir: string;
  let siteId: number;
  let surveyId: number;
  let technician: { email: string; password: string };

  beforeAll(async () => {
    const admin = await signInAdmin();
    siteId = (await demoSites(admin)).own.siteId;
    surveyId = (await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Field walk'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    const sent = await upload(admin, surveyId, [modelAFileFor('FV-EVP-037')]);
    expect((await settled(admin, sent.body.id)).status).toBe('done');
    const [test] = (await admin.get(`/api/sites/${siteId}/tests?surveyId=${surveyId}&role=trap`)).body.items;
    // The analyst asks for a re-test, so the trap heads the technician's list.
    const analyst = await signedIn(DEMO.analyst.email, DEMO.analyst.password);
    expect((await analyst.post(`/api/surveys/${surveyId}/verdicts`, { trapId: test.trapId, action: 'retest', reason: 'reading cut short' })).status).toBe(200);
    technician = await newUser(admin, 'technician', [siteId]);
    ({ context, userDataDir } = await launch());
  });
  afterAll(async () => {
    await context?.close();
    if (userDataDir) fs.rmSync(userDataDir, { recursive: true, force: true });
  });

  it('a technician notes "not reachable" on the field page; the analyst sees it in the test panel', async () => {
    const page = await context.newPage();
    await signInThroughPage(page, technician.email, technician.password);
    await page.goto(`${baseUrl()}/sites/${siteId}/surveys/${surveyId}/field`);
    await page.getByTestId('safety-caution').waitFor();
    const retest = page.locator('[data-testid=field-trap][data-tag="FV-EVP-037"]');
    await retest.getByTestId('standing').filter({ hasText: 're-test asked for' }).waitFor();
    await screenshot(page, 'field-view-retests');

    // A trap still to test, marked not reachable with one button.
    await page.getByRole('tab', { name: /Not tested/ }).click();
    await page.getByLabel('Find a trap').fill('FV-EVP-038');
    const untested = page.locator('[data-testid=field-trap][data-tag="FV-EVP-038"]');
    await untested.getByRole('button', { name: 'Not reachable' }).click();
    await untested.getByTestId('standing').filter({ hasText: 'not tested: not reachable' }).waitFor();
    expect(await untested.getByTestId('field-note-kind').textContent()).toBe('Not reachable');

    // On the re-test trap: the full form, with words.
    await page.getByRole('tab', { name: /Re-tests/ }).click();
    await page.getByLabel('Find a trap').fill('');
    await retest.getByRole('button', { name: 'Notes…' }).click();
    await retest.getByRole('button', { name: 'Add a note' }).click();
    await retest.getByLabel('Note kind').selectOption('not_reachable');
    await retest.getByLabel('Note text').fill('scaffold taken down, trap 4 m up');
    await retest.getByRole('button', { name: 'Add note' }).click();
    await retest.getByTestId('field-note').filter({ hasText: 'scaffold taken down' }).waitFor();
    await screenshot(page, 'field-view-note-added');
    await page.close();

    await context.clearCookies();
    const analystPage = await context.newPage();
    await signInThroughPage(analystPage, DEMO.analyst.email, DEMO.analyst.password);
    await analystPage.goto(`${baseUrl()}/sites/${siteId}/surveys/${surveyId}/review`);
    const notes = analystPage.locator('[data-testid=test-panel] [data-testid=field-notes]');
    await notes.getByTestId('field-note').filter({ hasText: 'scaffold taken down' }).waitFor();
    expect(await notes.getByTestId('field-note-kind').first().textContent()).toBe('Not reachable');
    await notes.scrollIntoViewIfNeeded();
    await screenshot(analystPage, 'field-note-in-test-panel');
  });
});
