// Uploads and the column-mapping wizard in real headless Chromium, through the real sign-in.
// Each file is made unique to this run (its bytes and, for the layout to map, one preamble key),
// so no other test's profiles or uploads decide what this one sees, whatever the order.
import fs from 'node:fs';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launch, screenshot, signInThroughPage } from '../support/browser';
import { baseUrl, DEMO, unique } from '../support/http';
import { METERS } from '../support/uploads';

type Part = { name: string; mimeType: string; buffer: Buffer };

/** The model B day file under a layout of its own: one extra preamble key changes its header fingerprint. */
function modelBVariant(key: string, run: string): Part {
  const bytes = fs.readFileSync(path.join(METERS, 'model-b/B_2025-04-08.csv'));
  return { name: `B_${run}.csv`, mimeType: 'text/csv', buffer: Buffer.concat([Buffer.from(`${key}: ${run}\r\n`, 'latin1'), bytes]) };
}

/** A model A file whose bytes no other upload has (one level reading differs). */
function modelAUnique(run: string): Part {
  const text = fs.readFileSync(path.join(METERS, 'model-a/A_FV-EVP-032_20250408T092010.csv'), 'utf8');
  const tenth = 1 + (Number.parseInt(run.replace(/\D/g, '').slice(-3) || '7', 10) % 9);
  return { name: `A_FV-EVP-032_${run}.csv`, mimeType: 'text/csv', buffer: Buffer.from(text.replace(',70.1,', `,70.${tenth}5,`), 'utf8') };
}

async function siteIdOf(page: Page, code: string): Promise<number> {
  const res = await page.request.get(`${baseUrl()}/api/sites`);
  return ((await res.json()).items as { id: number; code: string }[]).find((s) => s.code === code)!.id;
}

/** Puts files into the drop zone's input, sends them and opens the new upload's page. */
async function uploadThroughPage(page: Page, siteId: number, files: Part[]) {
  await page.goto(`${baseUrl()}/sites/${siteId}/uploads`);
  // The picker button is enabled once the page has hydrated: only then does the input react.
  await page.getByRole('button', { name: 'Choose files…' }).and(page.locator(':enabled')).waitFor();
  await page.getByTestId('upload-input').setInputFiles(files);
  await page.getByTestId('picked-files').waitFor();
  expect(await page.locator('[data-testid=picked-files] tbody tr').count()).toBe(files.length);
  await screenshot(page, `uploads-picked-${files.length}`);
  await page.getByRole('button', { name: new RegExp(`^Upload ${files.length} files?`) }).click();
  const open = page.getByRole('link', { name: /^Open upload #\d+$/ });
  await open.waitFor();
  await open.click();
  await page.getByTestId('upload-progress').waitFor();
}

/** Waits until the background import has settled (no longer queued or processing). */
async function settledStatus(page: Page): Promise<string> {
  let status = '';
  await expect.poll(async () => {
    status = (await page.getByTestId('upload-status').first().textContent()) ?? '';
    return /Queued|Processing|Received/.test(status);
  }, { timeout: 30_000 }).toBe(false);
  return status;
}

async function canvasInkedPixels(page: Page): Promise<number> {
  return page.locator('[data-testid=preview-chart] canvas').first().evaluate((canvas: HTMLCanvasElement) => {
    const ctx = canvas.getContext('2d')!;
    const { data } = ctx.getImageData(0, 0, canvas.width, canvas.height);
    let inked = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] > 0) inked++;
    return inked;
  });
}

