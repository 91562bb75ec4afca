// Debian's Chromium, driven by playwright-core (never a downloaded browser).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { baseUrl } from './http';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const SCREENSHOTS = path.resolve(__dirname, '../../test-results/screenshots');

/** One report of a content security policy violation, from the page's event or Chromium's console. */
export type CspViolation = { via: 'event' | 'console'; page: string; detail: string };

const cspViolations = new WeakMap<BrowserContext, CspViolation[]>();

// Runs in every document before its own scripts, so a violation during parsing is seen too.
// The binding lives in Node, so the record survives navigations and closed pages.
const CSP_RECORDER = `document.addEventListener('securitypolicyviolation', (e) => {
  const where = e.sourceFile ? ' at ' + e.sourceFile + ':' + e.lineNumber : '';
  window.__plumewardCspViolation(e.documentURI, e.effectiveDirective + ' blocked ' + (e.blockedURI || 'inline') + where + (e.sample ? ': ' + e.sample : ''));
}, true);`;

function watchConsole(page: Page, list: CspViolation[]) {
  page.on('console', (message) => {
    if (/content security policy/i.test(message.text())) list.push({ via: 'console', page: page.url(), detail: message.text() });
  });
}

/** The violations every page of this browser has reported so far, which are then forgotten. */
export function takeCspViolations(context: BrowserContext): CspViolation[] {
  return (cspViolations.get(context) ?? []).splice(0);
}

/** Fails if any page of the page's browser has reported a violation; the reports name page and directive. */
export function expectNoCspViolations(page: Page | BrowserContext) {
  const context = 'context' in page ? page.context() : page;
  const found = cspViolations.get(context) ?? [];
  if (found.length > 0) {
    throw new Error(`Content security policy violations:\n${found.map((v) => `  [${v.via}] ${v.page}: ${v.detail}`).join('\n')}`);
  }
}

/**
 * A fresh Chromium profile. Every page records CSP violations, and closing the context fails
 * (after the browser has closed) if there were any, so each browser test checks the policy.
 */
export async function launch(): Promise<{ browser: Browser; context: BrowserContext; userDataDir: string }> {
  const userDataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'plumeward-chromium-'));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 1280, height: 860 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const list: CspViolation[] = [];
  cspViolations.set(context, list);
  await context.exposeBinding('__plumewardCspViolation', (_source, page: string, detail: string) => {
    list.push({ via: 'event', page, detail });
  });
  await context.addInitScript(CSP_RECORDER);
  for (const page of context.pages()) watchConsole(page, list);
  context.on('page', (page) => watchConsole(page, list));
  const close = context.close.bind(context);
  context.close = async (options) => {
    await close(options);
    fs.rmSync(userDataDir, { recursive: true, force: true });
    expectNoCspViolations(context);
  };
  return { browser: context.browser()!, context, userDataDir };
}

/** Signs in through the real sign-in page and waits for the sites overview. */
export async function signInThroughPage(page: Page, email: string, password: string) {
  await page.goto(`${baseUrl()}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Your sites' }).waitFor();
}

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
}
