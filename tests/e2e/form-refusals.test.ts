import { afterEach, describe, expect, it } from 'vitest';
import { editorReady, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

/** The message a field's aria-describedby points at, or null when it points nowhere. */
async function describedText(s: BrowserSession, selector: string): Promise<string | null> {
  const ids = await s.page.locator(selector).getAttribute('aria-describedby');
  if (!ids) return null;
  const texts = await Promise.all(ids.split(' ').map((id) => s.page.locator(`[id="${id}"]`).textContent()));
  return texts.join(' ');
}

describe('forms show refusals beside their fields in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('the fork form checks its title with the route schema; a comment posts, and a lost connection says so', async () => {
    const { client: owner } = await signedInClient();
    const title = `Refusal Pale ${Date.now()}`;
    const source = await createRecipeVia(owner, { document: paleAle({ title }) });
    const { user: brewer } = await signedInClient();
    s = await openBrowser();
    await signInThroughPage(s, brewer.email);
    await s.page.goto(`/recipes/${source.recipe.slug}`);

    // Spaces only: the fork schema trims, then asks for a title.
    await s.page.getByLabel('Title of your fork').fill('   ');
    await s.page.getByRole('button', { name: 'Fork this version' }).click();
    await s.page.getByText('Give your fork a title.').waitFor();
    expect(await s.page.locator('#fork-title').getAttribute('aria-invalid')).toBe('true');
    expect(await describedText(s, '#fork-title')).toBe('Give your fork a title.');
    await s.shot('fork-title-refused');
    await s.page.setViewportSize({ width: 390, height: 844 });
    await s.shot('fork-title-refused-phone');
    await s.page.setViewportSize({ width: 1280, height: 900 });

    const comment = `Mashed at 67 °C and it finished drier than I expected ${Date.now()}`;
    await s.page.getByLabel('Add a comment').fill(comment);
    await s.page.getByRole('button', { name: 'Post comment' }).click();
    await s.page.locator('li[id^="comment-"]', { hasText: comment }).waitFor();
    expect(await s.page.getByLabel('Add a comment').inputValue()).toBe('');

    await s.page.route('**/api/recipes/*/comments', (r) => r.abort('internetdisconnected'));
    await s.page.getByLabel('Add a comment').fill('Does anyone whirlpool this one?');
    await s.page.getByRole('button', { name: 'Post comment' }).click();
    const offline = 'Kettlefork could not be reached. Check your connection and try again.';
    await s.page.getByRole('alert').filter({ hasText: offline }).waitFor();
    expect(await describedText(s, 'textarea')).toContain(offline);
    // The typed text stays for another try.
    expect(await s.page.getByLabel('Add a comment').inputValue()).toBe('Does anyone whirlpool this one?');
    await s.page.unroute('**/api/recipes/*/comments');

    expect(s.problems.filter((p) => !/request failed: .*\/comments net::ERR_INTERNET_DISCONNECTED/.test(p))).toEqual(
      [],
    );
  });

  it('settings put the server’s litre limit beside the volume the member typed', async () => {
    const { user } = await signedInClient();
    s = await openBrowser();
    await signInThroughPage(s, user.email);
    await s.page.goto('/settings');
    await s.page.getByLabel('Units').selectOption('metric');
    // The form only asks for a positive number; the route's schema caps a batch at 2,000 litres.
    await s.page.locator('#settings-volume').fill('3000');
    await s.page.getByRole('button', { name: 'Save settings' }).click();
    await s.page.locator('#settings-volume-error').waitFor();
    expect(await s.page.locator('#settings-volume-error').textContent()).toBe('A batch is at most 2,000 litres.');
    expect(await s.page.locator('#settings-volume').getAttribute('aria-invalid')).toBe('true');
    expect(await describedText(s, '#settings-volume')).toBe('A batch is at most 2,000 litres.');
    // The message sits beside its field once; the API's own field name never reaches the page.
    expect(await s.page.getByText('A batch is at most 2,000 litres.').count()).toBe(1);
    expect(await s.page.locator('main').textContent()).not.toContain('defaultBatchVolumeL');
    await s.page.setViewportSize({ width: 390, height: 844 });
    await s.shot('settings-volume-refused-phone');
    expect(s.problems.filter((p) => !/^HTTP 400: .*\/api\/me\/settings$/.test(p))).toEqual([]);
  });

  it('a save refused because the head moved shows the newer version, and saving on top keeps the member’s work', async () => {
    const { user, client } = await signedInClient();
    const title = `Conflict Pale ${Date.now()}`;
    const created = await createRecipeVia(client, { document: paleAle({ title }) });
    s = await openBrowser();
    await signInThroughPage(s, user.email);
    await s.page.goto(`/recipes/${created.recipe.slug}/edit`);
    await editorReady(s.page);

    // Meanwhile, another tab of the same member saves version 2.
    const meanwhile = await saveVia(
      client,
      created.recipe.id,
      created.version.id,
      paleAle({ title, notes: 'Saved from the other tab.' }),
      'Notes from the other tab',
    );
    expect(meanwhile.status).toBe(201);

    await s.page.locator('#kf-message').fill('A longer boil');
    await s.page.getByRole('button', { name: 'Save new version' }).click();
    await s.page.getByRole('heading', { name: 'A newer version was saved while you were editing' }).waitFor();
    expect(await s.page.locator('main').textContent()).toContain('saved version 2');
    expect(await s.page.locator('#kf-message').inputValue()).toBe('A longer boil');
    await s.shot('editor-conflict');

    await s.page.getByRole('button', { name: 'Keep my changes and save on top of version 2' }).click();
    await s.page.waitForURL(`**/recipes/${created.recipe.slug}/v/3`);
    expect(s.problems.filter((p) => !/^HTTP 409: .*\/versions$/.test(p))).toEqual([]);
  });
});
