import 'server-only';
import { sql } from 'drizzle-orm';
import { db } from '@/db';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';
import { canView, isListed } from './access';
import { getRecipe } from './versions';

interface LineageVersion {
  id: string;
  number: number;
  parentVersionId: string | null;
  message: string;
}

export interface LineageRecipe {
  id: string;
  slug: string | null;
  title: string;
  ownerName: string;
  forkedFromVersionId: string | null;
  depth: number;
  /** Shown as a placeholder: a moderator hid it, so others see only that it was there. */
  hidden: boolean;
  versions: LineageVersion[];
}

type Row = {
  id: string;
  slug: string;
  title: string;
  owner_id: string;
  owner_name: string;
  visibility: 'public' | 'unlisted' | 'private';
  hidden_at: Date | null;
  forked_from_version_id: string | null;
  depth: number;
  versions: LineageVersion[];
};

/**
 * The whole family of a recipe: up to its oldest ancestor, then every fork of a fork below it,
 * each with its versions (recursive queries over fork links). Recipes the viewer may not see are
 * left out, except hidden ones, which stay as placeholders so the tree keeps its shape.
 */
export async function getLineageByRecipeId(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  { recipeId }: { recipeId: string },
): Promise<LineageRecipe[]> {
  await getRecipe(viewer, { id: recipeId });
  const result = await db.execute<Row>(sql`
    with recursive ancestors(id, forked_from_version_id, hops) as (
      select r.id, r.forked_from_version_id, 0 from recipes r where r.id = ${recipeId}
      union all
      select r.id, r.forked_from_version_id, a.hops + 1
      from ancestors a
      join recipe_versions v on v.id = a.forked_from_version_id
      join recipes r on r.id = v.recipe_id
      where a.hops < 100
    ),
    root as (select id from ancestors order by hops desc limit 1),
    family(id, depth) as (
      select id, 0 from root
      union all
      select child.id, f.depth + 1
      from family f
      join recipe_versions v on v.recipe_id = f.id
      join recipes child on child.forked_from_version_id = v.id
      where f.depth < 100
    )
    select r.id, r.slug, r.title, r.owner_id, coalesce(u.name, u.handle) as owner_name, r.visibility, r.hidden_at,
           r.forked_from_version_id, f.depth,
           coalesce((select json_agg(json_build_object('id', v.id, 'number', v.number, 'parentVersionId', v.parent_version_id, 'message', v.message) order by v.number)
                     from recipe_versions v where v.recipe_id = r.id), '[]'::json) as versions
    from family f
    join recipes r on r.id = f.id
    join users u on u.id = r.owner_id
    order by f.depth, r.created_at
    limit 500
  `);
  const out: LineageRecipe[] = [];
  for (const r of result.rows) {
    const gate = { ownerId: r.owner_id, visibility: r.visibility, hiddenAt: r.hidden_at };
    const visible =
      canView(gate, viewer) &&
      (isListed(gate) ||
        r.id === recipeId ||
        viewer?.id === r.owner_id ||
        (viewer !== null && hasRole(viewer, 'moderator')));
    if (visible) {
      out.push({
        id: r.id,
        slug: r.slug,
        title: r.title,
        ownerName: r.owner_name,
        forkedFromVersionId: r.forked_from_version_id,
        depth: r.depth,
        hidden: Boolean(r.hidden_at),
        versions: r.versions,
      });
    } else if (r.hidden_at && r.visibility === 'public') {
      out.push({
        id: r.id,
        slug: null,
        title: 'Hidden recipe',
        ownerName: '',
        forkedFromVersionId: r.forked_from_version_id,
        depth: r.depth,
        hidden: true,
        versions: r.versions.map((v) => ({ ...v, message: '' })),
      });
    }
  }
  return out;
}
