// The content security policy in real Chromium: the app's own scripts run under it, and the
// violation recorder every browser test relies on (tests/support/browser.ts) does report what the
// policy blocks, so "no violations" in the other browser tests means something.
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectNoCspViolations, launch, signInThroughPage, takeCspViolations } from '../support/browser';
import { baseUrl, DEMO } from '../support/http';

declare global {
  interface Window { __plumewardRan?: string[] }
}

describe('content security policy in the browser', () => {
  let context: BrowserContext;
  beforeAll(async () => {
    ({ context } = await launch());
  });
  afterAll(async () => {
    await context?.close();
  });

  async function freshPage(): Promise<Page> {
    await context.clearCookies();
    return context.newPage();
  }

  it("runs the app's own scripts: the sign-in page hydrates and signs in with no violation", async () => {
    const page = await freshPage();
    await page.goto(`${baseUrl()}/sign-in`);
    // The sign-in button is disabled until React has hydrated, which needs the nonced scripts.
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isEnabled()).toBe(true);
    await signInThroughPage(page, DEMO.analyst.email, DEMO.analyst.password);
    await page.goto(`${baseUrl()}/no-such-page`);
    await page.getByRole('heading', { name: 'Not found' }).waitFor();
    expectNoCspViolations(page);
    await page.close();
  });

  it('blocks and reports an inline script and style the server did not nonce', async () => {
    const page = await freshPage();
    // The real page and its real policy header, with a stored-injection payload added to the HTML.
    await page.route(`${baseUrl()}/sign-in`, async (route) => {
      const response = await route.fetch();
      const html = (await response.text()).replace(
        '</body>',
        '<script>(window.__plumewardRan ||= []).push("injected script")</script><style>body{display:none}</style></body>',
      );
      expect(response.headers()['content-security-policy']).toMatch(/script-src 'self' 'nonce-[^']+' 'strict-dynamic'/);
      await route.fulfill({ response, body: html });
    });
    await page.goto(`${baseUrl()}/sign-in`);
    await expect.poll(() => page.getByRole('button', { name: 'Sign in' }).isEnabled()).toBe(true);
    expect(await page.evaluate(() => window.__plumewardRan ?? [])).toEqual([]);
    expect(await page.locator('body').isVisible()).toBe(true);

    const reported = takeCspViolations(context);
    const events = reported.filter((v) => v.via === 'event').map((v) => v.detail);
    expect(events).toEqual(expect.arrayContaining([
      expect.stringMatching(/^script-src-elem blocked inline at .*\/sign-in:\d+/),
      expect.stringMatching(/^style-src-elem blocked inline at .*\/sign-in:\d+/),
    ]));
    expect(reported.some((v) => v.via === 'console' && /inline script/.test(v.detail))).toBe(true);
    await page.close();
  });

  it('blocks and reports an inline event handler added to the page', async () => {
    const page = await freshPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.evaluate(() => {
      const div = document.createElement('div');
      div.innerHTML = '<img src="/missing.png" onerror="(window.__plumewardRan ||= []).push(\'handler\')">';
      document.body.append(div);
    });
    await expect.poll(() => takeCspViolations(context).filter((v) => v.via === 'event').map((v) => v.detail))
      .toEqual([expect.stringMatching(/^script-src-attr blocked inline/)]);
    expect(await page.evaluate(() => window.__plumewardRan ?? [])).toEqual([]);
    await page.close();
  });
});
