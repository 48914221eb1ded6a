import 'server-only';
import { and, asc, count, eq, sql } from 'drizzle-orm';
import { db, type Transaction } from '@/db';
import { comments, moderationActions, recipes, users, type Comment, type Recipe } from '@/db/schema';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { notify } from '@/lib/notifications/notify';
import { COMMENT_PER_MEMBER, consumeOrThrow } from '@/lib/rate-limit';
import { canView } from '@/lib/recipes/access';
import { getRecipe } from '@/lib/recipes/versions';
import { containsLink, shouldHoldComment } from './hold-rule';
import type { NewCommentInput } from './schemas';
import { requireId } from '@/lib/validation/ids';

/** How long after posting its author may still change a comment. */
export const COMMENT_EDIT_WINDOW_MIN = 15;
const MAX_COMMENTS_SHOWN = 500;

type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;

type CommentState = 'published' | 'held' | 'hidden' | 'deleted';

export interface CommentView {
  id: string;
  parentId: string | null;
  /** Empty for a placeholder (a removed comment kept so its replies keep their place). */
  body: string;
  authorId: string | null;
  authorName: string;
  authorHandle: string | null;
  versionNumber: number | null;
  createdAt: Date;
  editedAt: Date | null;
  state: CommentState;
  /** Shown to the author and moderators of a hidden comment. */
  hiddenReason: string | null;
  canEdit: boolean;
  canDelete: boolean;
  editableUntil: Date | null;
  replies: CommentView[];
}

function isModerator(viewer: MaybeViewer): boolean {
  return Boolean(viewer && hasRole(viewer, 'moderator'));
}

/** Whether someone may read a comment (its recipe being visible to them is checked separately). */
function canViewComment(
  comment: Pick<Comment, 'authorId' | 'status' | 'hiddenAt' | 'deletedAt'>,
  viewer: MaybeViewer,
): boolean {
  if (comment.deletedAt) return false;
  if (viewer && (viewer.id === comment.authorId || isModerator(viewer))) return true;
  return comment.status === 'published' && !comment.hiddenAt;
}

function editableUntil(comment: Pick<Comment, 'createdAt'>): Date {
  return new Date(comment.createdAt.getTime() + COMMENT_EDIT_WINDOW_MIN * 60_000);
}

/** The comments of a recipe the viewer can see, oldest first, replies under their comment. */
export async function listComments(viewer: MaybeViewer, recipeId: string): Promise<CommentView[]> {
  await getRecipe(viewer, { id: recipeId });
  const rows = await db
    .select({ comment: comments, authorName: users.name, authorHandle: users.handle })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .where(eq(comments.recipeId, recipeId))
    .orderBy(asc(comments.createdAt))
    .limit(MAX_COMMENTS_SHOWN);
  const now = Date.now();
  const views = new Map<string, CommentView>();
  const placeholders = new Map<string, CommentView>();
  for (const { comment: c, authorName, authorHandle } of rows) {
    const own = viewer?.id === c.authorId;
    const visible = canViewComment(c, viewer);
    const view: CommentView = {
      id: c.id,
      parentId: c.parentId,
      body: visible ? c.body : '',
      authorId: visible ? c.authorId : null,
      authorName: visible ? (authorName ?? authorHandle) : '',
      authorHandle: visible ? authorHandle : null,
      versionNumber: c.versionNumber,
      createdAt: c.createdAt,
      editedAt: visible ? c.editedAt : null,
      state: c.deletedAt ? 'deleted' : c.hiddenAt ? 'hidden' : c.status,
      hiddenReason: visible && c.hiddenAt ? c.hiddenReason : null,
      canEdit: visible && own && !c.hiddenAt && now < editableUntil(c).getTime(),
      canDelete: visible && (own || isModerator(viewer)),
      editableUntil: visible && own ? editableUntil(c) : null,
      replies: [],
    };
    if (visible) views.set(c.id, view);
    else if (!c.parentId && c.status === 'published') placeholders.set(c.id, view);
  }
  const top: CommentView[] = [];
  for (const view of [...views.values(), ...placeholders.values()].sort(
    (a, b) => a.createdAt.getTime() - b.createdAt.getTime(),
  )) {
    if (!view.parentId) {
      top.push(view);
      continue;
    }
    const parent = views.get(view.parentId) ?? placeholders.get(view.parentId);
    if (parent && views.has(view.id)) parent.replies.push(view);
  }
  // A removed comment stays as a placeholder only while it has replies to hold together.
  return top.filter((c) => views.has(c.id) || c.replies.length > 0);
}

