import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  SCREENSHOT_DIR,
  accountMenuButton,
  openAccountMenu,
  openBrowser,
  type BrowserSession,
} from '../helpers/browser';
import { BASE_URL } from '../helpers/env';
import { TEST_PASSWORD, createUser } from '../helpers/users';

describe('home and sign-in in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
    console.log(`screenshots in ${SCREENSHOT_DIR}`);
  });
  afterAll(async () => s?.close());

  it('shows the home page without errors', async () => {
    const res = await s.page.goto('/');
    expect(res?.status()).toBe(200);
    expect(await s.page.getByRole('heading', { level: 1 }).textContent()).toMatch(/remember every change/);
    await s.page.getByRole('link', { name: 'Sign in' }).waitFor();
    await s.shot('home');
    expect(await s.page.content()).not.toMatch(/Something went wrong|Application error/);
    expect(s.problems).toEqual([]);
  });

  it('shows field messages, then signs a member in through the form', async () => {
    const user = await createUser({ name: 'Form Tester' });
    await s.page.goto('/sign-in');
    await s.page.getByRole('button', { name: 'Sign in' }).click();
    await s.page.getByText('Enter your e-mail address.').first().waitFor();
    await s.shot('sign-in-errors');
    await s.page.locator('#signin-email').fill(user.email);
    await s.page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
    await s.page.getByRole('button', { name: 'Sign in' }).click();
    await s.page.waitForURL('/');
    expect(await accountMenuButton(s.page).textContent()).toContain('Form Tester');
    await s.shot('signed-in-home');
    const menu = await openAccountMenu(s.page);
    expect(await menu.textContent()).toContain('Signed in as Form Tester');
    await s.shot('account-menu-open');
    await s.page.keyboard.press('Escape');
    await menu.waitFor({ state: 'hidden' });
    expect(s.problems).toEqual([]);
  });

  it('reaches brew days, import and the member page from the header', async () => {
    const header = s.page.getByRole('banner');
    await header.getByRole('link', { name: 'My brew days' }).click();
    await s.page.getByRole('heading', { level: 1, name: 'My brew days' }).waitFor();
    await (await openAccountMenu(s.page)).getByRole('link', { name: 'Import' }).click();
    await s.page.waitForURL('/import');
    // Moving to another page closes the menu.
    expect(await accountMenuButton(s.page).getAttribute('aria-expanded')).toBe('false');
    await (await openAccountMenu(s.page)).getByRole('link', { name: 'Your member page' }).click();
    await s.page.getByRole('heading', { level: 1, name: 'Form Tester' }).waitFor();
    expect(s.page.url()).toMatch(/\/members\/[^/]+$/);
    expect(s.problems).toEqual([]);
  });

  it('tells a member when the password is wrong, without saying which part', async () => {
    const user = await createUser();
    const fresh = await openBrowser();
    try {
      await fresh.page.goto('/sign-in');
      await fresh.page.locator('#signin-email').fill(user.email);
      await fresh.page.getByLabel('Password', { exact: true }).fill('definitely-not-it');
      await fresh.page.getByRole('button', { name: 'Sign in' }).click();
      await fresh.page.getByText(/do not match an account/).waitFor();
      await fresh.shot('sign-in-wrong-password');
      // next-auth answers a refused credential sign-in with 401, which the browser logs; nothing else may fail.
      expect(fresh.problems.filter((p) => !/^HTTP 401: .*\/api\/auth\/callback\/credentials/.test(p))).toEqual([]);
    } finally {
      await fresh.close();
    }
  });

  it.each(['/%5Cevil.example/phish', '/%09/evil.example/phish', '/%0A/evil.example/phish', '//evil.example/phish'])(
    'stays on our own site after signing in with callbackUrl=%s',
    async (callback) => {
      const user = await createUser();
      const fresh = await openBrowser();
      try {
        await fresh.page.goto(`/sign-in?callbackUrl=${callback}`);
        await fresh.page.locator('#signin-email').fill(user.email);
        await fresh.page.getByLabel('Password', { exact: true }).fill(TEST_PASSWORD);
        await fresh.page.getByRole('button', { name: 'Sign in' }).click();
        // Signing in lands on our home page; a followed callback would leave for another host.
        await fresh.page.waitForURL((url) => url.pathname === '/' || url.origin !== new URL(BASE_URL).origin);
        expect(new URL(fresh.page.url()).origin).toBe(new URL(BASE_URL).origin);
        expect(new URL(fresh.page.url()).pathname).toBe('/');
        await accountMenuButton(fresh.page).waitFor();
        expect(fresh.problems).toEqual([]);
      } finally {
        await fresh.close();
      }
    },
  );
});
