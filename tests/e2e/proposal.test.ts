import { afterEach, describe, expect, it } from 'vitest';
import { editorReady, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { TEST_PASSWORD, createUser } from '../helpers/users';
import { TestClient } from '../helpers/http';

describe('suggesting a change upstream in a real browser', { timeout: 120_000 }, () => {
  const sessions: BrowserSession[] = [];
  afterEach(async () => {
    for (const s of sessions.splice(0)) await s.close();
  });

  it('a brewer forks a pale ale, swaps the yeast, proposes it back; the owner accepts and the history credits the brewer', async () => {
    const owner = await createUser({ name: 'Pale Owner' });
    const ownerApi = new TestClient();
    expect(await ownerApi.signIn(owner.email, TEST_PASSWORD)).toBe(true);
    const title = `Upstream Pale ${Date.now()}`;
    const source = await createRecipeVia(ownerApi, { document: paleAle({ title }) });
    const brewer = await createUser({ name: 'Kveik Brewer' });

    // The brewer: fork, swap the yeast, save.
    const b = await openBrowser();
    sessions.push(b);
    await signInThroughPage(b, brewer.email);
    await b.page.goto(`/recipes/${source.recipe.slug}`);
    await b.page.getByLabel('Title of your fork').fill(`${title}, kveik`);
    await b.page.getByRole('button', { name: 'Fork this version' }).click();
    await b.page.waitForURL('**/edit');
    await editorReady(b.page);
    await b.page.locator('#kf-document-yeasts-0-name').fill('Kveik, farmhouse');
    await b.page.locator('#kf-document-yeasts-0-kind').selectOption('kveik');
    await b.page.locator('#kf-document-yeasts-0-attenuationPct').fill('80');
    await b.page.locator('#kf-message').fill('Kveik instead of the clean ale yeast');
    await b.page.getByRole('button', { name: 'Save new version' }).click();
    await b.page.waitForURL('**/v/2');

    // Propose it back from the fork's version page.
    await b.page.getByRole('button', { name: 'Propose to the original' }).click();
    await b.page.getByLabel('Title', { exact: true }).fill('Kveik gives it a fruitier finish');
    await b.page.getByLabel('What changed and why').fill('Swapped the yeast for **kveik**; done in five days.');
    await b.shot('proposal-form');
    await b.page.getByRole('button', { name: 'Send proposal' }).click();
    await b.page.waitForURL('**/proposals/**');
    const proposalUrl = b.page.url();
    await b.page.getByRole('heading', { name: 'Kveik gives it a fruitier finish' }).waitFor();
    const brewerView = await b.page.locator('main').textContent();
    expect(brewerView).toContain('Kveik, farmhouse');
    // A yeast swap reads as one change.
    expect(brewerView).toMatch(/Yeast: .+ → Kveik, farmhouse/);
    expect(brewerView).toContain('Withdraw the proposal');
    expect(brewerView).not.toContain('Accept and save a new version');

    // The owner, in a second browser: the bell, the proposal, accept.
    const o = await openBrowser();
    sessions.push(o);
    await signInThroughPage(o, owner.email);
    await o.page.goto('/notifications');
    await o.page.getByRole('link', { name: /Kveik Brewer proposed a change to your recipe/ }).click();
    await o.page.waitForURL(proposalUrl);
    await o.page.getByRole('button', { name: 'Accept and save a new version' }).waitFor();
    await o.shot('proposal-owner');
    await o.page.getByRole('button', { name: 'Accept and save a new version' }).click();
    await o.page.getByText('Accepted as').waitFor();
    await o.page.getByRole('link', { name: 'See the history' }).click();
    await o.page.waitForURL(`**/recipes/${source.recipe.slug}/history`);
    const history = await o.page.locator('main').textContent();
    expect(history).toContain('with Kveik Brewer');
    await o.shot('proposal-history');

    // Narrow screens read the proposal too.
    await o.page.setViewportSize({ width: 375, height: 800 });
    await o.page.goto(proposalUrl);
    await o.page.getByText('Accepted as').waitFor();
    await o.shot('proposal-narrow');

    expect(b.problems).toEqual([]);
    expect(o.problems).toEqual([]);
  });
});
