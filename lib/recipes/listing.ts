import 'server-only';
import { and, desc, eq, sql } from 'drizzle-orm';
import { db, readDatabase } from '@/db';
import { recipeVersions, recipes, users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import type { UnitSystem } from '@/lib/brewing/units';
import { listedForkCountSql, listedRecipeSql } from './access';
import { compareDocuments, type DocumentComparison } from './compare';
import { getVersionById, type VersionView } from './versions';

export interface RecipeCard {
  id: string;
  slug: string;
  title: string;
  ownerName: string;
  ownerHandle: string;
  visibility: 'public' | 'unlisted' | 'private';
  hidden: boolean;
  styleCode: string | null;
  styleName: string | null;
  og: number;
  fg: number;
  abv: number;
  ibu: number;
  srm: number;
  forkCount: number;
  starCount: number;
  headNumber: number;
  updatedAt: Date;
}

const PAGE_SIZE = 24;

/**
 * Recipe cards, newest first. Others' recipes appear only when public and not hidden; an owner
 * listing their own sees all of theirs.
 */
export async function listRecipes(
  viewer: Pick<Viewer, 'id'> | null,
  opts: { ownerHandle?: string; page?: number } = {},
): Promise<{ cards: RecipeCard[]; hasMore: boolean }> {
  const page = opts.page ?? 1;
  const replica = readDatabase();
  const owner = opts.ownerHandle
    ? await replica.select({ id: users.id }).from(users).where(eq(users.handle, opts.ownerHandle))
    : [];
  if (opts.ownerHandle && !owner.length) return { cards: [], hasMore: false };
  const ownListing = Boolean(viewer && owner[0]?.id === viewer.id);
  // Members see their own list straight after a save, so it comes from the primary; others' may lag.
  const source = ownListing ? db : replica;
  const conditions = [
    owner[0] ? eq(recipes.ownerId, owner[0].id) : undefined,
    listedRecipeSql(ownListing ? viewer : null),
  ].filter(Boolean);
  const rows = await source
    .select({
      id: recipes.id,
      slug: recipes.slug,
      title: recipes.title,
      ownerName: users.name,
      ownerHandle: users.handle,
      visibility: recipes.visibility,
      hiddenAt: recipes.hiddenAt,
      styleCode: recipeVersions.styleCode,
      styleName: sql<string | null>`${recipeVersions.document} -> 'style' ->> 'name'`,
      og: recipeVersions.og,
      fg: recipeVersions.fg,
      abv: recipeVersions.abv,
      ibu: recipeVersions.ibu,
      srm: recipeVersions.srm,
      forkCount: listedForkCountSql(viewer),
      starCount: recipes.starCount,
      headNumber: recipes.headNumber,
      updatedAt: recipes.updatedAt,
    })
    .from(recipes)
    .innerJoin(users, eq(users.id, recipes.ownerId))
    .innerJoin(recipeVersions, eq(recipeVersions.id, recipes.headVersionId))
    .where(and(...conditions))
    .orderBy(desc(recipes.updatedAt))
    .limit(PAGE_SIZE + 1)
    .offset((page - 1) * PAGE_SIZE);
  const cards = rows.slice(0, PAGE_SIZE).map(({ hiddenAt, ownerName, ...r }) => ({
    ...r,
    ownerName: ownerName ?? r.ownerHandle,
    hidden: Boolean(hiddenAt),
  }));
  return { cards, hasMore: rows.length > PAGE_SIZE };
}

export interface VersionComparison {
  a: VersionView;
  b: VersionView;
  comparison: DocumentComparison;
}

/** Any two versions the viewer can see, of one recipe or across forks. */
export async function compareVersions(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  aId: string,
  bId: string,
  units: UnitSystem = 'metric',
): Promise<VersionComparison> {
  const [a, b] = await Promise.all([getVersionById(viewer, aId), getVersionById(viewer, bId)]);
  return {
    a,
    b,
    comparison: compareDocuments(a.version.document, b.version.document, { units }),
  };
}
