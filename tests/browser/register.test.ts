// The register in real headless Chromium through the real sign-in page.
import fs from 'node:fs';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, screenshot, signInThroughPage } from '../support/browser';
import { baseUrl, DEMO } from '../support/http';

describe('register in the browser', () => {
  let context: BrowserContext;
  let userDataDir: string;
  beforeAll(async () => {
    ({ context, userDataDir } = await launch());
  });
  afterAll(async () => {
    await context?.close();
    if (userDataDir) fs.rmSync(userDataDir, { recursive: true, force: true });
  });

  async function freshPage(): Promise<Page> {
    await context.clearCookies();
    return context.newPage();
  }

  it('an analyst signs in, filters the register and opens a trap', async () => {
    const page = await freshPage();
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    expect(await page.getByTestId('site-card').count()).toBe(2);
    await screenshot(page, 'analyst-sites');

    await page.getByRole('link', { name: 'Fenwick Vale Creamery' }).click();
    await page.getByRole('link', { name: 'Trap register' }).click();
    await page.getByTestId('trap-count').filter({ hasText: /\d+ traps/ }).waitFor();
    const allCount = Number((await page.getByTestId('trap-count').textContent())!.split(' ')[0]);

    await page.getByLabel('Search tag or location').fill('FV-EVP');
    await page.getByLabel('Trap type').selectOption('inverted_bucket');
    await page.waitForURL(/q=FV-EVP/);
    await page.waitForURL(/trapType=inverted_bucket/);
    await expect.poll(async () => {
      const tags = await page.locator('[data-testid=trap-table] tbody tr td:first-child').allTextContents();
      return tags.length > 0 && tags.every((t) => t.startsWith('FV-EVP'));
    }).toBe(true);
    const types = await page.locator('[data-testid=trap-table] tbody tr td:nth-child(4)').allTextContents();
    expect(new Set(types)).toEqual(new Set(['Inverted bucket']));
    const filteredCount = Number((await page.getByTestId('trap-count').textContent())!.split(' ')[0]);
    expect(filteredCount).toBeLessThan(allCount);
    expect(filteredCount).toBe(types.length);
    await screenshot(page, 'analyst-register-filtered');

    const firstTag = (await page.locator('[data-testid=trap-table] tbody tr td:first-child a').first().textContent())!;
    await page.locator('[data-testid=trap-table] tbody tr td:first-child a').first().click();
    await expect.poll(() => page.getByTestId('trap-tag').textContent()).toBe(firstTag);
    expect(await page.getByRole('link', { name: 'Edit trap' }).count()).toBe(1);
    expect(await page.getByTestId('safety-caution').count()).toBe(1);
    await screenshot(page, 'analyst-trap');
  });

  it('an analyst imports a register CSV after seeing its problems', async () => {
    const page = await freshPage();
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    await page.getByRole('link', { name: 'Saltmarsh Terminal' }).click();
    await page.getByRole('link', { name: 'Import register' }).click();
    const csv = 'tag,area,trap_type,pressure_barg\nSM-TRC-901,Line Tracing,thermodynamic_disc,5\nSM-TRC-902,Line Tracing,bucket,5\n';
    await page.getByTestId('register-file').setInputFiles({ name: 'new-tracers.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByTestId('register-problems').waitFor();
    expect(await page.getByTestId('register-problems').textContent()).toContain('Trap type must be one of');
    const importButton = page.getByRole('button', { name: /^Import 1 trap$/ });
    expect(await importButton.isDisabled()).toBe(true);
    await page.getByLabel(/skip the 1 with problems/).check();
    await screenshot(page, 'analyst-register-import-preview');
    await importButton.click();
    await page.getByRole('heading', { name: 'Imported new-tracers.csv' }).waitFor();
    const res = await page.request.get(`${baseUrl()}/api/sites/2/traps?q=SM-TRC-90`);
    expect((await res.json()).items.map((t: { tag: string }) => t.tag)).toEqual(['SM-TRC-901']);
  });

  it('a viewer sees their one site, read-only, with no write controls', async () => {
    const page = await freshPage();
    await signInThroughPage(page, DEMO.viewer.email, DEMO.viewer.password);
    expect(await page.getByTestId('site-card').count()).toBe(1);
    expect(await page.getByRole('link', { name: 'Saltmarsh Terminal' }).count()).toBe(0);
    expect(await page.getByRole('link', { name: 'Settings' }).count()).toBe(0);

    await page.getByRole('link', { name: 'Fenwick Vale Creamery' }).click();
    expect(await page.getByRole('link', { name: 'Import register' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Trap register' }).click();
    await page.getByTestId('trap-count').filter({ hasText: /\d+ traps/ }).waitFor();
    expect(await page.getByRole('link', { name: 'Add trap' }).count()).toBe(0);
    await page.locator('[data-testid=trap-table] tbody tr td:first-child a').first().click();
    await page.getByTestId('trap-tag').waitFor();
    expect(await page.getByRole('link', { name: 'Edit trap' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Areas' }).click();
    await page.getByRole('columnheader', { name: 'Area' }).waitFor();
    expect(await page.getByRole('button', { name: 'Rename' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Add area' }).count()).toBe(0);
    await screenshot(page, 'viewer-areas');

    const forbidden = await page.goto(`${baseUrl()}/sites/1/traps/new`);
    expect(forbidden?.status()).toBe(404);
    const otherSite = await page.goto(`${baseUrl()}/sites/2`);
    expect(otherSite?.status()).toBe(404);
  });

  it('an admin creates an API token and sees its secret once', async () => {
    const page = await freshPage();
    await signInThroughPage(page, DEMO.admin.email, DEMO.admin.password);
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('link', { name: 'API tokens' }).click();
    // The users page has a Name field too: wait until the tokens page has replaced it.
    await page.getByRole('heading', { name: 'New API token' }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('browser test script');
    await page.getByLabel('Read-only').check();
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = (await page.getByTestId('new-token').textContent())!;
    expect(secret).toMatch(/^pwt_/);
    await screenshot(page, 'admin-token-created');
    const me = await fetch(`${baseUrl()}/api/me`, { headers: { authorization: `Bearer ${secret}` } });
    expect(await me.json()).toMatchObject({ via: 'token', readOnly: true, role: 'admin' });
    await page.reload();
    expect(await page.getByTestId('new-token').count()).toBe(0);
    expect(await page.content()).not.toContain(secret);
  });
});
