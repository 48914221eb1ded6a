import { describe, expect, it } from 'vitest';
import { openBrowser, signInThroughPage } from '../helpers/browser';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

/**
 * A page's HTML with its per-request script nonce taken out, attributes and all, as a kept copy
 * (lib/page-cache.ts) has it, for comparing a signed-out reader's kept copy with another's render.
 */
async function withoutNonce(res: Response): Promise<string> {
  const nonce = /'nonce-([^']+)'/.exec(res.headers.get('content-security-policy') ?? '')?.[1];
  const html = (await res.text()).replace(/(<(?:script|link)\b[^>]*?)\s+nonce="[^"]*"/g, '$1');
  return nonce ? html.split(nonce).join('') : html;
}

describe("a member page's follow button", () => {
  it('is a client island: another member gets the HTML a signed-out reader gets, and their follow from /api/me/members/[id]', async () => {
    const { user: brewer, client: brewerClient } = await signedInClient();
    const { user: reader, client } = await signedInClient();
    await createRecipeVia(brewerClient, { document: paleAle({ title: 'Island Page Pale' }) });
    const path = `/members/${brewer.handle}`;
    const anon = await withoutNonce(await new TestClient().fetch(path));
    expect(anon).toContain('Island Page Pale');
    expect(await withoutNonce(await client.fetch(path))).toBe(anon);

    const standing = `/api/me/members/${brewer.id}`;
    expect((await new TestClient().get(standing)).status).toBe(401);
    expect((await client.get(standing)).body).toEqual({ following: false });
    expect((await client.post('/api/follows', { type: 'member', id: brewer.id })).status).toBeLessThan(300);
    expect((await client.get(standing)).body).toEqual({ following: true });
    // Following changes nothing in the page itself but the follower count, the same for everyone.
    expect(await withoutNonce(await client.fetch(path))).toBe(await withoutNonce(await new TestClient().fetch(path)));
    const missing = await client.get<{ error: { message: string } }>('/api/me/members/no-such-member');
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toMatch(/member/i);
    expect(reader.id).not.toBe(brewer.id);
  });

  it('shows a signed-in reader their own follow state and lets them change it; the member sees their settings link', async () => {
    const { user: brewer } = await signedInClient();
    const { user: reader, client } = await signedInClient();
    expect((await client.post('/api/follows', { type: 'member', id: brewer.id })).status).toBeLessThan(300);
    const path = `/members/${brewer.handle}`;
    // The phone first: the desktop pass then unfollows.
    for (const width of [390, 1280]) {
      const s = await openBrowser({ width });
      try {
        await signInThroughPage(s, reader.email);
        await s.page.goto(path);
        const follow = s.page.getByRole('button', { name: /^Following/ });
        await follow.waitFor();
        expect(await follow.getAttribute('aria-pressed')).toBe('true');
        await s.shot(`member-page-follow-${width}`);
        if (width === 1280) {
          await follow.click();
          await s.page.getByRole('button', { name: /^Follow\b/ }).waitFor();
          expect((await client.get(`/api/me/members/${brewer.id}`)).body).toEqual({ following: false });
          await s.page.reload();
          const again = s.page.getByRole('button', { name: /^Follow\b/ });
          await again.waitFor();
          expect(await again.getAttribute('aria-pressed')).toBe('false');
        }
        expect(await s.page.getByRole('link', { name: 'Edit profile and settings' }).count()).toBe(0);
        expect(s.problems).toEqual([]);
      } finally {
        await s.close();
      }
    }
    const own = await openBrowser({ width: 390 });
    try {
      await signInThroughPage(own, brewer.email);
      await own.page.goto(path);
      await own.page.getByRole('link', { name: 'Edit profile and settings' }).waitFor();
      expect(await own.page.getByRole('button', { name: /^Follow/ }).count()).toBe(0);
      await own.shot('member-page-own-390');
      expect(own.problems).toEqual([]);
    } finally {
      await own.close();
    }
    const stranger = await openBrowser();
    try {
      await stranger.page.goto(path);
      await stranger.page.getByRole('heading', { level: 1 }).waitFor();
      expect(await stranger.page.getByRole('button', { name: /^Follow/ }).count()).toBe(0);
      expect(stranger.problems).toEqual([]);
    } finally {
      await stranger.close();
    }
  });
});
