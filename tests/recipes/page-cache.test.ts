import { request as httpRequest } from 'node:http';
import { join } from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recipes, users } from '@/db/schema';
import { commentVia, hideRecipeThroughReport, textOf } from '../community/helpers';
import { SCREENSHOT_DIR, accountMenuButton, openBrowser, signInThroughPage } from '../helpers/browser';
import { BASE_URL } from '../helpers/env';
import { TestClient } from '../helpers/http';
import { expectKept, scriptSrc } from '../helpers/kept-pages';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { proposalTo } from '../proposals/helpers';

/** A GET with exactly these headers, the body as the bytes on the wire (fetch would decompress it). */
function rawGet(
  path: string,
  headers: Record<string, string>,
): Promise<{ status: number; headers: Record<string, string | string[] | undefined>; body: Buffer }> {
  return new Promise((resolve, reject) => {
    const req = httpRequest(new URL(path, BASE_URL), { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end();
  });
}

describe('recipe pages kept and shared by every reader who sees the same', () => {
  it('answers with the stored gzip or brotli copy the reader accepts, the same page and ETag in each', async () => {
    const { client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Compressed Kept Pale' }) });
    const path = `/recipes/${saved.recipe.slug}/v/1`;
    const address = { 'x-forwarded-for': new TestClient().address };
    const plain = await rawGet(path, { ...address, 'accept-encoding': 'identity' });
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body.toString('utf8')).toContain('Compressed Kept Pale');
    const cases: [string, string | undefined, (b: Buffer) => Buffer][] = [
      ['gzip', 'gzip', gunzipSync],
      ['gzip, deflate, br, zstd', 'br', brotliDecompressSync],
      ['br;q=0.5, gzip', 'gzip', gunzipSync],
      ['gzip;q=0, br;q=0', undefined, (b) => b],
    ];
    for (const [accept, encoding, decode] of cases) {
      const res = await rawGet(path, { ...address, 'accept-encoding': accept });
      expect(res.status, accept).toBe(200);
      expect(res.headers['content-encoding'], accept).toBe(encoding);
      expect(res.headers.vary, accept).toMatch(/Accept-Encoding/i);
      expect(res.headers.etag, accept).toBe(plain.headers.etag);
      expect(Number(res.headers['content-length']), accept).toBe(res.body.length);
      // Compressed once, not twice: the stored copy decodes straight to the page.
      expect(decode(res.body).equals(plain.body), accept).toBe(true);
      const again = await rawGet(path, {
        ...address,
        'accept-encoding': accept,
        'if-none-match': String(res.headers.etag),
      });
      expect(again.status, accept).toBe(304);
      expect(again.body.length, accept).toBe(0);
    }
  });

  it('answers every signed-out reader with the same kept copy, its inline scripts allowed by hash alone', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Kept Copy Pale' }) });
    const anon = new TestClient();
    for (const path of [`/recipes/${saved.recipe.slug}`, `/recipes/${saved.recipe.slug}/v/1`]) {
      const first = await anon.fetch(path);
      const etag = first.headers.get('etag');
      const html = await expectKept(first, path);
      expect(html).toContain('Kept Copy Pale');
      // Fresh readers land on either worker; each renders its own copy, byte for byte the same.
      for (let i = 0; i < 4; i++) {
        const second = await new TestClient().fetch(path);
        expect(second.headers.get('etag'), path).toBe(etag);
        expect(await second.text(), path).toBe(html);
      }
      expect((await anon.fetch(path, { headers: { 'if-none-match': etag! } })).status, path).toBe(304);
      // A signed-in reader and the owner see nothing here that others do not, so they get the same bytes.
      for (const member of [owner, reader]) {
        const theirs = await member.fetch(path);
        expect(theirs.headers.get('etag'), path).toBe(etag);
        expect(await expectKept(theirs, path), path).toBe(html);
      }
      // Moderators may see held and hidden things, so theirs is rendered per request with a fresh nonce.
      const mod = await moderator.fetch(path);
      expect(scriptSrc(mod.headers.get('content-security-policy') ?? ''), path).toMatch(/'nonce-[^']+'/);
      expect(mod.headers.get('cache-control'), path).not.toContain('public');
    }
  });

  it('renders per request for a signed-in reader who would see more than the shared page: their held comment, US units', async () => {
    const { client: owner } = await signedInClient();
    const { client: newcomer } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Held Comment Pale' }) });
    const head = `/recipes/${saved.recipe.slug}`;
    // A link from a brand-new account waits for a moderator: only its author (and moderators) see it.
    const held = await commentVia(newcomer, saved.recipe.id, 'My notes are at https://example.test/notes');
    expect(held.body.held).toBe(true);
    const shared = await expectKept(await new TestClient().fetch(head), head);
    expect(shared).not.toContain('example.test/notes');
    const own = await newcomer.fetch(head);
    expect(scriptSrc(own.headers.get('content-security-policy') ?? '')).toMatch(/'nonce-[^']+'/);
    expect(own.headers.get('cache-control')).not.toContain('public');
    expect(await own.text()).toContain('example.test/notes');
    // The owner still shares the kept copy: the held comment is not theirs to see.
    expect(await expectKept(await owner.fetch(head), head)).toBe(shared);

    const { user: usReader, client: us } = await signedInClient();
    await db.update(users).set({ units: 'us' }).where(eq(users.id, usReader.id));
    const theirs = await us.fetch(head);
    expect(scriptSrc(theirs.headers.get('content-security-policy') ?? '')).toMatch(/'nonce-[^']+'/);
  });

  it('keeps private and hidden recipes from signed-in readers who are not the owner', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const secret = await createRecipeVia(owner, { document: paleAle({ title: 'Members Private Pale' }) });
    const path = `/recipes/${secret.recipe.slug}/v/1`;
    await expectKept(await reader.fetch(path), path);
    expect((await owner.patch(`/api/recipes/${secret.recipe.id}`, { visibility: 'private' })).status).toBe(200);
    const refused = await reader.fetch(path);
    expect(refused.status).toBe(404);
    expect(await refused.text()).not.toContain('Members Private Pale');
    const mine = await owner.fetch(path);
    expect(mine.status).toBe(200);
    expect(mine.headers.get('cache-control')).toContain('no-store');
    expect(scriptSrc(mine.headers.get('content-security-policy') ?? '')).toMatch(/'nonce-[^']+'/);

    const spam = await createRecipeVia(owner, { document: paleAle({ title: 'Members Hidden Pale' }) });
    const spamPath = `/recipes/${spam.recipe.slug}`;
    await expectKept(await reader.fetch(spamPath), spamPath);
    const report = await reader.post<{ id: string }>('/api/reports', {
      targetType: 'recipe',
      targetId: spam.recipe.id,
      reason: 'spam',
      note: '',
    });
    expect(report.status).toBe(201);
    expect(
      (await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'hide', reason: 'Advertising' }))
        .status,
    ).toBe(200);
    const gone = await reader.fetch(spamPath);
    expect(gone.status).toBe(404);
    expect(await gone.text()).not.toContain('Members Hidden Pale');
    const ownersView = await owner.fetch(spamPath);
    expect(ownersView.status).toBe(200);
    expect(ownersView.headers.get('cache-control')).toContain('no-store');
  });

  it('never puts a member secret into the fingerprint: a new password leaves the kept copy as it was', async () => {
    const { user, client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Password Change Pale' }) });
    const head = `/recipes/${saved.recipe.slug}`;
    const before = (await new TestClient().fetch(head)).headers.get('etag');
    await db
      .update(users)
      .set({ passwordHash: 'changed', email: `changed-${user.email}` })
      .where(eq(users.id, user.id));
    expect((await new TestClient().fetch(head)).headers.get('etag')).toBe(before);
    await db.update(users).set({ name: 'Renamed Brewer' }).where(eq(users.id, user.id));
    const renamed = await new TestClient().fetch(head);
    expect(renamed.headers.get('etag')).not.toBe(before);
    expect(await renamed.text()).toContain('Renamed Brewer');
  });

  it("gives a fresh page when a proposal's fork is renamed, its proposer renames themselves, and a co-author does", async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const accepted = await owner.client.post(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(accepted.status).toBe(201);
    const anon = new TestClient();
    const head = `/recipes/${p.source.recipe.slug}`;
    const first = await anon.fetch(head);
    const etags = [first.headers.get('etag')];
    const page = textOf(await expectKept(first, head));
    // The accepted change credits its proposer beside the owner, and the proposal stays listed.
    expect(page).toContain(`by ${owner.user.name} with ${p.proposer.user.name}`);
    expect(page).toContain(`${p.proposer.user.name} offers`);
    expect(page).toContain('Forks (1)');

    // The fork's title, which only the proposal list shows here.
    await db.update(recipes).set({ title: 'Renamed Fork Lager' }).where(eq(recipes.id, p.fork.recipe.id));
    const renamedFork = await anon.fetch(head);
    etags.push(renamedFork.headers.get('etag'));
    expect(textOf(await expectKept(renamedFork, head))).toContain(`${p.proposer.user.name} offers Renamed Fork Lager`);

    // The proposer's name, in the list and in the credit.
    await db.update(users).set({ name: 'Rowan Proposer Renamed' }).where(eq(users.id, p.proposer.user.id));
    const renamedProposer = await anon.fetch(head);
    etags.push(renamedProposer.headers.get('etag'));
    const afterRename = textOf(await expectKept(renamedProposer, head));
    expect(afterRename).toContain('Rowan Proposer Renamed offers');
    expect(afterRename).toContain('with Rowan Proposer Renamed');

    // Once the fork is private the proposal is no longer shown to others; the co-author credit still is.
    expect((await p.proposer.client.patch(`/api/recipes/${p.fork.recipe.id}`, { visibility: 'private' })).status).toBe(
      200,
    );
    const privateFork = await anon.fetch(head);
    etags.push(privateFork.headers.get('etag'));
    const withoutFork = textOf(await expectKept(privateFork, head));
    expect(withoutFork).not.toContain('Renamed Fork Lager');
    expect(withoutFork).toContain('Forks (0)');
    await db.update(users).set({ name: 'Co-author Renamed Again' }).where(eq(users.id, p.proposer.user.id));
    for (const path of [head, `${head}/v/2`]) {
      const coAuthor = await anon.fetch(path);
      if (path === head) etags.push(coAuthor.headers.get('etag'));
      expect(textOf(await expectKept(coAuthor, path)), path).toContain('with Co-author Renamed Again');
    }
    expect(new Set(etags).size).toBe(etags.length);
  });

  it('shows a new comment, star and version on the next request after each one', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Changing Pale' }) });
    const anon = new TestClient();
    const head = `/recipes/${saved.recipe.slug}`;
    const before = await expectKept(await anon.fetch(head), head);
    expect(before).not.toContain('Lovely late hop aroma');
    expect((await commentVia(reader, saved.recipe.id, 'Lovely late hop aroma')).status).toBe(201);
    expect(await expectKept(await anon.fetch(head), head)).toContain('Lovely late hop aroma');

    const version1 = await anon.fetch(`${head}/v/1`);
    const etag1 = version1.headers.get('etag');
    expect((await reader.put(`/api/recipes/${saved.recipe.id}/star`, {})).status).toBeLessThan(300);
    const starred = await anon.fetch(`${head}/v/1`);
    expect(starred.headers.get('etag')).not.toBe(etag1);

    const next = await owner.post(`/api/recipes/${saved.recipe.id}/versions`, {
      document: paleAle({ title: 'Changing Pale' }),
      baseVersionId: saved.version.id,
      message: 'More late hops',
    });
    expect(next.status).toBe(201);
    expect(await expectKept(await anon.fetch(head), head)).toContain('More late hops');
  });

  it('stops serving a kept page at once when moderators hide the recipe or its owner makes it private', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const anon = new TestClient();

    const spam = await createRecipeVia(owner, { document: paleAle({ title: 'Soon Hidden Pale' }) });
    const paths = [`/recipes/${spam.recipe.slug}`, `/recipes/${spam.recipe.slug}/v/1`];
    for (const path of paths) await expectKept(await anon.fetch(path), path);
    await hideRecipeThroughReport(reader, moderator, spam.recipe.id);
    for (const path of paths) {
      const res = await anon.fetch(path);
      expect(res.status, path).toBe(404);
      expect(await res.text(), path).not.toContain('Soon Hidden Pale');
    }

    const secret = await createRecipeVia(owner, { document: paleAle({ title: 'Soon Private Pale' }) });
    const secretPaths = [`/recipes/${secret.recipe.slug}`, `/recipes/${secret.recipe.slug}/v/1`];
    for (const path of secretPaths) await expectKept(await anon.fetch(path), path);
    expect((await owner.patch(`/api/recipes/${secret.recipe.id}`, { visibility: 'private' })).status).toBe(200);
    for (const path of secretPaths) expect((await anon.fetch(path)).status, path).toBe(404);
    const mine = await owner.fetch(secretPaths[1]);
    expect(mine.status).toBe(200);
    expect(mine.headers.get('cache-control')).toContain('no-store');
  });

  it('hides a comment from the kept page as soon as moderators hide it', async () => {
    const { client: owner } = await signedInClient();
    const { client: author } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const saved = await createRecipeVia(owner);
    const c = await commentVia(author, saved.recipe.id, 'Rude words about the bittering');
    const head = `/recipes/${saved.recipe.slug}`;
    const anon = new TestClient();
    expect(await expectKept(await anon.fetch(head), head)).toContain('Rude words about the bittering');
    const report = await owner.post<{ id: string }>('/api/reports', {
      targetType: 'comment',
      targetId: c.body.comment.id,
      reason: 'spam',
      note: '',
    });
    await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'hide', reason: 'Be kind' });
    expect(await expectKept(await anon.fetch(head), head)).not.toContain('Rude words about the bittering');
  });

  it('runs the kept page in a browser under its hash-only policy, with no script refused', async () => {
    const { client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Browser Kept Pale' }) });
    const s = await openBrowser();
    try {
      const res = await s.page.goto(`/recipes/${saved.recipe.slug}/v/1`);
      expect(scriptSrc((await res!.allHeaders())['content-security-policy'] ?? '')).toContain("'sha256-");
      await s.page.locator('html[data-hydrated]').waitFor({ state: 'attached', timeout: 15_000 });
      await s.page.getByRole('heading', { name: 'Browser Kept Pale' }).waitFor();
      expect(s.problems).toEqual([]);
    } finally {
      await s.close();
    }
  });
});

