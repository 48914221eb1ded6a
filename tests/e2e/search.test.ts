import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RecipeDocumentInput } from '@/lib/brewing';
import { openBrowser, type BrowserSession } from '../helpers/browser';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { uniqueWord, waitForSearch } from '../search/app-search';

/** Three invented beers sharing one made-up word: two with Cascade (one of them strong), one with Saaz. */
function brews(word: string): Record<'pale' | 'strong' | 'lager', RecipeDocumentInput> {
  const strong = paleAle({ title: `Tidewater ${word} Strong Pale` });
  strong.fermentables[0].amountKg = 6.5;
  const lager = paleAle({ title: `Tidewater ${word} Lager` });
  lager.hops = [{ name: 'Saaz', amountG: 60, alphaPct: 3.5, use: 'boil', timeMin: 60, form: 'pellet' }];
  return { pale: paleAle({ title: `Tidewater ${word} Pale` }), strong, lager };
}

/** New results follow a search request and a render; on a busy two-core machine that takes more than poll's default second. */
const RESULTS_WAIT = { timeout: 10_000 };

describe('finding recipes in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession;
  const word = uniqueWord('tw');
  let strongSlug = '';

  beforeAll(async () => {
    const { client } = await signedInClient();
    const docs = brews(word);
    await createRecipeVia(client, { document: docs.pale });
    strongSlug = (await createRecipeVia(client, { document: docs.strong })).recipe.slug;
    await createRecipeVia(client, { document: docs.lager });
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 3);
    s = await openBrowser();
  });
  afterAll(async () => s?.close());

  const heading = () => s.page.locator('#search-results-heading');

  it('searches as you type, narrows by hop and ABV in the address, and comes back to the same results', async () => {
    const { page } = s;
    await page.goto('/search');
    await page.getByLabel('Search recipes').pressSequentially(word, { delay: 30 });
    await page.waitForURL((url) => url.searchParams.get('q') === word);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('3 recipes');

    const hops = page.locator('section', { has: page.getByRole('heading', { name: 'Hops', exact: true }) });
    // The box follows the address, which changes a moment after the click: click, then wait for both.
    const cascade = hops.getByRole('checkbox', { name: /^Cascade\b/ });
    await cascade.click();
    await page.waitForURL((url) => url.searchParams.getAll('hop').includes('Cascade'));
    await expect.poll(() => cascade.isChecked()).toBe(true);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('2 recipes');

    await page.getByLabel('ABV from').fill('6.5');
    await page.getByLabel('ABV from').press('Enter');
    await page.waitForURL((url) => url.searchParams.get('abvMin') === '6.5');
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('1 recipe');
    await s.shot('search-narrowed');
    const sharedUrl = page.url();
    expect(new URL(sharedUrl).searchParams.getAll('hop')).toEqual(['Cascade']);

    await page.getByRole('link', { name: `Tidewater ${word} Strong Pale` }).click();
    await page.waitForURL(`**/recipes/${strongSlug}`);
    await page.goBack();
    await page.waitForURL(sharedUrl);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('1 recipe');
    expect(await page.getByLabel('Search recipes').inputValue()).toBe(word);
    expect(await hops.getByRole('checkbox', { name: /^Cascade\b/ }).isChecked()).toBe(true);
    expect(await page.getByLabel('ABV from').inputValue()).toBe('6.5');

    // Back once more undoes the ABV range.
    await page.goBack();
    await page.waitForURL(
      (url) => url.searchParams.get('abvMin') === null && url.searchParams.get('hop') === 'Cascade',
    );
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('2 recipes');

    // The shared address, opened afresh, shows the same search.
    await page.goto(sharedUrl);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('1 recipe');
    await page.getByRole('link', { name: `Tidewater ${word} Strong Pale` }).waitFor();
    expect(s.problems).toEqual([]);
  });

  it('offers a way out of an empty search and a plain note for a broken address', async () => {
    const { page } = s;
    await page.goto(`/search?q=${word}&hop=Saaz&hop=Cascade`);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('0 recipes');
    const loosen = page.getByRole('button', { name: /^Remove the Cascade filter: 1 recipe$/ });
    await loosen.waitFor();
    await s.shot('search-empty');
    await loosen.click();
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('1 recipe');
    expect(new URL(page.url()).searchParams.getAll('hop')).toEqual(['Saaz']);

    await page.goto(`/search?q=${word}&abvMin=9&abvMax=3`);
    await page.getByText('could not be used').waitFor();
    expect(await page.getByText('Lowest ABV must not be greater than highest ABV').count()).toBe(1);
    await expect.poll(() => heading().textContent(), RESULTS_WAIT).toBe('3 recipes');
    expect(s.problems).toEqual([]);
  });

  it('fits a phone screen, with the filters behind a disclosure', async () => {
    const phone = await openBrowser({ width: 375, height: 800 });
    try {
      await phone.page.goto(`/search?q=${word}`);
      const toggle = phone.page.getByRole('button', { name: /^Filters/ });
      expect(await toggle.getAttribute('aria-expanded')).toBe('false');
      expect(await phone.page.getByRole('heading', { name: 'Hops', exact: true }).isVisible()).toBe(false);
      await toggle.click();
      await phone.page.getByRole('heading', { name: 'Hops', exact: true }).waitFor();
      const overflow = await phone.page.evaluate(
        () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
      );
      expect(overflow).toBeLessThanOrEqual(0);
      await phone.shot('search-phone');
      expect(phone.problems).toEqual([]);
    } finally {
      await phone.close();
    }
  });
});
