import 'server-only';
import { and, eq, isNull, sql } from 'drizzle-orm';
import { db, type Transaction } from '@/db';
import { brewDays, comments, hiddenPhotos, moderationActions, photos, recipes, users } from '@/db/schema';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';
import { getVisibleComment } from '@/lib/community/comments';
import { getVisibleProposal, hideProposal } from '@/lib/proposals/proposals';
import { AppError } from '@/lib/errors';
import { canView } from '@/lib/recipes/access';
import { recordListingChange } from '@/lib/recipes/events';
import { getRecipe, getVersionById } from '@/lib/recipes/versions';
import type { ReportTarget } from './words';
import { requireId } from '@/lib/validation/ids';

type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;

export interface ResolvedTarget {
  /** Whose content it is (the member themselves, for a member). */
  ownerId: string;
  /** The recipe it belongs to, when it belongs to one. */
  recipeId: string | null;
}

/**
 * What a report points at, if the viewer may see it. Anything they cannot see is "not found",
 * exactly as if it did not exist.
 */
export async function resolveTarget(viewer: MaybeViewer, type: ReportTarget, id: string): Promise<ResolvedTarget> {
  switch (type) {
    case 'recipe': {
      const recipe = await getRecipe(viewer, { id: requireId(id, 'recipe') });
      return { ownerId: recipe.ownerId, recipeId: recipe.id };
    }
    case 'version': {
      const { recipe } = await getVersionById(viewer, requireId(id, 'version'));
      return { ownerId: recipe.ownerId, recipeId: recipe.id };
    }
    case 'comment': {
      const { comment, recipe } = await getVisibleComment(viewer, id);
      return { ownerId: comment.authorId, recipeId: recipe.id };
    }
    case 'photo': {
      const [row] = await db
        .select({ uploaderId: photos.uploaderId, recipe: recipes, hidden: hiddenPhotos.photoId })
        .from(photos)
        .innerJoin(brewDays, eq(brewDays.id, photos.brewDayId))
        .innerJoin(recipes, eq(recipes.id, brewDays.recipeId))
        .leftJoin(hiddenPhotos, eq(hiddenPhotos.photoId, photos.id))
        .where(eq(photos.id, requireId(id, 'photo')));
      const maySee =
        row &&
        canView(row.recipe, viewer) &&
        (!row.hidden || viewer?.id === row.uploaderId || (viewer && hasRole(viewer, 'moderator')));
      if (!row || !maySee) throw new AppError('not_found', 'photo');
      return { ownerId: row.uploaderId, recipeId: row.recipe.id };
    }
    case 'member': {
      const [member] = await db
        .select({ id: users.id })
        .from(users)
        .where(and(eq(users.id, id), isNull(users.suspendedAt)));
      if (!member) throw new AppError('not_found', 'member');
      return { ownerId: member.id, recipeId: null };
    }
    case 'proposal': {
      const proposal = await getVisibleProposal(viewer, id);
      return { ownerId: proposal.proposerId, recipeId: proposal.sourceRecipeId };
    }
  }
}

/** Hides reported content inside the moderator's transaction and writes the log entry. */
export async function hideTarget(
  tx: Transaction,
  actor: Viewer,
  target: { type: ReportTarget; id: string; recipeId: string | null },
  reason: string,
  details: Record<string, unknown> = {},
): Promise<{ recipeChanged: boolean }> {
  switch (target.type) {
    case 'recipe':
    case 'version': {
      // A version cannot change, so hiding one hides its recipe.
      const recipeId = target.recipeId ?? target.id;
      await tx
        .update(recipes)
        .set({ hiddenAt: sql`coalesce(${recipes.hiddenAt}, now())`, hiddenReason: reason })
        .where(eq(recipes.id, recipeId));
      // A hidden fork leaves its source's public fork count too.
      await recordListingChange(tx, recipeId);
      await log(tx, actor, 'hide_recipe', 'recipe', recipeId, reason, {
        ...details,
        reported: target.type === 'version' ? { version: target.id } : undefined,
      });
      return { recipeChanged: true };
    }
    case 'comment':
      await tx
        .update(comments)
        .set({ hiddenAt: sql`coalesce(${comments.hiddenAt}, now())`, hiddenReason: reason })
        .where(eq(comments.id, target.id));
      await log(tx, actor, 'hide_comment', 'comment', target.id, reason, details);
      return { recipeChanged: false };
    case 'photo':
      await tx.insert(hiddenPhotos).values({ photoId: target.id, reason, hiddenById: actor.id }).onConflictDoNothing();
      await log(tx, actor, 'hide_photo', 'photo', target.id, reason, details);
      return { recipeChanged: false };
    case 'proposal':
      await hideProposal(tx, target.id, reason);
      await log(tx, actor, 'hide_proposal', 'proposal', target.id, reason, details);
      return { recipeChanged: false };
    case 'member':
      throw new AppError('bad_request', 'action', 'A member cannot be hidden: suspend them, or dismiss the report.', [
        { path: 'action', message: 'A member cannot be hidden: suspend them, or dismiss the report.' },
      ]);
  }
}

/** Makes hidden content visible again. */
export async function unhideTarget(
  tx: Transaction,
  actor: Viewer,
  type: 'recipe' | 'comment' | 'photo',
  id: string,
  reason: string,
): Promise<{ recipeChanged: boolean }> {
  if (type === 'recipe') {
    const rows = await tx
      .update(recipes)
      .set({ hiddenAt: null, hiddenReason: null })
      .where(eq(recipes.id, id))
      .returning({ id: recipes.id });
    if (!rows.length) throw new AppError('not_found', 'recipe');
    await recordListingChange(tx, id);
  } else if (type === 'comment') {
    const rows = await tx
      .update(comments)
      .set({ hiddenAt: null, hiddenReason: null })
      .where(eq(comments.id, id))
      .returning({ id: comments.id });
    if (!rows.length) throw new AppError('not_found', 'comment');
  } else {
    const rows = await tx
      .delete(hiddenPhotos)
      .where(eq(hiddenPhotos.photoId, id))
      .returning({ id: hiddenPhotos.photoId });
    if (!rows.length) throw new AppError('not_found', 'hidden photo');
  }
  await log(tx, actor, `unhide_${type}`, type, id, reason);
  return { recipeChanged: type === 'recipe' };
}

export async function log(
  tx: Transaction,
  actor: Pick<Viewer, 'id'>,
  action: string,
  targetType: string,
  targetId: string,
  reason = '',
  details: Record<string, unknown> = {},
): Promise<void> {
  await tx.insert(moderationActions).values({ actorId: actor.id, action, targetType, targetId, reason, details });
}
