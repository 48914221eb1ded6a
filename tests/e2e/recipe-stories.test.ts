import { afterEach, describe, expect, it } from 'vitest';
import { editorReady, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';

/** Reads a number shown in the numbers panel beside its label, e.g. "FG". */
async function panelNumber(s: BrowserSession, label: string): Promise<number> {
  const text = await s.page.getByRole('complementary').first().textContent();
  const match = text?.match(new RegExp(`${label}\\s*([0-9.]+)`));
  if (!match) throw new Error(`no ${label} in the numbers panel: ${text}`);
  return Number(match[1]);
}

describe('recipe stories in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('a brewer forks a public pale ale, swaps in a kveik yeast and mashes hotter, and sees FG up, ABV down and the compare', async () => {
    const { client: author } = await signedInClient();
    const title = `Story Pale ${Date.now()}`;
    const source = await createRecipeVia(author, { document: paleAle({ title }) });
    const brewer = await createUser({ name: 'Story Brewer' });
    s = await openBrowser();
    await signInThroughPage(s, brewer.email);

    await s.page.goto('/recipes');
    await s.page.getByRole('link', { name: title }).click();
    await s.page.waitForURL(`**/recipes/${source.recipe.slug}`);
    await s.shot('story1-source');
    const fgBefore = await panelNumber(s, 'FG');
    const abvBefore = await panelNumber(s, 'ABV');

    await s.page.getByLabel('Title of your fork').fill(`${title} kveik`);
    await s.page.getByRole('button', { name: 'Fork this version' }).click();
    await s.page.waitForURL('**/edit');
    await editorReady(s.page);
    await s.page.locator('#kf-document-yeasts-0-name').fill('Kveik, farmhouse');
    await s.page.locator('#kf-document-yeasts-0-kind').selectOption('kveik');
    await s.page.locator('#kf-document-yeasts-0-attenuationPct').fill('75');
    await s.page.locator('#kf-document-mash-steps-0-tempC').fill('69');
    await s.page.locator('#kf-message').fill('Swapped to a kveik strain, mashed 3 °C hotter');
    await s.shot('story1-editing');
    await s.page.getByRole('button', { name: 'Save new version' }).click();
    await s.page.waitForURL('**/v/2');
    await s.shot('story1-saved');
    const fgAfter = await panelNumber(s, 'FG');
    const abvAfter = await panelNumber(s, 'ABV');
    expect(fgAfter).toBeGreaterThan(fgBefore);
    expect(abvAfter).toBeLessThan(abvBefore);

    await s.page.getByRole('link', { name: 'What changed since the fork' }).click();
    await s.page.waitForURL('**/compare?**');
    const body = await s.page.locator('main').textContent();
    expect(body).toContain('Kveik, farmhouse');
    // In brewers' words: no document key on the page.
    expect(body).toMatch(/Temperature:[^→]+→/);
    expect(body).not.toContain('tempC');
    await s.shot('story1-compare');
    expect(s.problems).toEqual([]);
  });

  it('a member picks two versions in the history and reads the side-by-side compare', async () => {
    const { client: owner, user } = await signedInClient();
    const created = await createRecipeVia(owner, { document: paleAle({ title: `History Story ${Date.now()}` }) });
    const v2doc = paleAle({ title: 'History Story', notes: 'A bright, bitter pale ale for long summer evenings.' });
    v2doc.hops[1].amountG = 40;
    const v2 = await saveVia(owner, created.recipe.id, created.version.id, v2doc, 'More late Cascade');
    const v3doc = structuredClone(v2doc);
    v3doc.fermentables.push({ name: 'Wheat malt', amountKg: 0.4, potentialPpg: 37, colorLovibond: 3, kind: 'grain' });
    await saveVia(owner, created.recipe.id, v2.body.version.id, v3doc, 'Added wheat for head retention');

    s = await openBrowser();
    await signInThroughPage(s, user.email);
    await s.page.goto(`/recipes/${created.recipe.slug}/history`);
    await s.page.getByLabel(/^Version 3/).waitFor();
    await s.shot('story4-history');
    await s.page.getByLabel(/^Version 1/).check();
    await s.page.getByLabel(/^Version 3/).check();
    await s.page.getByRole('button', { name: 'Compare side by side' }).click();
    await s.page.waitForURL('**/compare?**');
    const main = s.page.locator('main');
    await main.getByText('Wheat malt').first().waitFor();
    const text = await main.textContent();
    expect(text).toMatch(/Wheat malt\s*added/);
    expect(text).toMatch(/Amount:[^→]+→/);
    expect(text).not.toContain('amountG');
    expect(await main.locator('ins', { hasText: 'summer' }).count()).toBeGreaterThan(0);
    expect(await main.locator('del', { hasText: 'everyday' }).count()).toBeGreaterThan(0);
    expect(text).toMatch(/OG/);
    await s.shot('story4-compare');
    expect(s.problems).toEqual([]);
  });

  it('a member writes a new recipe in the editor and saves version 1', async () => {
    const brewer = await createUser();
    s = await openBrowser();
    await signInThroughPage(s, brewer.email);
    await s.page.goto('/recipes/new');
    await editorReady(s.page);
    await s.page.locator('#kf-document-title').fill('Editor Story Bitter');
    await s.page.getByRole('button', { name: 'Add hop' }).click();
    await s.page.locator('#kf-document-hops-1-name').fill('Fuggle');
    await s.page.locator('#kf-document-hops-1-amountG').fill('20');
    await s.page.locator('#kf-document-hops-1-alphaPct').fill('4.5');
    await s.page.locator('#kf-document-hops-1-timeMin').fill('15');
    await s.shot('editor-new');
    await s.page.getByRole('button', { name: 'Save recipe' }).click();
    await s.page.waitForURL(/\/recipes\/editor-story-bitter-/);
    const text = await s.page.locator('main').textContent();
    expect(text).toContain('Editor Story Bitter');
    expect(text).toContain('Fuggle');
    expect(s.problems).toEqual([]);
  });
});