describe('a signed-in reader of a kept page', () => {
  it('gets the very bytes a signed-out reader gets, then sees their own header, star, follow and forms fill in', async () => {
    const { client: owner } = await signedInClient();
    const { user, client: reader } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Shared Bytes Pale' }) });
    expect((await reader.put(`/api/recipes/${saved.recipe.id}/star`, {})).status).toBeLessThan(300);
    const path = `/recipes/${saved.recipe.slug}/v/1`;
    const anon = await new TestClient().fetch(path);
    const shared = await expectKept(anon, path);
    for (const width of [1280, 390]) {
      const s = await openBrowser({ width });
      try {
        await signInThroughPage(s, user.email);
        const res = await s.page.goto(path);
        expect(res!.headers().etag).toBe(anon.headers.get('etag'));
        expect(await res!.text()).toBe(shared);
        expect(await accountMenuButton(s.page).textContent()).toContain(user.name!);
        await s.page.getByRole('button', { name: /Starred/ }).waitFor();
        expect(await s.page.getByRole('button', { name: /Starred/ }).getAttribute('aria-pressed')).toBe('true');
        await s.page.getByRole('button', { name: /^Follow/ }).waitFor();
        await s.page.getByRole('heading', { name: 'Brew it your way' }).waitFor();
        await s.page.getByLabel('Add a comment').waitFor();
        expect(await s.page.getByRole('link', { name: 'Edit', exact: true }).count()).toBe(0);
        expect(await s.page.getByText('to fork this recipe').isVisible()).toBe(false);
        await s.shot(`kept-page-signed-in-${width}`);
        await s.page.screenshot({ path: join(SCREENSHOT_DIR, `kept-page-signed-in-${width}-top.png`) });
        expect(s.problems).toEqual([]);
      } finally {
        await s.close();
      }
    }
  });

  it('shows the owner their Edit and visibility controls on the same kept copy, and nobody else', async () => {
    const { user, client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Owner Islands Pale' }) });
    const head = `/recipes/${saved.recipe.slug}`;
    const anon = await new TestClient().fetch(head);
    const shared = await expectKept(anon, head);
    const s = await openBrowser();
    try {
      await signInThroughPage(s, user.email);
      const res = await s.page.goto(head);
      expect(await res!.text()).toBe(shared);
      await s.page.getByRole('link', { name: 'Edit', exact: true }).waitFor();
      await s.page.getByLabel('Who can see this recipe').waitFor();
      // Their own recipe: no follow or report buttons, and the star is theirs to give.
      await s.page.getByRole('button', { name: /^Star \(/ }).waitFor();
      expect(await s.page.getByRole('button', { name: /^Follow/ }).count()).toBe(0);
      expect(await s.page.getByRole('button', { name: /Report this recipe/ }).count()).toBe(0);
      expect(s.problems).toEqual([]);
    } finally {
      await s.close();
    }
    const stranger = await openBrowser();
    try {
      await stranger.page.goto(head);
      await stranger.page.getByRole('link', { name: 'Sign in' }).first().waitFor();
      expect(await stranger.page.getByRole('link', { name: 'Edit', exact: true }).count()).toBe(0);
      expect(await stranger.page.getByLabel('Who can see this recipe').count()).toBe(0);
      expect(stranger.problems).toEqual([]);
    } finally {
      await stranger.close();
    }
  });
});
