import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { moderationActions } from '@/db/schema';
import { COMMENT_EDIT_WINDOW_MIN } from '@/lib/community/comments';
import { TestClient } from '../helpers/http';
import { createRecipeVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { ageAccount, backdateComment, commentsOf, commentVia } from './helpers';

describe('comments on recipes', () => {
  it('posts comments and replies one level deep, shown to everyone with Markdown kept as text', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const recipe = await createRecipeVia(owner);
    const first = await commentVia(reader, recipe.recipe.id, 'Did you **mash out**?');
    expect(first.status).toBe(201);
    expect(first.body.held).toBe(false);
    const reply = await commentVia(owner, recipe.recipe.id, 'No, straight to the sparge.', first.body.comment.id);
    expect(reply.body.comment.parentId).toBe(first.body.comment.id);
    // A reply to a reply joins the same thread.
    const deeper = await commentVia(reader, recipe.recipe.id, 'Thanks!', reply.body.comment.id);
    expect(deeper.body.comment.parentId).toBe(first.body.comment.id);

    const list = await commentsOf(new TestClient(), recipe.recipe.id);
    expect(list).toHaveLength(1);
    expect(list[0].body).toBe('Did you **mash out**?');
    expect(list[0].replies.map((r) => r.body)).toEqual(['No, straight to the sparge.', 'Thanks!']);
    const page = await (await new TestClient().fetch(`/recipes/${recipe.recipe.slug}`)).text();
    expect(page).toContain('<strong>mash out</strong>');
  });

  it('refuses an empty comment, a reply to another recipe’s comment, and comments on recipes the member cannot see', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const a = await createRecipeVia(owner);
    const b = await createRecipeVia(owner);
    const hidden = await createRecipeVia(owner, { visibility: 'private' });
    const empty = await commentVia(reader, a.recipe.id, '   ');
    expect(empty.status).toBe(400);
    expect(empty.body.error?.fields?.[0].path).toBe('body');
    const onB = await commentVia(reader, b.recipe.id, 'On b');
    const wrongThread = await commentVia(reader, a.recipe.id, 'Lost', onB.body.comment.id);
    expect(wrongThread.status).toBe(400);
    expect(wrongThread.body.error?.fields?.[0].path).toBe('parentId');
    expect((await commentVia(reader, hidden.recipe.id, 'Peek')).status).toBe(404);
    expect((await reader.get(`/api/recipes/${hidden.recipe.id}/comments`)).status).toBe(404);
    expect((await new TestClient().post(`/api/recipes/${a.recipe.id}/comments`, { body: 'anon' })).status).toBe(401);
  });

  it(`lets the author edit for ${COMMENT_EDIT_WINDOW_MIN} minutes, and nobody else`, async () => {
    const { client: owner } = await signedInClient();
    const { client: author } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const recipe = await createRecipeVia(owner);
    const posted = await commentVia(author, recipe.recipe.id, 'OG was 1.050');
    const id = posted.body.comment.id;
    expect((await author.patch(`/api/comments/${id}`, { body: 'OG was 1.052' })).status).toBe(200);
    expect((await owner.patch(`/api/comments/${id}`, { body: 'hijack' })).status).toBe(403);
    expect((await moderator.patch(`/api/comments/${id}`, { body: 'hijack' })).status).toBe(403);
    await backdateComment(id, COMMENT_EDIT_WINDOW_MIN + 1);
    const late = await author.patch<{ error: { message: string } }>(`/api/comments/${id}`, { body: 'too late' });
    expect(late.status).toBe(403);
    expect(late.body.error.message).toMatch(/15 minutes/);
    expect((await commentsOf(author, recipe.recipe.id))[0].body).toBe('OG was 1.052');
  });

  it('lets the author or a moderator delete, keeping replies under a placeholder and logging the moderator', async () => {
    const { client: owner } = await signedInClient();
    const { client: author } = await signedInClient();
    const { client: moderator, user: mod } = await signedInClient('moderator');
    const recipe = await createRecipeVia(owner);
    const top = await commentVia(author, recipe.recipe.id, 'Top');
    await commentVia(owner, recipe.recipe.id, 'Reply', top.body.comment.id);
    const lone = await commentVia(author, recipe.recipe.id, 'Lone');
    expect((await owner.delete(`/api/comments/${lone.body.comment.id}`)).status).toBe(403);
    expect((await author.delete(`/api/comments/${top.body.comment.id}`)).status).toBe(200);
    expect((await moderator.delete(`/api/comments/${lone.body.comment.id}`)).status).toBe(200);
    const list = await commentsOf(new TestClient(), recipe.recipe.id);
    expect(list).toHaveLength(1);
    expect(list[0]).toMatchObject({ body: '', state: 'deleted', authorHandle: null });
    expect(list[0].replies.map((r) => r.body)).toEqual(['Reply']);
    const logged = await db
      .select()
      .from(moderationActions)
      .where(eq(moderationActions.targetId, lone.body.comment.id));
    expect(logged).toMatchObject([{ action: 'delete_comment', actorId: mod.id }]);
  });

  it('holds a new member’s link comment for review, visible only to its author and moderators, until a moderator publishes it', async () => {
    const { client: owner } = await signedInClient();
    const { client: newcomer } = await signedInClient();
    const { client: veteran, user: vet } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    await ageAccount(vet.id);
    const recipe = await createRecipeVia(owner);
    const held = await commentVia(newcomer, recipe.recipe.id, 'Cheap kettles at https://deals.example/kettles');
    expect(held.body.held).toBe(true);
    expect((await commentVia(newcomer, recipe.recipe.id, 'No link here')).body.held).toBe(false);
    expect((await commentVia(veteran, recipe.recipe.id, 'My notes: https://example.org/notes')).body.held).toBe(false);

    expect((await commentsOf(owner, recipe.recipe.id)).map((c) => c.body)).not.toContain(
      'Cheap kettles at https://deals.example/kettles',
    );
    expect((await commentsOf(newcomer, recipe.recipe.id)).find((c) => c.id === held.body.comment.id)?.state).toBe(
      'held',
    );
    const queue = await moderator.get<{ heldComments: { id: string }[] }>('/api/moderation/queue');
    expect(queue.body.heldComments.map((c) => c.id)).toContain(held.body.comment.id);

    expect(
      (await moderator.post(`/api/moderation/comments/${held.body.comment.id}`, { action: 'approve' })).status,
    ).toBe(200);
    const again = await moderator.post<{ error: { message: string } }>(
      `/api/moderation/comments/${held.body.comment.id}`,
      { action: 'approve' },
    );
    expect(again.status).toBe(409);
    expect((await commentsOf(owner, recipe.recipe.id)).map((c) => c.id)).toContain(held.body.comment.id);
  });

  it('rate limits comments per member', async () => {
    const { client: owner } = await signedInClient();
    const { client: chatty } = await signedInClient();
    const recipe = await createRecipeVia(owner);
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) statuses.push((await commentVia(chatty, recipe.recipe.id, `Comment ${i}`)).status);
    expect(statuses.slice(0, 10).every((s) => s === 201)).toBe(true);
    expect(statuses[10]).toBe(429);
  });
});