async function loadComment(
  tx: Transaction | typeof db,
  viewer: MaybeViewer,
  commentId: string,
  opts: { lock?: boolean } = {},
) {
  requireId(commentId, 'comment');
  const query = tx
    .select({ comment: comments, recipe: recipes })
    .from(comments)
    .innerJoin(recipes, eq(recipes.id, comments.recipeId))
    .where(eq(comments.id, commentId));
  const [row] = opts.lock ? await query.for('update', { of: comments }) : await query;
  if (!row || !canView(row.recipe, viewer) || !canViewComment(row.comment, viewer))
    throw new AppError('not_found', 'comment');
  return row;
}

/** A comment and its recipe, if the viewer may see both (404 otherwise). */
export async function getVisibleComment(
  viewer: MaybeViewer,
  commentId: string,
): Promise<{ comment: Comment; recipe: Recipe }> {
  return loadComment(db, viewer, commentId);
}

async function approvedLinkComments(tx: Transaction, authorId: string): Promise<number> {
  const [row] = await tx
    .select({ n: count() })
    .from(comments)
    .where(and(eq(comments.authorId, authorId), eq(comments.hasLink, true), sql`${comments.approvedById} is not null`));
  return row.n;
}

async function holdFor(tx: Transaction, viewer: Viewer, body: string): Promise<boolean> {
  const hasLink = containsLink(body);
  if (!hasLink) return false;
  const [author] = await tx.select({ createdAt: users.createdAt }).from(users).where(eq(users.id, viewer.id));
  return shouldHoldComment({
    role: viewer.role,
    accountCreatedAt: author.createdAt,
    hasLink,
    approvedLinkComments: await approvedLinkComments(tx, viewer.id),
  });
}

function commentUrl(recipe: Pick<Recipe, 'slug'>, commentId: string): string {
  return `/recipes/${recipe.slug}#comment-${commentId}`;
}

/** Tells the recipe's owner and, for a reply, the author of the comment replied to. */
export async function announceComment(
  tx: Transaction,
  comment: Pick<Comment, 'id' | 'authorId' | 'body' | 'parentId'>,
  recipe: Pick<Recipe, 'id' | 'slug' | 'ownerId'>,
  replyToAuthorId: string | null,
): Promise<void> {
  const url = commentUrl(recipe, comment.id);
  const base = { actorId: comment.authorId, recipeId: recipe.id, commentId: comment.id, url, excerpt: comment.body };
  if (replyToAuthorId) await notify(tx, { ...base, userId: replyToAuthorId, kind: 'reply' });
  if (recipe.ownerId !== replyToAuthorId) await notify(tx, { ...base, userId: recipe.ownerId, kind: 'comment' });
}

/**
 * Posts a comment or a reply. A reply to a reply joins the same thread (replies go one level
 * deep) and tells the author it answered. A new member's link comment may be held for review.
 */
