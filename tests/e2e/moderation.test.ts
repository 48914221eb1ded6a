import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { User } from '@/db/schema';
import { openAccountMenu, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { TEST_PASSWORD, createUser } from '../helpers/users';

async function signIn(s: BrowserSession, user: User): Promise<void> {
  await signInThroughPage(s, user.email);
  await s.page.waitForURL('/');
}

/** Polls the search API (the index follows PostgreSQL through the outbox) until `done` holds. */
async function waitForSearch(q: string, done: (ids: string[]) => boolean, timeoutMs = 15_000): Promise<string[]> {
  const client = new TestClient();
  const deadline = Date.now() + timeoutMs;
  let ids: string[] = [];
  while (Date.now() < deadline) {
    const res = await client.get<{ hits: { id: string }[] }>(`/api/search?q=${encodeURIComponent(q)}`);
    ids = res.status === 200 ? res.body.hits.map((h) => h.id) : [];
    if (done(ids)) return ids;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`search for ${q} did not settle: ${JSON.stringify(ids)}`);
}

describe('the moderator story in a real browser', { timeout: 120_000 }, () => {
  const sessions: BrowserSession[] = [];
  let spammer: User;
  let reporter: User;
  let moderator: User;
  let spam: { recipe: { id: string; slug: string } };
  const word = `zqwatch${Date.now().toString(36)}`;
  const title = `Discount ${word} Watches Ale`;

  beforeAll(async () => {
    spammer = await createUser({ name: 'Watch Seller' });
    reporter = await createUser({ name: 'Careful Reader' });
    moderator = await createUser({ role: 'moderator', name: 'Mod on Duty' });
    const client = new TestClient();
    await client.signIn(spammer.email, TEST_PASSWORD);
    spam = await createRecipeVia(client, {
      document: paleAle({ title, notes: 'Buy watches at [our shop](https://deals.example/watches)' }),
    });
    await waitForSearch(word, (ids) => ids.includes(spam.recipe.id));
  });

  afterAll(async () => {
    for (const s of sessions) await s.close();
  });

  it('a member reports a spam recipe, a moderator hides it from the queue, and it leaves search and the recent page while its author still sees why', async () => {
    const member = await openBrowser();
    sessions.push(member);
    await signIn(member, reporter);
    await member.page.goto(`/recipes/${spam.recipe.slug}`);
    await member.page.getByRole('button', { name: 'Report this recipe' }).click();
    await member.page.getByLabel('Why are you reporting this recipe?').selectOption('spam');
    await member.page
      .getByLabel('Anything the moderators should know (optional)')
      .fill('Advertises watches; not a beer.');
    await member.shot('moderation-report-form');
    await member.page.getByRole('button', { name: 'Send report' }).click();
    await member.page.getByText('Reported', { exact: true }).waitFor();

    const mod = await openBrowser();
    sessions.push(mod);
    await signIn(mod, moderator);
    await (await openAccountMenu(mod.page)).getByRole('link', { name: 'Moderation' }).click();
    await mod.page.waitForURL('/admin/moderation');
    const item = mod.page.getByTestId('report-item').filter({ hasText: title });
    await item.getByText('Advertises watches; not a beer.').waitFor();
    await mod.shot('moderation-queue');
    await item.getByLabel(/^Reason/).fill('Advertising, not a recipe');
    await item.getByRole('button', { name: 'Hide it' }).click();
    await mod.page.getByText('Hidden.').waitFor();
    await item.waitFor({ state: 'detached' });

    await waitForSearch(word, (ids) => !ids.includes(spam.recipe.id));
    await member.page.goto(`/search?q=${word}`);
    await member.page.getByRole('heading', { level: 1 }).waitFor();
    await member.page.waitForLoadState('networkidle');
    expect(await member.page.content()).not.toContain(title);
    await member.page.goto('/recipes');
    expect(await member.page.content()).not.toContain(title);
    const hiddenPage = await member.page.goto(`/recipes/${spam.recipe.slug}`);
    expect(hiddenPage?.status()).toBe(404);

    const author = await openBrowser();
    sessions.push(author);
    await signIn(author, spammer);
    await author.page.goto(`/recipes/${spam.recipe.slug}`);
    await author.page.getByText('Moderators hid this recipe: Advertising, not a recipe').waitFor();
    await author.shot('moderation-hidden-owner-view');

    // The reader's 404 of the hidden recipe is the point of the story; nothing else may fail.
    expect(member.problems.filter((p) => !p.includes(`/recipes/${spam.recipe.slug}`))).toEqual([]);
    expect(mod.problems).toEqual([]);
    expect(author.problems).toEqual([]);
  });
});
