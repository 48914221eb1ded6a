import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { BASE_URL } from './env';
import type { TestClient } from './http';
import { TEST_PASSWORD } from './users';

export const SCREENSHOT_DIR = path.resolve('tests/e2e/screenshots');

export interface BrowserSession {
  browser: Browser;
  context: BrowserContext;
  page: Page;
  problems: string[];
  shot(name: string): Promise<string>;
  close(): Promise<void>;
}

/**
 * Debian's Chromium driven by playwright-core, with a fresh profile each launch. Every console error, page error and failed
 * request is collected in `problems`, which a test expects to stay empty.
 */
export async function openBrowser(
  opts: { width?: number; height?: number; colorScheme?: 'light' | 'dark' } = {},
): Promise<BrowserSession> {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  const context = await browser.newContext({
    baseURL: BASE_URL,
    viewport: { width: opts.width ?? 1280, height: opts.height ?? 900 },
    colorScheme: opts.colorScheme ?? 'light',
  });
  const page = await context.newPage();
  // Every page load waits for React to attach (see components/providers.tsx), as a person waits for a
  // page to finish loading before typing; soft navigations keep the mark.
  const goto = page.goto.bind(page);
  page.goto = async (url, options) => {
    const response = await goto(url, options);
    await page
      .locator('html[data-hydrated]')
      .waitFor({ state: 'attached', timeout: 15_000 })
      .catch(() => undefined);
    return response;
  };
  const problems: string[] = [];
  page.on('console', (msg) => {
    // Failed responses are recorded with their URL below; the browser's own line for them adds nothing.
    if (msg.type() === 'error' && !msg.text().startsWith('Failed to load resource'))
      problems.push(`console: ${msg.text()}`);
  });
  page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
  page.on('requestfailed', (req) => {
    // A navigation away cancels in-flight requests; that is not a failure of the page.
    if (req.failure()?.errorText !== 'net::ERR_ABORTED')
      problems.push(`request failed: ${req.url()} ${req.failure()?.errorText}`);
  });
  page.on('response', (res) => {
    if (res.status() >= 400) problems.push(`HTTP ${res.status()}: ${res.url()}`);
  });
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  return {
    browser,
    context,
    page,
    problems,
    async shot(name) {
      const file = path.join(SCREENSHOT_DIR, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    async close() {
      await browser.close();
    },
  };
}

/** Waits until the recipe editor on the page has hydrated, so typing goes to React and Save is on. */
export async function editorReady(page: Page): Promise<void> {
  await page.locator('form[data-ready]').waitFor();
}

/** Signs in through the sign-in page as a person does, and waits for the signed-in header. */
export async function signInThroughPage(s: BrowserSession, email: string, password = TEST_PASSWORD): Promise<void> {
  await s.page.goto('/sign-in');
  await s.page.locator('#signin-email').fill(email);
  await s.page.getByLabel('Password', { exact: true }).fill(password);
  await s.page.getByRole('button', { name: 'Sign in' }).click();
  await accountMenuButton(s.page).waitFor();
}

/** The header's button that opens the signed-in member's menu (their name). */
export function accountMenuButton(page: Page) {
  return page.getByRole('banner').getByRole('button', { name: /^Account menu for / });
}

/** Opens the signed-in member's menu in the header, and gives its panel. */
export async function openAccountMenu(page: Page) {
  const button = accountMenuButton(page);
  if ((await button.getAttribute('aria-expanded')) !== 'true') await button.click();
  const panel = page.locator(`[id="${await button.getAttribute('aria-controls')}"]`);
  await panel.waitFor();
  return panel;
}

/** Copies a signed-in API client's session cookies into the browser, so pages open as that member. */
export async function shareSessionOf(s: BrowserSession, client: TestClient): Promise<void> {
  const cookies = client
    .cookieHeader()
    .split('; ')
    .filter(Boolean)
    .map((pair) => {
      const eq = pair.indexOf('=');
      return { name: pair.slice(0, eq), value: pair.slice(eq + 1), url: BASE_URL };
    });
  await s.context.addCookies(cookies);
}
