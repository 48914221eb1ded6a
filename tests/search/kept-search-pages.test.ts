// Search pages kept for signed-out readers (lib/page-cache.ts): one copy per address and per answer of
// the search engine, so a new recipe, a hidden one or a private one shows (or goes) with the index.
import { describe, expect, it } from 'vitest';
import { openBrowser } from '../helpers/browser';
import { TestClient } from '../helpers/http';
import { expectKept, scriptSrc } from '../helpers/kept-pages';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { hideRecipeThroughReport } from '../community/helpers';
import { uniqueWord, waitForSearch } from './app-search';

describe('search pages kept for signed-out readers', () => {
  it('answers from one kept copy until the index changes, then shows a new recipe and loses a hidden one', async () => {
    const word = uniqueWord('kept');
    const title = `Kept Search ${word}`;
    const { client: owner } = await signedInClient();
    const { client: reporter } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const path = `/search?q=${word}`;

    const first = await new TestClient().fetch(path);
    const empty = await expectKept(first, path);
    const again = await new TestClient().fetch(path);
    expect(again.headers.get('etag')).toBe(first.headers.get('etag'));
    expect(await again.text()).toBe(empty);

    const saved = await createRecipeVia(owner, { document: paleAle({ title }) });
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 1);
    const found = await expectKept(await new TestClient().fetch(path), path);
    expect(found).toContain(title);
    expect(found).not.toBe(empty);

    await hideRecipeThroughReport(reporter, moderator, saved.recipe.id);
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 0);
    const hidden = await expectKept(await new TestClient().fetch(path), path);
    expect(hidden).not.toContain(title);
  });

  it('keeps the same copy through a save that changes nothing the results show', async () => {
    const word = uniqueWord('steady');
    const noteWord = uniqueWord('note');
    const { client: owner } = await signedInClient();
    const document = paleAle({ title: `Steady Pale ${word}` });
    const saved = await createRecipeVia(owner, { document });
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 1);
    const path = `/search?q=${word}`;
    const before = await new TestClient().fetch(path);
    const html = await expectKept(before, path);

    const save = await saveVia(owner, saved.recipe.id, saved.version.id, {
      ...document,
      notes: `Now with ${noteWord}.`,
    });
    expect(save.status).toBe(201);
    // Once the index holds the new version, the page is the same answer, so the same bytes.
    await waitForSearch(new TestClient(), { q: noteWord }, (body) => body.total === 1);
    const after = await new TestClient().fetch(path);
    expect(after.headers.get('etag')).toBe(before.headers.get('etag'));
    expect(await expectKept(after, path)).toBe(html);
  });

  it('keeps each address apart: another search, or the same words in another order of results, is its own page', async () => {
    const word = uniqueWord('apart');
    const { client: owner } = await signedInClient();
    await createRecipeVia(owner, { document: paleAle({ title: `Apart Pale ${word}` }) });
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 1);
    const plain = await expectKept(await new TestClient().fetch(`/search?q=${word}`), word);
    const sorted = await expectKept(await new TestClient().fetch(`/search?q=${word}&sort=newest`), word);
    const other = await expectKept(await new TestClient().fetch(`/search?q=${uniqueWord('none')}`), 'other');
    expect(plain).toContain(`Apart Pale ${word}`);
    expect(sorted).toContain(`Apart Pale ${word}`);
    expect(sorted).not.toBe(plain);
    expect(other).not.toContain(`Apart Pale ${word}`);
  });

  it('renders per request for a signed-in member, who also finds their own private recipe', async () => {
    const word = uniqueWord('mine');
    const title = `Private Search ${word}`;
    const { client: owner } = await signedInClient();
    await createRecipeVia(owner, { document: paleAle({ title }), visibility: 'private' });
    await waitForSearch(owner, { q: word }, (body) => body.total === 1);
    const path = `/search?q=${word}`;

    const theirs = await owner.fetch(path);
    expect(theirs.status).toBe(200);
    expect(scriptSrc(theirs.headers.get('content-security-policy') ?? '')).toMatch(/'nonce-[^']+'/);
    expect(theirs.headers.get('cache-control')).not.toContain('public');
    expect(await theirs.text()).toContain(title);

    const everyone = await expectKept(await new TestClient().fetch(path), path);
    expect(everyone).not.toContain(title);
  });

  it('runs the kept page in a browser under its hash-only policy, and searches on from there', async () => {
    const word = uniqueWord('browse');
    const { client: owner } = await signedInClient();
    await createRecipeVia(owner, { document: paleAle({ title: `Browser Search ${word}` }) });
    await waitForSearch(new TestClient(), { q: word }, (body) => body.total === 1);
    const s = await openBrowser();
    try {
      const res = await s.page.goto(`/search?q=${word}`);
      expect(scriptSrc((await res!.allHeaders())['content-security-policy'] ?? '')).toContain("'sha256-");
      await s.page.locator('html[data-hydrated]').waitFor({ state: 'attached', timeout: 15_000 });
      await s.page.getByRole('link', { name: `Browser Search ${word}` }).waitFor();
      await s.page.getByLabel('Search recipes').fill(uniqueWord('nothing'));
      await s.page.getByRole('heading', { name: 'No recipes match this search' }).waitFor({ timeout: 10_000 });
      expect(s.problems).toEqual([]);
    } finally {
      await s.close();
    }
  });
});
