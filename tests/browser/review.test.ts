// The analyst's review in real Chromium: the queue, the chart drawn, three traps decided by
// keyboard (confirm, override with a reason, re-test), and each decision in the trail.
import fs from 'node:fs';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, screenshot, signInThroughPage } from '../support/browser';
import { demoSites, signInAdmin } from '../support/fixtures';
import { baseUrl, DEMO, unique } from '../support/http';
import { fixtureFile, modelAFileFor, settled, upload } from '../support/uploads';

/** Non-background pixels in the chart's canvas: proof that uPlot drew the series. */
async function drawnPixels(page: Page): Promise<number> {
  return page.evaluate(() => {
    const canvas = document.querySelector('[data-testid=test-chart] canvas') as HTMLCanvasElement | null;
    if (!canvas) return 0;
    const { data } = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height);
    let inked = 0;
    for (let i = 0; i < data.length; i += 4) if (data[i + 3] > 0 && (data[i] < 200 || data[i + 1] < 200)) inked++;
    return inked;
  });
}

describe('review in the browser', () => {
  let context: BrowserContext;
  let userDataDir: string;
  let siteId: number;
  let surveyId: number;

  beforeAll(async () => {
    const admin = await signInAdmin();
    siteId = (await demoSites(admin)).own.siteId;
    surveyId = (await admin.post(`/api/sites/${siteId}/surveys`, { name: unique('Browser review'), startsOn: '2026-11-01', endsOn: '2026-12-31', status: 'in_progress' })).body.id;
    const sent = await upload(admin, surveyId, [
      fixtureFile('model-a/A_FV-EVP-031_20250408T091403.csv'), fixtureFile('model-a/A_FV-EVP-031-REF_20250408T091452.csv'),
      modelAFileFor('FV-EVP-041'), modelAFileFor('FV-EVP-042'),
    ]);
    expect((await settled(admin, sent.body.id)).status).toBe('done');
    ({ context, userDataDir } = await launch());
  });
  afterAll(async () => {
    await context?.close();
    if (userDataDir) fs.rmSync(userDataDir, { recursive: true, force: true });
  });

  it('an analyst reviews three traps by keyboard, and the trail shows each action', async () => {
    const page = await context.newPage();
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    await page.goto(`${baseUrl()}/sites/${siteId}/surveys/${surveyId}/review`);
    await page.getByTestId('review-progress').filter({ hasText: '0 of 3 reviewed' }).waitFor();
    await page.getByTestId('test-panel').waitFor();
    await expect.poll(() => drawnPixels(page), { timeout: 10_000 }).toBeGreaterThan(500);
    expect(await page.getByTestId('key-legend').textContent()).toContain('confirm the suggestion');
    await screenshot(page, 'review-queue');

    const current = async () => (await page.locator('[data-testid=test-panel] h2').textContent())!.trim();
    const first = await current();
    await page.keyboard.press('c');
    await page.getByTestId('review-progress').filter({ hasText: '1 of 3 reviewed' }).waitFor();
    await expect.poll(current).not.toBe(first);

    const second = await current();
    await page.keyboard.press('o');
    await page.getByLabel('Override verdict').selectOption('leaking');
    await page.getByLabel('Reason').fill('hissing at the outlet on the second visit');
    await page.getByRole('button', { name: 'Save override' }).click();
    await page.getByTestId('review-progress').filter({ hasText: '2 of 3 reviewed' }).waitFor();
    await expect.poll(current).not.toBe(second);

    const third = await current();
    expect(new Set([first, second, third]).size).toBe(3);
    await page.keyboard.press('r');
    await page.getByText('1 re-test asked').waitFor();

    // Back up the list to the overridden trap: its trail tells who did what and why.
    const tags = await page.locator('[data-testid=review-list] li .tag-text').allTextContents();
    await page.locator('[data-testid=review-list] li button').nth(tags.indexOf(second)).click();
    await expect.poll(current).toBe(second);
    await page.getByTestId('verdict-trail').filter({ hasText: 'override' }).waitFor();
    const trail = (await page.getByTestId('verdict-trail').textContent())!;
    expect(trail).toContain('override');
    expect(trail).toContain('leaking');
    expect(trail).toContain('hissing at the outlet on the second visit');
    expect(trail).toContain('Demo Analyst');
    await screenshot(page, 'review-overridden');

    const state = await fetch(`${baseUrl()}/api/surveys/${surveyId}/review-queue`, { headers: { cookie: (await context.cookies()).map((c) => `${c.name}=${c.value}`).join('; ') } });
    const items = (await state.json()).items as { tag: string; state: string; verdict: string | null }[];
    const byTag = new Map(items.map((i) => [i.tag, i]));
    expect(byTag.get(first)!.state).toBe('confirmed');
    expect(byTag.get(second)).toMatchObject({ state: 'overridden', verdict: 'leaking' });
    expect(byTag.get(third)!.state).toBe('retest_pending');
  });

  it('a viewer reads the queue without decision controls', async () => {
    await context.clearCookies();
    const page = await context.newPage();
    await signInThroughPage(page, DEMO.viewer.email, DEMO.viewer.password);
    await page.goto(`${baseUrl()}/sites/${siteId}/surveys/${surveyId}/review`);
    await page.getByTestId('test-panel').waitFor();
    expect(await page.getByRole('button', { name: /Confirm/ }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /Override/ }).count()).toBe(0);
    expect(await page.getByTestId('key-legend').textContent()).not.toContain('confirm');
  });
});