describe('uploads and the mapping wizard in the browser', () => {
  let context: BrowserContext;
  let userDataDir: string;
  beforeAll(async () => {
    ({ context, userDataDir } = await launch());
  });
  afterAll(async () => {
    await context?.close();
    fs.rmSync(userDataDir, { recursive: true, force: true });
  });

  async function freshPage(): Promise<Page> {
    await context.clearCookies();
    return context.newPage();
  }

  it('an analyst uploads two layouts, maps the unknown one through the wizard (resuming after a refresh) and sees the tests', async () => {
    const run = unique('wz');
    const page = await freshPage();
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    const siteId = await siteIdOf(page, 'FV');
    const fileB = modelBVariant('Wizard check', run);
    await uploadThroughPage(page, siteId, [modelAUnique(run), fileB]);

    expect(await settledStatus(page)).toContain('Waiting for a column mapping');
    await page.getByTestId('unknown-layouts').waitFor();
    expect(await page.getByTestId('waits-for-analyst').count()).toBe(0);
    await screenshot(page, 'analyst-upload-waiting');

    const layout = page.locator('[data-testid=unknown-layouts] li', { hasText: fileB.name });
    await layout.getByRole('link', { name: 'Map this layout' }).click();
    await page.waitForURL(/\/map\/hf1%3A[0-9a-f]{32}\/format$/);

    // Step 1: the detected format is shown and adjustable.
    await page.locator('[data-testid=mapping-wizard][data-step=format]').waitFor();
    expect(await page.getByTestId('setting-delimiter').inputValue()).toBe(';');
    expect(await page.getByTestId('setting-decimal').inputValue()).toBe(',');
    expect(await page.getByTestId('format-preview').textContent()).toContain('FV-CIP-007');
    expect(await page.getByTestId('preamble').textContent()).toContain('Wizard check');
    await screenshot(page, 'analyst-wizard-format');

    // Step 2: columns, with the live preview drawn by uPlot.
    await page.getByRole('button', { name: /^Next: Columns and units/ }).click();
    await page.locator('[data-testid=mapping-wizard][data-step=columns]').waitFor();
    expect(page.url()).toMatch(/\/columns$/);
    expect(await page.getByTestId('setting-temperature-unit').inputValue()).toBe('F');
    await page.locator('[data-testid=preview-chart] canvas').first().waitFor();
    await expect.poll(() => canvasInkedPixels(page)).toBeGreaterThan(500);
    expect(await page.getByTestId('mapping-preview').textContent()).toContain('FV-CIP-007');

    // An edit is kept on the server: a refresh lands on the same step with it.
    await page.getByTestId('setting-offset').fill('1.5');
    await page.getByTestId('draft-state').filter({ hasText: 'Draft saved on the server' }).waitFor();
    await screenshot(page, 'analyst-wizard-columns');
    await page.reload();
    await page.locator('[data-testid=mapping-wizard][data-step=columns]').waitFor();
    expect(await page.getByTestId('setting-offset').inputValue()).toBe('1.5');
    await page.locator('[data-testid=preview-chart] canvas').first().waitFor();

    // Step 3: name it, save it, read the files with it.
    await page.getByRole('button', { name: /^Next: Save the profile/ }).click();
    await page.locator('[data-testid=mapping-wizard][data-step=save]').waitFor();
    const name = `Model B check ${run}`;
    await page.getByTestId('profile-name').fill(name);
    await screenshot(page, 'analyst-wizard-save');
    await page.getByRole('button', { name: 'Save profile and read the files' }).click();
    await page.waitForURL(/\/uploads\/\d+$/);
    await page.getByTestId('upload-progress').waitFor();
    await settledStatus(page);

    await expect.poll(async () => page.locator('[data-testid=upload-tests] tbody tr').count(), { timeout: 30_000 }).toBeGreaterThan(1);
    const tags = await page.locator('[data-testid=upload-tests] tbody tr td:first-child').allTextContents();
    expect(tags).toContain('FV-CIP-007');
    const bRow = page.locator('[data-testid=upload-file]', { hasText: fileB.name });
    expect(await bRow.textContent()).toContain(name);
    expect(await page.locator('[data-testid=unknown-layouts] li', { hasText: fileB.name }).count()).toBe(0);
    await screenshot(page, 'analyst-upload-imported');

    if (await page.getByTestId('unmatched-tags').count()) {
      await page.getByRole('link', { name: 'Match tags' }).click();
      await page.getByTestId('tag-decisions').waitFor();
      await screenshot(page, 'analyst-upload-tags');
    }

    // The new profile is listed; its page exports the same definition.
    await page.goto(`${baseUrl()}/instrument-profiles`);
    await page.getByRole('link', { name }).click();
    await page.getByTestId('profile-name-heading').filter({ hasText: name }).waitFor();
    expect(await page.getByTestId('profile-definition').textContent()).toContain('"levelOffsetDb": 1.5');
    const download = page.waitForEvent('download');
    await page.getByTestId('export-profile').click();
    const file = await (await download).path();
    expect(JSON.parse(fs.readFileSync(file!, 'utf8'))).toMatchObject({ format: 'plumeward.instrument-profile', delimiter: ';', levelOffsetDb: 1.5 });
    await screenshot(page, 'analyst-profile');
  });

  it('a technician uploading an unknown layout is told it waits for an analyst', async () => {
    const run = unique('tech');
    const page = await freshPage();
    await signInThroughPage(page, DEMO.technician.email, DEMO.technician.password);
    const siteId = await siteIdOf(page, 'FV');
    const file = modelBVariant('Field check', run);
    await uploadThroughPage(page, siteId, [file]);
    expect(await settledStatus(page)).toContain('Waiting for a column mapping');
    await page.getByTestId('waits-for-analyst').waitFor();
    expect(await page.getByTestId('waits-for-analyst').textContent()).toContain('wait for an analyst');
    expect(await page.getByRole('link', { name: 'Map this layout' }).count()).toBe(0);
    expect(await page.locator('[data-testid=upload-file]', { hasText: file.name }).textContent()).toContain('Needs a column mapping');
    await screenshot(page, 'technician-upload-waiting');

    const wizard = await page.goto(`${baseUrl()}${new URL(page.url()).pathname}/map/${encodeURIComponent('hf1:00000000000000000000000000000000')}/format`);
    expect(wizard?.status()).toBe(404);

    await page.goto(`${baseUrl()}/instrument-profiles`);
    await page.getByRole('heading', { name: 'Instrument profiles' }).waitFor();
    expect(await page.getByTestId('profile-file').count()).toBe(0);
  });
});
