// Work orders in real Chromium: an analyst turns two confirmed failures of a published survey into
// work orders in bulk, the technician marks one done, and a re-test upload verifies it.
import fs from 'node:fs';
import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { saturationTemperatureAtGaugeC } from '@/lib/analysis/saturated-steam';
import { launch, screenshot, signInThroughPage } from '../support/browser';
import { demoSites, MODEL_A, signInAdmin, type SiteIds } from '../support/fixtures';
import { baseUrl, DEMO, signedIn } from '../support/http';
import { ensureProfile, settled, upload } from '../support/uploads';
import { freeCandidate } from '../integration/samples/work-orders';

/** A quiet, hot model A test (a closed trap is a good trap), 30 s at 10 Hz, starting now. */
function quietHotFile(tag: string, pressureBarg: number) {
  const surface = saturationTemperatureAtGaugeC(pressureBarg, 101.325) - 6;
  const start = Date.now() + 1000;
  const rows = ['utc_time,trap_tag,ultrasound_db,surface_temp_c'];
  for (let i = 0; i < 300; i++) rows.push(`${new Date(start + i * 100).toISOString()},${tag},${(14 + ((i * 3) % 5) * 0.3).toFixed(1)},${surface.toFixed(1)}`);
  return { name: `A_${tag}_retest_${start}.csv`, bytes: rows.join('\n') + '\n' };
}

describe('work orders in the browser', () => {
  const contexts: { context: BrowserContext; userDataDir: string }[] = [];
  let own: SiteIds;
  let surveyId: number;
  let picks: { trapId: number; tag: string }[];

  beforeAll(async () => {
    const admin = await signInAdmin();
    ({ own } = await demoSites(admin));
    await ensureProfile(admin, MODEL_A.file, MODEL_A.name);
    surveyId = (await freeCandidate(admin, own.siteId)).surveyId;
    const candidates = (await admin.get(`/api/surveys/${surveyId}/work-order-candidates`)).body.items as { trapId: number; tag: string; order: unknown; verdict: string }[];
    picks = candidates.filter((c) => !c.order).slice(0, 2);
    expect(picks).toHaveLength(2);
  });
  afterAll(async () => {
    for (const c of contexts) {
      await c.context.close();
      fs.rmSync(c.userDataDir, { recursive: true, force: true });
    }
  });

  it('an analyst plans two repairs, the technician marks one done, and a re-test verifies it', async () => {
    const analystBrowser = await launch();
    contexts.push(analystBrowser);
    const page = await analystBrowser.context.newPage();
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    await page.goto(`${baseUrl()}/sites/${own.siteId}/work-orders`);
    await page.getByRole('heading', { name: 'Plan repairs from a survey' }).waitFor();
    await page.locator(`a[href="/sites/${own.siteId}/work-orders/plan/${surveyId}"]`).click();
    await page.getByTestId('candidates').waitFor();
    await page.getByTestId('safety-caution').waitFor();
    await screenshot(page, 'work-orders-plan');

    for (const p of picks) await page.getByLabel(`Pick ${p.tag}`, { exact: true }).check();
    await page.getByLabel('Technician for the picked traps').selectOption({ label: 'Demo Technician' });
    await page.getByLabel('Due date for the picked traps').fill('2030-05-15');
    await page.getByRole('button', { name: 'Apply to picked' }).click();
    await expect.poll(() => page.getByLabel(`Technician for ${picks[1].tag}`).inputValue()).not.toBe('');
    await page.getByLabel(`Action for ${picks[1].tag}`).selectOption('replace');
    await screenshot(page, 'work-orders-plan-picked');
    await page.getByTestId('create-work-orders').click();
    await page.waitForURL(/\/work-orders\?mine=0/);
    const table = page.getByTestId('work-order-table');
    for (const p of picks) await table.getByText(p.tag, { exact: true }).waitFor();
    await screenshot(page, 'work-orders-list-analyst');

    // The technician: their own orders first, opens the first, records the work.
    const techBrowser = await launch();
    contexts.push(techBrowser);
    const tech = await techBrowser.context.newPage();
    await signInThroughPage(tech, DEMO.technician.email, DEMO.technician.password);
    await tech.goto(`${baseUrl()}/sites/${own.siteId}/work-orders`);
    const row = tech.getByTestId('work-order-table').locator('tr', { hasText: picks[0].tag });
    await row.waitFor();
    expect(await tech.getByRole('link', { name: 'Assigned to me' }).getAttribute('aria-current')).toBe('page');
    await row.getByRole('link').first().click();
    await tech.getByTestId('mark-done').waitFor();
    expect(await tech.getByTestId('safety-caution').textContent()).toContain('lockout/tagout');
    expect(await tech.getByTestId('priority').textContent()).toMatch(/Priority\W*(Urgent|High|Normal|Low)/);
    await screenshot(tech, 'work-order-technician');
    await tech.getByLabel(/Repair cost/).fill('240');
    await tech.getByLabel('Notes').fill('Disc and seat replaced; strainer cleaned.');
    await tech.getByRole('button', { name: 'Mark done' }).click();
    await tech.getByText('Done — awaiting re-test').first().waitFor();
    await screenshot(tech, 'work-order-done');
    const orderUrl = tech.url();

    // The re-test, uploaded by the technician after the work: the order is verified.
    const technician = await signedIn(DEMO.technician.email, DEMO.technician.password);
    const trap = (await technician.get(`/api/traps/${picks[0].trapId}`)).body;
    const sent = await upload(technician, own.surveyId, [quietHotFile(trap.tag, trap.pressureBarg)]);
    expect((await settled(technician, sent.body.id)).status).toBe('done');
    const [retest] = (await technician.get(`/api/sites/${own.siteId}/tests?uploadId=${sent.body.id}`)).body.items;
    expect([retest.trapId, retest.suggestedVerdict]).toEqual([picks[0].trapId, 'working']);
    await tech.goto(orderUrl);
    await tech.locator('[data-status=verified]').first().waitFor();
    expect(await tech.getByTestId('work-order-trail').textContent()).toContain('verify by system');
    await screenshot(tech, 'work-order-verified');

    // The trap page lists it.
    await page.goto(`${baseUrl()}/sites/${own.siteId}/traps/${picks[0].trapId}`);
    await page.getByTestId('trap-work-orders').locator('[data-status=verified]').waitFor();
    await screenshot(page, 'trap-work-orders');

    // The site overview counts the verified repair and what it saves a year.
    await page.goto(`${baseUrl()}/sites/${own.siteId}`);
    await page.getByTestId('trend-chart').waitFor();
    const repairs = (await page.getByText(/verified by re-test/).first().textContent())!;
    const verified = Number(/(\d+) verified by re-test/.exec(repairs)![1]);
    expect(verified).toBeGreaterThanOrEqual(1);
    expect(repairs).toMatch(/saved [\d.,]+ (kg|lb)\/h/);
    await screenshot(page, 'site-overview-after-repair');
  });
});
