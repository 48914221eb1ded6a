import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createUser } from '../helpers/users';

const stoutFile = fileURLToPath(new URL('../../lib/interchange/examples/beerxml-spec-dry-stout.xml', import.meta.url));

describe('importing a recipe file and printing its brew sheet in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession;
  let savedUrl = '/';
  beforeAll(async () => {
    s = await openBrowser();
    const user = await createUser({ name: 'Import Tester' });
    await signInThroughPage(s, user.email);
    await s.page.waitForURL('/');
  });
  afterAll(async () => s?.close());

  it('uploads a BeerXML file, shows the preview with our numbers, and saves it', async () => {
    await s.page.goto('/import');
    await s.page.getByLabel('Choose a file').setInputFiles(stoutFile);
    await expect.poll(() => s.page.getByLabel('Or paste its text').inputValue()).toContain('<RECIPES>');
    await s.page.getByRole('button', { name: 'Preview' }).click();
    await s.page.getByRole('heading', { name: 'Preview: Dry Stout' }).waitFor();
    await s.page.getByRole('heading', { name: /Left out \(\d+\)/ }).waitFor();
    await s.page.getByRole('heading', { name: /Assumed \(\d+\)/ }).waitFor();
    expect(await s.page.getByText('Irish Ale: the file gives no attenuation; used 75%').count()).toBe(1);
    expect(await s.page.locator('dt', { hasText: /^OG$/ }).count()).toBeGreaterThan(0);
    await s.shot('import-preview');
    await s.page.setViewportSize({ width: 375, height: 800 });
    await s.shot('import-preview-narrow');
    await s.page.setViewportSize({ width: 1280, height: 900 });

    await s.page.getByRole('button', { name: 'Save' }).click();
    await s.page.waitForURL(/\/recipes\/dry-stout-/);
    savedUrl = s.page.url();
    await s.page.getByRole('heading', { level: 1, name: 'Dry Stout' }).waitFor();
    for (const name of ['BeerXML', 'BeerJSON', 'JSON'])
      expect(await s.page.getByRole('link', { name, exact: true }).count()).toBe(1);
    expect(s.problems).toEqual([]);
  });

  it('shows a message naming the problem for an unsafe file', async () => {
    await s.page.goto('/import');
    await s.page
      .getByLabel('Or paste its text')
      .fill('<?xml version="1.0"?><!DOCTYPE r [<!ENTITY x SYSTEM "file:///etc/passwd">]><RECIPES/>');
    await s.page.getByRole('button', { name: 'Preview' }).click();
    await s.page
      .getByRole('alert')
      .filter({ hasText: /DOCTYPE/ })
      .waitFor();
    // The refused preview answers 400; nothing else may fail.
    expect(s.problems.filter((p) => !/^HTTP 400: .*\/api\/import$/.test(p))).toEqual([]);
    s.problems.length = 0;
  });

  it('prints the brew sheet without the site header and navigation', async () => {
    await s.page.goto(savedUrl);
    await s.page.getByRole('link', { name: 'Print brew sheet' }).click();
    await s.page.waitForURL(/\/print\/recipes\/dry-stout-.*\/v\/1$/);
    await s.page.getByRole('heading', { level: 1, name: 'Dry Stout' }).waitFor();
    expect(await s.page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    expect(await s.page.locator('body > header').isVisible()).toBe(false);
    expect(await s.page.locator('body > footer').isVisible()).toBe(false);
    expect(await s.page.getByRole('button', { name: 'Print' }).isVisible()).toBe(true);
    expect(await s.page.getByRole('checkbox').count()).toBeGreaterThan(3);
    await s.page.getByText('Measured on the day').waitFor();
    await s.shot('brew-sheet');
    await s.page.emulateMedia({ media: 'print' });
    expect(await s.page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    await s.shot('brew-sheet-print');
    const pdf = await s.page.pdf({ format: 'A4' });
    expect(pdf.byteLength).toBeGreaterThan(1000);
    await s.page.emulateMedia({ media: 'screen' });
    expect(s.problems).toEqual([]);
  });
});
