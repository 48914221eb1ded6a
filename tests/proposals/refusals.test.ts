import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { proposals, recipeVersions, recipes } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { forkVia, kveikChange, proposalTo, proposeVia, type ApiError } from './helpers';

async function versionCount(recipeId: string): Promise<number> {
  return (await db.select({ id: recipeVersions.id }).from(recipeVersions).where(eq(recipeVersions.recipeId, recipeId)))
    .length;
}

describe('proposals refuse what they must, with a clear message', () => {
  it('refuses proposing to a recipe the member cannot see, as if it did not exist', async () => {
    const owner = await signedInClient();
    const source = await createRecipeVia(owner.client);
    const proposer = await signedInClient();
    const fork = await forkVia(proposer.client, source.version.id);
    await owner.client.patch(`/api/recipes/${source.recipe.id}`, { visibility: 'private' });
    const res = await proposeVia(proposer.client, fork.version.id, { sourceRecipeId: source.recipe.id });
    expect(res.status).toBe(404);
    expect(res.body.error?.message).toBe('No such recipe.');
    // Left to default to the recipe it came from: the same.
    expect((await proposeVia(proposer.client, fork.version.id)).status).toBe(404);
  });

  it('refuses proposing to a recipe that is not an ancestor of the fork, naming the field', async () => {
    const owner = await signedInClient();
    const source = await createRecipeVia(owner.client);
    const unrelated = await createRecipeVia(owner.client, { document: paleAle({ title: 'Unrelated bitter' }) });
    const proposer = await signedInClient();
    const fork = await forkVia(proposer.client, source.version.id);
    const res = await proposeVia(proposer.client, fork.version.id, { sourceRecipeId: unrelated.recipe.id });
    expect(res.status).toBe(400);
    expect(res.body.error?.message).toMatch(/“Unrelated bitter” is not a recipe your fork descends from/);
    expect(res.body.error?.fields).toEqual([{ path: 'sourceRecipeId', message: 'Not an ancestor of your fork.' }]);
    // A fork's own descendants are not its ancestors either.
    const grandchild = await forkVia(owner.client, fork.version.id);
    const down = await proposeVia(proposer.client, fork.version.id, { sourceRecipeId: grandchild.recipe.id });
    expect(down.status).toBe(400);
  });

  it('refuses a version that is not the member’s own, and a recipe that is no fork', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const stranger = await signedInClient();
    const notMine = await proposeVia(stranger.client, p.proposedVersion.id);
    expect(notMine.status).toBe(403);
    expect(notMine.body.error?.fields?.[0]).toEqual({
      path: 'versionId',
      message: 'You can propose only a version of your own fork.',
    });

    const original = await createRecipeVia(stranger.client);
    const noFork = await proposeVia(stranger.client, original.version.id);
    expect(noFork.status).toBe(400);
    expect(noFork.body.error?.fields?.[0].path).toBe('versionId');
    expect(noFork.body.error?.message).toMatch(/is not a fork/);

    const bad = await stranger.client.post<ApiError>('/api/proposals', { versionId: 'nope', title: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields!.map((f) => f.path).sort()).toEqual(['title', 'versionId']);
    expect(
      (await new TestClient().post('/api/proposals', { versionId: p.proposedVersion.id, title: 'x' })).status,
    ).toBe(401);
  });

  it('refuses proposing from a private fork, and a second open proposal from the same fork', async () => {
    const owner = await signedInClient();
    const source = await createRecipeVia(owner.client);
    const proposer = await signedInClient();
    const fork = await forkVia(proposer.client, source.version.id, { visibility: 'private' });
    const hidden = await proposeVia(proposer.client, fork.version.id);
    expect(hidden.status).toBe(400);
    expect(hidden.body.error?.message).toMatch(/Your fork is private/);
    await proposer.client.patch(`/api/recipes/${fork.recipe.id}`, { visibility: 'unlisted' });
    expect((await proposeVia(proposer.client, fork.version.id)).status).toBe(201);
    const twice = await proposeVia(proposer.client, fork.version.id);
    expect(twice.status).toBe(409);
    expect(twice.body.error?.message).toMatch(/already has an open proposal/);
  });

  it('refuses accepting or deciding a proposal that is not yours to accept', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const stranger = await signedInClient();
    const moderator = await signedInClient('moderator');
    for (const client of [stranger.client, p.proposer.client, moderator.client]) {
      const res = await client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
        sourceHeadVersionId: p.source.version.id,
      });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/Only the owner of .* can accept this proposal/);
    }
    expect(
      (await stranger.client.post(`/api/proposals/${p.id}/decision`, { decision: 'declined', comment: 'No.' })).status,
    ).toBe(403);
    expect((await owner.client.patch(`/api/proposals/${p.id}`, { title: 'Mine now' })).status).toBe(403);
    expect((await owner.client.post(`/api/proposals/${p.id}/withdraw`)).status).toBe(403);
    const noComment = await owner.client.post<ApiError>(`/api/proposals/${p.id}/decision`, {
      decision: 'declined',
      comment: ' ',
    });
    expect(noComment.status).toBe(400);
    expect(noComment.body.error.fields).toEqual([{ path: 'comment', message: 'Say why, so the proposer knows.' }]);
    expect((await new TestClient().get(`/api/proposals/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    expect((await new TestClient().get(`/api/proposals/not-an-id`)).status).toBe(404);
    expect(await versionCount(p.source.recipe.id)).toBe(1);
  });

  it('accepts once: a second acceptance, even at the same moment, gets 409 saying it was already accepted', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const body = { sourceHeadVersionId: p.source.version.id };
    const [a, b] = await Promise.all([
      owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, body),
      owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, body),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const loser = a.status === 409 ? a : b;
    expect(loser.body.error.message).toMatch(/already accepted as version 2/);
    expect(await versionCount(p.source.recipe.id)).toBe(2);
    const again = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, body);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('This proposal was already accepted as version 2. Nothing more was saved.');
    expect(
      (await owner.client.post(`/api/proposals/${p.id}/decision`, { decision: 'declined', comment: 'Too late' }))
        .status,
    ).toBe(409);
  });

  it('refuses accepting when the proposed version is no longer visible: the fork went private, or moderators hid it', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    await p.proposer.client.patch(`/api/recipes/${p.fork.recipe.id}`, { visibility: 'private' });
    const res = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/The proposed version is no longer visible/);
    const page = await (await owner.client.fetch(`/proposals/${p.id}`)).text();
    expect(page).toContain('The proposed version is no longer visible');
    expect(await versionCount(p.source.recipe.id)).toBe(1);

    const q = await proposalTo(owner.client);
    await db
      .update(recipes)
      .set({ hiddenAt: new Date(), hiddenReason: 'Spam' })
      .where(eq(recipes.id, q.fork.recipe.id));
    const hidden = await owner.client.post<ApiError>(`/api/proposals/${q.id}/accept`, {
      sourceHeadVersionId: q.source.version.id,
    });
    expect(hidden.status).toBe(409);
    expect(hidden.body.error.message).toMatch(/no longer visible/);
    // Nor can it be moved to a newer version while the owner cannot see the fork.
    const newer = await saveVia(q.proposer.client, q.fork.recipe.id, q.proposedVersion.id, kveikChange(), 'Again');
    const moved = await q.proposer.client.patch<ApiError>(`/api/proposals/${q.id}`, {
      versionId: newer.body.version.id,
    });
    expect(moved.status).toBe(409);
  });

  it('refuses moving a proposal to an older version or a version of another recipe, naming the field', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const older = await p.proposer.client.patch<ApiError>(`/api/proposals/${p.id}`, { versionId: p.fork.version.id });
    expect(older.status).toBe(400);
    expect(older.body.error.fields?.[0]).toEqual({
      path: 'versionId',
      message: `Not newer than version ${p.proposedVersion.number}.`,
    });
    const elsewhere = await p.proposer.client.patch<ApiError>(`/api/proposals/${p.id}`, {
      versionId: p.source.version.id,
    });
    expect(elsewhere.status).toBe(400);
    expect(elsewhere.body.error.fields?.[0].path).toBe('versionId');
    const empty = await p.proposer.client.patch<ApiError>(`/api/proposals/${p.id}`, {});
    expect(empty.status).toBe(400);
    const [row] = await db.select().from(proposals).where(eq(proposals.id, p.id));
    expect(row.proposedVersionId).toBe(p.proposedVersion.id);
  });

  it('merges additions on both sides, and refuses a merged document that would not be a valid recipe, naming the field', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    // Both sides replaced the clean ale yeast, differently: each addition merges in, no conflict.
    const doc = paleAle({ yeasts: [{ name: 'Lager yeast', kind: 'lager', attenuationPct: 75 }] });
    const head = await saveVia(owner.client, p.source.recipe.id, p.source.version.id, doc, 'Lager it');
    const view = (await owner.client.get<{ proposal: { conflicts: { path: string }[] } }>(`/api/proposals/${p.id}`))
      .body.proposal;
    expect(view.conflicts).toEqual([]);
    const ok = await owner.client.post<{ version: { id: string } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.body.version.id,
    });
    expect(ok.status).toBe(201);
    const [v] = await db.select().from(recipeVersions).where(eq(recipeVersions.id, ok.body.version.id));
    expect((v.document as { yeasts: { name: string }[] }).yeasts.map((y) => y.name)).toEqual(['Lager yeast', 'Kveik']);

    // Hop time longer than the boil: the owner shortens the boil, the fork adds a 60-minute hop.
    const q = await proposalTo(owner.client);
    const shortBoil = paleAle();
    shortBoil.batch.boilTimeMin = 30;
    shortBoil.hops = shortBoil.hops.map((h) => (h.use === 'boil' ? { ...h, timeMin: Math.min(h.timeMin, 30) } : h));
    const qHead = await saveVia(owner.client, q.source.recipe.id, q.source.version.id, shortBoil, 'Short boil');
    expect(qHead.status).toBe(201);
    const forkDoc = kveikChange();
    forkDoc.hops = [
      ...forkDoc.hops,
      { name: 'Chinook', amountG: 10, alphaPct: 13, use: 'boil', timeMin: 60, form: 'pellet' },
    ];
    const newer = await saveVia(
      q.proposer.client,
      q.fork.recipe.id,
      q.proposedVersion.id,
      forkDoc,
      'Bittering Chinook',
    );
    expect((await q.proposer.client.patch(`/api/proposals/${q.id}`, { versionId: newer.body.version.id })).status).toBe(
      200,
    );
    const invalid = await owner.client.post<ApiError>(`/api/proposals/${q.id}/accept`, {
      sourceHeadVersionId: qHead.body.version.id,
    });
    expect(invalid.status).toBe(400);
    expect(invalid.body.error.message).toMatch(
      /The merged recipe would not be valid: Hop time \(60 min\) cannot be longer than the boil \(30 min\)/,
    );
    expect(invalid.body.error.fields?.[0].path).toMatch(/^document\.hops\.\d+\.timeMin$/);
    expect(await versionCount(q.source.recipe.id)).toBe(2);
  });
});

describe('moderation of proposals', () => {
  it('lets members report a proposal; hidden, it vanishes for everyone but its author and moderators', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const reporter = await signedInClient();
    const moderator = await signedInClient('moderator');
    const own = await p.proposer.client.post<ApiError>('/api/reports', {
      targetType: 'proposal',
      targetId: p.id,
      reason: 'spam',
    });
    expect(own.status).toBe(400);
    const report = await reporter.client.post<{ id: string }>('/api/reports', {
      targetType: 'proposal',
      targetId: p.id,
      reason: 'spam',
      note: 'Advert',
    });
    expect(report.status).toBe(201);
    const queue = await (await moderator.client.fetch('/admin/moderation')).text();
    expect(queue).toContain(`/proposals/${p.id}`);
    expect(
      (
        await moderator.client.post(`/api/moderation/reports/${report.body.id}`, {
          action: 'hide',
          reason: 'Advertising',
        })
      ).status,
    ).toBe(200);

    expect((await new TestClient().get(`/api/proposals/${p.id}`)).status).toBe(404);
    expect((await reporter.client.get(`/api/proposals/${p.id}`)).status).toBe(404);
    expect((await owner.client.get(`/api/proposals/${p.id}`)).status).toBe(404);
    expect(
      (await owner.client.post(`/api/proposals/${p.id}/accept`, { sourceHeadVersionId: p.source.version.id })).status,
    ).toBe(404);
    expect((await owner.client.get<{ incoming: unknown[] }>('/api/proposals')).body.incoming).toEqual([]);
    expect((await p.proposer.client.get(`/api/proposals/${p.id}`)).status).toBe(200);
    expect((await moderator.client.get(`/api/proposals/${p.id}`)).status).toBe(200);
    const authorPage = (await (await p.proposer.client.fetch(`/proposals/${p.id}`)).text()).replace(/<!-- -->/g, '');
    expect(authorPage.includes('Moderators hid this proposal: Advertising'), 'the author sees why it is hidden').toBe(
      true,
    );
    expect(
      (await reporter.client.post('/api/reports', { targetType: 'proposal', targetId: p.id, reason: 'spam' })).status,
    ).toBe(404);
  });
});
