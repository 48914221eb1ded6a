import 'server-only';
import { eq, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db, type Transaction } from '@/db';
import { proposals, recipeVersions, recipes, type Proposal, type Recipe } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { recipeDocumentSchema, type RecipeDocument, type RecipeStats } from '@/lib/brewing';
import { AppError } from '@/lib/errors';
import { canView } from '@/lib/recipes/access';
import { requireId } from '@/lib/validation/ids';
import { canViewProposal } from './access';

// What the proposal commands and read views share: loading a proposal the viewer may see, a
// version's document, and the recipes a fork descends from.

export type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;
type Db = Transaction | typeof db;

export interface Ancestor {
  recipeId: string;
  slug: string;
  title: string;
  ownerId: string;
  ownerName: string;
  /** The ancestor's version this line of forks came from: the common ancestor of a merge. */
  baseVersionId: string;
  baseNumber: number;
  /** 1 for the recipe the fork came from directly, 2 for its source, and so on. */
  hops: number;
  recipe: Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>;
}

/** Every recipe a fork descends from (walking fork links upward), nearest first. */
export async function getAncestorsByRecipeId(tx: Db, { recipeId }: { recipeId: string }): Promise<Ancestor[]> {
  const result = await tx.execute<{
    recipe_id: string;
    slug: string;
    title: string;
    owner_id: string;
    owner_name: string;
    visibility: Recipe['visibility'];
    hidden_at: Date | null;
    base_version_id: string;
    base_number: number;
    hops: number;
  }>(sql`
    with recursive up(ancestor_id, base_version_id, base_number, hops) as (
      select v.recipe_id, v.id, v.number, 1
      from recipes r join recipe_versions v on v.id = r.forked_from_version_id
      where r.id = ${recipeId}
      union all
      select v.recipe_id, v.id, v.number, u.hops + 1
      from up u
      join recipes r on r.id = u.ancestor_id
      join recipe_versions v on v.id = r.forked_from_version_id
      where u.hops < 100
    )
    select u.ancestor_id as recipe_id, r.slug, r.title, r.owner_id, coalesce(o.name, o.handle) as owner_name, r.visibility, r.hidden_at,
           u.base_version_id, u.base_number, u.hops
    from up u join recipes r on r.id = u.ancestor_id join users o on o.id = r.owner_id
    order by u.hops
  `);
  return result.rows.map((r) => ({
    recipeId: r.recipe_id,
    slug: r.slug,
    title: r.title,
    ownerId: r.owner_id,
    ownerName: r.owner_name,
    baseVersionId: r.base_version_id,
    baseNumber: r.base_number,
    hops: r.hops,
    recipe: { ownerId: r.owner_id, visibility: r.visibility, hiddenAt: r.hidden_at ? new Date(r.hidden_at) : null },
  }));
}

/** A fork the source's owner can see: public or unlisted, and not hidden by moderators. */
export function forkVisibleToOwner(
  fork: Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>,
  sourceOwnerId: string,
): boolean {
  return canView(fork, { id: sourceOwnerId, role: 'member' });
}

export interface LoadedProposal {
  proposal: Proposal;
  source: Recipe;
  fork: Recipe;
}

export const forks = alias(recipes, 'fork');

export async function loadProposal(
  tx: Db,
  viewer: MaybeViewer,
  id: string,
  opts: { lock?: boolean } = {},
): Promise<LoadedProposal> {
  requireId(id, 'proposal');
  const query = tx
    .select({ proposal: proposals, source: recipes, fork: forks })
    .from(proposals)
    .innerJoin(recipes, eq(recipes.id, proposals.sourceRecipeId))
    .innerJoin(forks, eq(forks.id, proposals.forkRecipeId))
    .where(eq(proposals.id, id));
  const [row] = opts.lock ? await query.for('update', { of: proposals }) : await query;
  if (!row || !canViewProposal(row.proposal, row.source, row.fork, viewer)) throw new AppError('not_found', 'proposal');
  return row;
}

export async function versionDoc(
  tx: Db,
  versionId: string,
): Promise<{
  id: string;
  number: number;
  recipeId: string;
  document: RecipeDocument;
  stats: RecipeStats;
  message: string;
}> {
  const [row] = await tx
    .select({
      id: recipeVersions.id,
      number: recipeVersions.number,
      recipeId: recipeVersions.recipeId,
      document: recipeVersions.document,
      stats: recipeVersions.stats,
      message: recipeVersions.message,
    })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, versionId));
  // Documents written by an older engine are re-checked (and given today's defaults) on the way in.
  return { ...row, document: recipeDocumentSchema.parse(row.document), stats: row.stats as RecipeStats };
}