export async function addComment(
  viewer: Viewer,
  recipeId: string,
  input: NewCommentInput,
): Promise<{ comment: CommentView; held: boolean }> {
  const recipe = await getRecipe(viewer, { id: recipeId });
  if (recipe.hiddenAt)
    throw new AppError('forbidden', 'recipe', 'Comments are closed while moderators have this recipe hidden.');
  await consumeOrThrow(COMMENT_PER_MEMBER, viewer.id);
  const inserted = await db.transaction(async (tx) => {
    let rootId: string | null = null;
    let replyToAuthorId: string | null = null;
    if (input.parentId) {
      const [parent] = await tx
        .select()
        .from(comments)
        .where(and(eq(comments.id, input.parentId), eq(comments.recipeId, recipeId)));
      if (!parent || !canViewComment(parent, viewer)) {
        throw new AppError('bad_request', 'comment', 'The comment you reply to is not on this recipe any more.', [
          { path: 'parentId', message: 'The comment you reply to is not on this recipe any more.' },
        ]);
      }
      rootId = parent.parentId ?? parent.id;
      replyToAuthorId = parent.authorId;
    }
    const held = await holdFor(tx, viewer, input.body);
    const [row] = await tx
      .insert(comments)
      .values({
        recipeId,
        authorId: viewer.id,
        parentId: rootId,
        body: input.body,
        versionNumber: input.versionNumber ?? null,
        hasLink: containsLink(input.body),
        status: held ? 'held' : 'published',
      })
      .returning();
    if (!held) await announceComment(tx, row, recipe, replyToAuthorId);
    return row;
  });
  return { comment: toOwnView(inserted, viewer), held: inserted.status === 'held' };
}

function toOwnView(c: Comment, viewer: Viewer): CommentView {
  return {
    id: c.id,
    parentId: c.parentId,
    body: c.body,
    authorId: c.authorId,
    authorName: viewer.name,
    authorHandle: viewer.handle,
    versionNumber: c.versionNumber,
    createdAt: c.createdAt,
    editedAt: c.editedAt,
    state: c.hiddenAt ? 'hidden' : c.status,
    hiddenReason: c.hiddenReason,
    canEdit: !c.hiddenAt && Date.now() < editableUntil(c).getTime(),
    canDelete: true,
    editableUntil: editableUntil(c),
    replies: [],
  };
}

/** Its author changes a comment within COMMENT_EDIT_WINDOW_MIN minutes of posting it. */
export async function editComment(
  viewer: Viewer,
  commentId: string,
  body: string,
): Promise<{ comment: CommentView; held: boolean }> {
  const updated = await db.transaction(async (tx) => {
    const { comment } = await loadComment(tx, viewer, commentId, { lock: true });
    if (comment.authorId !== viewer.id)
      throw new AppError('forbidden', 'comment', 'Only its author can edit a comment.');
    if (comment.hiddenAt)
      throw new AppError('forbidden', 'comment', 'Moderators hid this comment, so it cannot be edited.');
    if (Date.now() >= editableUntil(comment).getTime()) {
      throw new AppError(
        'forbidden',
        'comment',
        `A comment can be edited for ${COMMENT_EDIT_WINDOW_MIN} minutes after posting; this one can no longer be changed.`,
      );
    }
    // Adding a link afterwards goes through the same review as posting one.
    const held = comment.status === 'held' || (await holdFor(tx, viewer, body));
    const [row] = await tx
      .update(comments)
      .set({ body, hasLink: containsLink(body), editedAt: new Date(), status: held ? 'held' : 'published' })
      .where(eq(comments.id, commentId))
      .returning();
    return row;
  });
  return { comment: toOwnView(updated, viewer), held: updated.status === 'held' };
}

/** Its author or a moderator removes a comment; replies keep their place under a placeholder. */
export async function deleteComment(viewer: Viewer, commentId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const { comment } = await loadComment(tx, viewer, commentId, { lock: true });
    const own = comment.authorId === viewer.id;
    if (!own && !hasRole(viewer, 'moderator'))
      throw new AppError('forbidden', 'comment', 'Only its author or a moderator can delete a comment.');
    await tx.update(comments).set({ deletedAt: new Date(), body: '' }).where(eq(comments.id, commentId));
    if (!own) {
      await tx.insert(moderationActions).values({
        actorId: viewer.id,
        action: 'delete_comment',
        targetType: 'comment',
        targetId: commentId,
        details: { recipeId: comment.recipeId, authorId: comment.authorId, body: comment.body.slice(0, 2_000) },
      });
    }
  });
}
