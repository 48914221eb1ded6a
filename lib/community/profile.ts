import 'server-only';
import { and, desc, eq, isNotNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { recipeVersions, recipes, users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { listedRecipeSql } from '@/lib/recipes/access';
import { countFollowers } from './follows';

export interface MemberCommunity {
  starsReceived: number;
  followers: number;
  following: number;
  forks: { id: string; slug: string; title: string; sourceTitle: string; sourceSlug: string | null; hidden: boolean }[];
}

const sources = alias(recipes, 'source');

interface MemberProfile {
  id: string;
  name: string | null;
  handle: string;
  bio: string;
  createdAt: Date;
}

/** The member a `/members/[handle]` page is about; null when there is none or they are suspended. */
export async function getMemberByHandle({ handle }: { handle: string }): Promise<MemberProfile | null> {
  const [member] = await db
    .select({
      id: users.id,
      name: users.name,
      handle: users.handle,
      bio: users.bio,
      createdAt: users.createdAt,
      suspendedAt: users.suspendedAt,
    })
    .from(users)
    .where(eq(users.handle, handle.slice(0, 40)));
  if (!member || member.suspendedAt) return null;
  const { suspendedAt: _suspendedAt, ...profile } = member;
  return profile;
}

/**
 * What a member page shows beside the recipes: stars their listed recipes received, followers,
 * and the forks they made. Others see only public, unhidden recipes; the member sees all of theirs.
 */
export async function getMemberCommunity(
  memberId: string,
  viewer: Pick<Viewer, 'id'> | null,
): Promise<MemberCommunity> {
  const own = viewer?.id === memberId;
  const listed = listedRecipeSql(own ? viewer : null);
  const [[stars], follow, forks] = await Promise.all([
    db
      .select({ n: sql<number>`coalesce(sum(${recipes.starCount}), 0)::int` })
      .from(recipes)
      .where(and(eq(recipes.ownerId, memberId), listed)),
    countFollowers(memberId),
    db
      .select({
        id: recipes.id,
        slug: recipes.slug,
        title: recipes.title,
        hiddenAt: recipes.hiddenAt,
        sourceTitle: sources.title,
        sourceSlug: sources.slug,
        sourceListed: sql<boolean>`${listedRecipeSql(viewer, sources)}`,
      })
      .from(recipes)
      .innerJoin(recipeVersions, eq(recipeVersions.id, recipes.forkedFromVersionId))
      .innerJoin(sources, eq(sources.id, recipeVersions.recipeId))
      .where(and(eq(recipes.ownerId, memberId), isNotNull(recipes.forkedFromVersionId), listed))
      .orderBy(desc(recipes.createdAt))
      .limit(50),
  ]);
  return {
    starsReceived: stars.n,
    ...follow,
    forks: forks.map((f) => {
      const sourceVisible = f.sourceListed;
      return {
        id: f.id,
        slug: f.slug,
        title: f.title,
        hidden: Boolean(f.hiddenAt),
        sourceTitle: sourceVisible ? f.sourceTitle : 'a recipe that is not public',
        sourceSlug: sourceVisible ? f.sourceSlug : null,
      };
    }),
  };
}
