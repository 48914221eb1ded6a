import 'server-only';
import { and, count, eq, isNull } from 'drizzle-orm';
import { db } from '@/db';
import { memberFollows, recipeFollows, users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { consumeOrThrow, REACTION_PER_MEMBER } from '@/lib/rate-limit';
import { getRecipe } from '@/lib/recipes/versions';
import type { FollowInput } from './schemas';
import { requireId } from '@/lib/validation/ids';

async function activeMember(id: string) {
  const [member] = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.id, id), isNull(users.suspendedAt)));
  if (!member) throw new AppError('not_found', 'member');
  return member;
}

/** Follows or unfollows a member or a recipe; doing it twice changes nothing. */
export async function setFollow(
  viewer: Viewer,
  input: FollowInput,
  following: boolean,
): Promise<{ following: boolean }> {
  if (input.type === 'member') {
    if (input.id === viewer.id) {
      throw new AppError('bad_request', 'follow', 'You cannot follow yourself.', [
        { path: 'id', message: 'You cannot follow yourself.' },
      ]);
    }
    if (following) await activeMember(input.id);
    await consumeOrThrow(REACTION_PER_MEMBER, viewer.id);
    if (following)
      await db.insert(memberFollows).values({ followerId: viewer.id, followeeId: input.id }).onConflictDoNothing();
    else
      await db
        .delete(memberFollows)
        .where(and(eq(memberFollows.followerId, viewer.id), eq(memberFollows.followeeId, input.id)));
    return { following };
  }
  requireId(input.id, 'recipe');
  if (following) await getRecipe(viewer, { id: input.id });
  await consumeOrThrow(REACTION_PER_MEMBER, viewer.id);
  if (following)
    await db.insert(recipeFollows).values({ followerId: viewer.id, recipeId: input.id }).onConflictDoNothing();
  else
    await db
      .delete(recipeFollows)
      .where(and(eq(recipeFollows.followerId, viewer.id), eq(recipeFollows.recipeId, input.id)));
  return { following };
}

export async function isFollowing(
  viewer: Pick<Viewer, 'id'> | null,
  type: FollowInput['type'],
  id: string,
): Promise<boolean> {
  if (!viewer) return false;
  const [row] =
    type === 'member'
      ? await db
          .select({ id: memberFollows.followeeId })
          .from(memberFollows)
          .where(and(eq(memberFollows.followerId, viewer.id), eq(memberFollows.followeeId, id)))
      : await db
          .select({ id: recipeFollows.recipeId })
          .from(recipeFollows)
          .where(and(eq(recipeFollows.followerId, viewer.id), eq(recipeFollows.recipeId, id)));
  return Boolean(row);
}

export async function countFollowers(memberId: string): Promise<{ followers: number; following: number }> {
  const [[a], [b]] = await Promise.all([
    db.select({ n: count() }).from(memberFollows).where(eq(memberFollows.followeeId, memberId)),
    db.select({ n: count() }).from(memberFollows).where(eq(memberFollows.followerId, memberId)),
  ]);
  return { followers: a.n, following: b.n };
}
