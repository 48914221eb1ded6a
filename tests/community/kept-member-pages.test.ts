import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { expectKept, scriptSrc } from '../helpers/kept-pages';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { hideRecipeThroughReport } from './helpers';

describe('home, about and guide pages kept for every reader', () => {
  it('answers signed-out and signed-in readers with the same bytes under a hash-only policy', async () => {
    const { client: member } = await signedInClient();
    for (const path of ['/', '/about', '/guides']) {
      const first = await new TestClient().fetch(path);
      const html = await expectKept(first, path);
      const etag = first.headers.get('etag');
      for (let i = 0; i < 3; i++) {
        const again = await new TestClient().fetch(path);
        expect(again.headers.get('etag'), path).toBe(etag);
        expect(await again.text(), path).toBe(html);
      }
      // The header's sign-in state is a client island, so a member gets the very same page.
      const theirs = await member.fetch(path);
      expect(await expectKept(theirs, path), path).toBe(html);
    }
  });

  it('leaves an unknown guide to the app, which answers 404 every time', async () => {
    for (let i = 0; i < 3; i++) {
      const res = await new TestClient().fetch('/guides/no-such-guide-here');
      expect(res.status).toBe(404);
      expect(res.headers.get('cache-control')).not.toContain('public');
    }
  });
});

describe('member pages kept for signed-out readers', () => {
  it('shows a new recipe, a follower and a hidden recipe on the next request after each', async () => {
    const { user: brewer, client: owner } = await signedInClient();
    const { client: follower } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const path = `/members/${brewer.handle}`;
    const anon = new TestClient();

    const before = await expectKept(await anon.fetch(path), path);
    expect(before).toContain('No public recipes yet.');

    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Member Page Kept Pale' }) });
    const withRecipe = await expectKept(await anon.fetch(path), path);
    expect(withRecipe).toContain('Member Page Kept Pale');

    expect((await follower.post('/api/follows', { type: 'member', id: brewer.id })).status).toBeLessThan(300);
    const followed = await expectKept(await anon.fetch(path), path);
    expect(followed).not.toBe(withRecipe);

    await hideRecipeThroughReport(follower, moderator, saved.recipe.id);
    const hidden = await expectKept(await anon.fetch(path), path);
    expect(hidden).not.toContain('Member Page Kept Pale');
  });

  it('renders per request for signed-in readers, and answers 404 at once when the member is suspended', async () => {
    const { user: brewer, client: owner } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    await createRecipeVia(owner, { document: paleAle({ title: 'Suspended Brewer Pale' }) });
    const path = `/members/${brewer.handle}`;
    await expectKept(await new TestClient().fetch(path), path);

    // The member themselves (and moderators) may see more, so theirs has a fresh nonce and is not shared.
    for (const client of [owner, moderator]) {
      const res = await client.fetch(path);
      expect(res.status).toBe(200);
      expect(scriptSrc(res.headers.get('content-security-policy') ?? '')).toMatch(/'nonce-[^']+'/);
      expect(res.headers.get('cache-control')).not.toContain('public');
    }

    const suspend = await moderator.put(`/api/users/${brewer.id}/suspension`, { suspended: true, reason: 'spam' });
    expect(suspend.status).toBe(200);
    const gone = await new TestClient().fetch(path);
    expect(gone.status).toBe(404);
    expect(await gone.text()).not.toContain('Suspended Brewer Pale');
  });
});
