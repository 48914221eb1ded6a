import { eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { moderationActions, reports, users } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { commentsOf, commentVia, textOf } from './helpers';

interface QueueBody {
  reports: { targetType: string; targetId: string; reports: { id: string; note: string }[] }[];
}

async function reportVia(client: TestClient, targetType: string, targetId: string, note = '') {
  return client.post<{ id: string; error?: { message: string } }>('/api/reports', {
    targetType,
    targetId,
    reason: 'spam',
    note,
  });
}

describe('reports and the moderation queue', () => {
  it('hides a reported recipe from everyone but its owner (with the reason) and moderators, and logs it', async () => {
    const { client: spammer } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator, user: mod } = await signedInClient('moderator');
    const spam = await createRecipeVia(spammer, { document: paleAle({ title: 'Queue Spam Watches Ale' }) });
    const forked = await reader.post<{ recipe: { id: string } }>(`/api/versions/${spam.version.id}/fork`, {
      title: 'Innocent Fork',
      visibility: 'public',
    });
    const report = await reportVia(reader, 'recipe', spam.recipe.id, 'Selling watches');
    expect(report.status).toBe(201);
    expect((await reportVia(reader, 'recipe', spam.recipe.id)).status).toBe(409);
    const queue = await moderator.get<QueueBody>('/api/moderation/queue');
    const item = queue.body.reports.find((r) => r.targetId === spam.recipe.id);
    expect(item?.reports[0].note).toBe('Selling watches');

    expect(
      (await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'hide', reason: '' })).status,
    ).toBe(400);
    const hidden = await moderator.post(`/api/moderation/reports/${report.body.id}`, {
      action: 'hide',
      reason: 'Advertising, not a recipe',
    });
    expect(hidden.status).toBe(200);

    for (const viewer of [reader, new TestClient()]) {
      expect((await viewer.get(`/api/recipes/${spam.recipe.id}`)).status).toBe(404);
      expect((await viewer.fetch(`/recipes/${spam.recipe.slug}`)).status).toBe(404);
      const listed = await viewer.get<{ recipes: { id: string }[] }>('/api/recipes');
      expect(listed.body.recipes.map((r) => r.id)).not.toContain(spam.recipe.id);
    }
    const lineage = await reader.get<{ recipes: { title: string; slug: string | null; hidden: boolean }[] }>(
      `/api/recipes/${forked.body.recipe.id}/lineage`,
    );
    expect(lineage.body.recipes).toContainEqual(
      expect.objectContaining({ title: 'Hidden recipe', slug: null, hidden: true }),
    );
    const ownView = textOf(await (await spammer.fetch(`/recipes/${spam.recipe.slug}`)).text());
    expect(ownView).toContain('Moderators hid this recipe: Advertising, not a recipe');
    expect((await moderator.get(`/api/recipes/${spam.recipe.id}`)).status).toBe(200);

    const logged = await db.select().from(moderationActions).where(eq(moderationActions.targetId, spam.recipe.id));
    expect(logged).toMatchObject([{ action: 'hide_recipe', actorId: mod.id, reason: 'Advertising, not a recipe' }]);
    const [row] = await db.select().from(reports).where(eq(reports.id, report.body.id));
    expect(row).toMatchObject({ status: 'hidden', resolvedById: mod.id });
  });

  it('refuses a second moderator acting on the same report at the same moment', async () => {
    const { client: spammer } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: modA } = await signedInClient('moderator');
    const { client: modB } = await signedInClient('moderator');
    const spam = await createRecipeVia(spammer);
    const report = await reportVia(reader, 'recipe', spam.recipe.id);
    const [a, b] = await Promise.all([
      modA.post<{ error?: { message: string } }>(`/api/moderation/reports/${report.body.id}`, {
        action: 'hide',
        reason: 'Spam',
      }),
      modB.post<{ error?: { message: string } }>(`/api/moderation/reports/${report.body.id}`, {
        action: 'dismiss',
        reason: '',
      }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const refused = a.status === 409 ? a : b;
    expect(refused.body.error?.message).toMatch(/already handled by .+/);
    expect(await db.$count(moderationActions, eq(moderationActions.targetId, spam.recipe.id))).toBe(1);
  });

  it('hides a reported comment from others while its author sees it with the reason', async () => {
    const { client: owner } = await signedInClient();
    const { client: author } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const recipe = await createRecipeVia(owner);
    const c = await commentVia(author, recipe.recipe.id, 'Rude words');
    const report = await reportVia(reader, 'comment', c.body.comment.id);
    await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'hide', reason: 'Be kind' });
    expect((await commentsOf(reader, recipe.recipe.id)).map((x) => x.id)).not.toContain(c.body.comment.id);
    expect((await commentsOf(author, recipe.recipe.id))[0]).toMatchObject({
      state: 'hidden',
      hiddenReason: 'Be kind',
      body: 'Rude words',
    });
    expect(textOf(await (await author.fetch(`/recipes/${recipe.recipe.slug}`)).text())).toContain(
      'Moderators hid this comment: Be kind',
    );
    expect((await reportVia(reader, 'comment', c.body.comment.id)).status).toBe(404);
  });

  it('refuses reports on what the member cannot see, on themselves, and bad input, with clear messages', async () => {
    const { client: owner, user: ownerUser } = await signedInClient();
    const { client: reader } = await signedInClient();
    const priv = await createRecipeVia(owner, { visibility: 'private' });
    const res = await reportVia(reader, 'recipe', priv.recipe.id);
    expect(res.status).toBe(404);
    expect(res.body.error?.message).toBe('No such recipe.');
    expect((await reportVia(owner, 'member', ownerUser.id)).status).toBe(400);
    const bad = await reader.post<{ error: { fields: { path: string }[] } }>('/api/reports', {
      targetType: 'kettle',
      targetId: '',
      reason: 'meh',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f) => f.path).sort()).toEqual(['reason', 'targetId', 'targetType']);
    expect(
      (await new TestClient().post('/api/reports', { targetType: 'recipe', targetId: priv.recipe.id, reason: 'spam' }))
        .status,
    ).toBe(401);
  });

  it('lets only moderators moderate, and never lets the queue suspend an admin or a moderator suspend a moderator', async () => {
    const { client: reader } = await signedInClient();
    const { client: member } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const { client: admin } = await signedInClient('admin');
    const { user: otherMod } = await signedInClient('moderator');
    const { user: otherAdmin } = await signedInClient('admin');
    const modReport = await reportVia(reader, 'member', otherMod.id);
    const adminReport = await reportVia(reader, 'member', otherAdmin.id);
    expect((await member.get('/api/moderation/queue')).status).toBe(403);
    expect((await member.post(`/api/moderation/reports/${modReport.body.id}`, { action: 'dismiss' })).status).toBe(403);
    const modOnMod = await moderator.post<{ error: { message: string } }>(
      `/api/moderation/reports/${modReport.body.id}`,
      { action: 'suspend', reason: 'x' },
    );
    expect(modOnMod.status).toBe(403);
    expect(modOnMod.body.error.message).toBe('Only an admin can suspend a moderator.');
    const onAdmin = await admin.post<{ error: { message: string } }>(`/api/moderation/reports/${adminReport.body.id}`, {
      action: 'suspend',
      reason: 'x',
    });
    expect(onAdmin.status).toBe(403);
    expect(onAdmin.body.error.message).toMatch(/admin cannot be suspended/);
    expect(
      (await moderator.put(`/api/users/${otherAdmin.id}/suspension`, { suspended: true, reason: 'x' })).status,
    ).toBe(403);
    const [still] = await db.select().from(users).where(eq(users.id, otherMod.id));
    expect(still.suspendedAt).toBeNull();
    expect(
      (await admin.post(`/api/moderation/reports/${modReport.body.id}`, { action: 'suspend', reason: 'Spamming' }))
        .status,
    ).toBe(200);
  });

  it('suspends a spammer from the queue: content hidden, sessions ended, logged', async () => {
    const { client: spammer, user: spamUser } = await signedInClient();
    const { client: reader } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const spam = await createRecipeVia(spammer);
    const report = await reportVia(reader, 'recipe', spam.recipe.id);
    expect(
      (await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'suspend', reason: 'Spam account' }))
        .status,
    ).toBe(200);
    expect(await spammer.isSignedIn()).toBe(false);
    const actions = await db
      .select({ action: moderationActions.action })
      .from(moderationActions)
      .where(sql`${moderationActions.targetId} in (${spam.recipe.id}, ${spamUser.id})`);
    expect(actions.map((a) => a.action).sort()).toEqual(['hide_recipe', 'suspend_user']);
  });

  it('keeps the moderation log append-only and lets admins read and filter it', async () => {
    const { client: admin } = await signedInClient('admin');
    const { client: moderator } = await signedInClient('moderator');
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const recipe = await createRecipeVia(owner);
    const report = await reportVia(reader, 'recipe', recipe.recipe.id);
    await moderator.post(`/api/moderation/reports/${report.body.id}`, { action: 'dismiss', reason: 'Fine recipe' });
    for (const statement of [
      sql`update moderation_actions set reason = 'changed'`,
      sql`delete from moderation_actions`,
    ]) {
      const err = (await db.execute(statement).catch((e: Error & { cause?: Error }) => e)) as Error & { cause?: Error };
      expect(err).toBeInstanceOf(Error);
      expect(err.cause?.message ?? err.message).toMatch(/append-only/);
    }
    const log = await admin.get<{ actions: { action: string; targetId: string }[] }>(
      '/api/moderation/actions?action=dismiss_reports',
    );
    expect(log.body.actions.every((a) => a.action === 'dismiss_reports')).toBe(true);
    expect(log.body.actions.map((a) => a.targetId)).toContain(recipe.recipe.id);
    expect((await moderator.get('/api/moderation/actions')).status).toBe(403);
    expect((await admin.get('/api/moderation/actions?action=DROP TABLE')).status).toBe(400);
    const page = textOf(await (await admin.fetch('/admin/moderation/log?action=dismiss_reports')).text());
    expect(page).toContain('Fine recipe');
    expect((await moderator.fetch('/admin/moderation/log')).status).toBe(404);
  });
});
