import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { jpeg } from '../brew-days/fixtures';

describe('a brew day in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(async () => s?.close());

  it('logs a brew day from a recipe version, uploads a photo and shows its thumbnail and larger view', async () => {
    const { client } = await signedInClient();
    const saved = await createRecipeVia(client, { document: paleAle({ title: 'Browser brew pale' }) });
    await shareSessionOf(s, client);

    await s.page.goto(`/recipes/${saved.recipe.slug}`);
    await s.page.getByRole('link', { name: 'Log a brew day' }).first().click();
    await s.page.waitForURL(/\/v\/1\/brew$/);
    await s.page.getByRole('heading', { name: 'Log a brew day' }).waitFor();
    // A bad value first: the field says what is wrong and nothing is sent.
    await s.page.locator('#bd-og-value').fill('1.5');
    await s.page.getByRole('button', { name: 'Log this brew day' }).click();
    await s.page.getByText('between 0.980 and 1.200').first().waitFor();
    await s.shot('brew-day-form-error');
    await s.page.locator('#bd-og-value').fill('1.049');
    await s.page.locator('#bd-mashTempC').fill('66');
    await s.page.getByRole('button', { name: 'Log this brew day' }).click();
    await s.page.waitForURL(/\/brew-days\/[0-9a-f-]{36}$/);
    await s.page.getByRole('heading', { name: 'Measured against predicted' }).waitFor();
    expect(await s.page.getByRole('link', { name: 'Safety guide' }).count()).toBeGreaterThan(0);

    await s.page
      .locator('#photo-file')
      .setInputFiles({ name: 'mash.jpg', mimeType: 'image/jpeg', buffer: await jpeg(1200, 900) });
    await s.page.locator('#photo-caption').fill('Mash in');
    await s.page.getByRole('button', { name: 'Upload photo' }).click();
    const thumb = s.page.locator('img[src*="/thumb"]').first();
    await thumb.waitFor();
    await s.page.waitForFunction(() => {
      const img = document.querySelector<HTMLImageElement>('img[src*="/thumb"]');
      return Boolean(img && img.complete && img.naturalWidth > 0);
    });
    await s.shot('brew-day-with-photo');

    await s.page.getByRole('button', { name: /Open photo 1/ }).click();
    const dialog = s.page.getByRole('dialog', { name: 'Mash in' });
    await dialog.waitFor();
    await s.page.waitForFunction(() => {
      const img = document.querySelector<HTMLImageElement>('dialog img');
      return Boolean(img && img.complete && img.naturalWidth > 0);
    });
    await s.shot('brew-day-photo-dialog');
    await s.page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });

    // A fermentation reading draws the chart beside the predicted FG.
    await s.page.locator('#reading-value').fill('1.021');
    await s.page.locator('#reading-beerTempC').fill('19');
    await s.page.getByRole('button', { name: 'Add reading' }).click();
    await s.page
      .getByRole('figure', { name: /Fermentation chart/ })
      .locator('svg.recharts-surface')
      .first()
      .waitFor();
    await s.page
      .getByText(/Predicted FG 1\.0\d\d/)
      .first()
      .waitFor();
    await s.shot('brew-day-chart');

    await s.page.setViewportSize({ width: 375, height: 800 });
    await s.shot('brew-day-narrow');
    expect(s.problems).toEqual([]);
  });
});
