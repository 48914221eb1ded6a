import 'server-only';
import { sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { recipes } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { listedRecipeSql } from '@/lib/recipes/access';

/** The feed's recipes go by `r` in its query. */
const r = alias(recipes, 'r');

export interface FeedItem {
  kind: 'version' | 'fork' | 'recipe' | 'brew_day';
  id: string;
  at: Date;
  actorName: string;
  actorHandle: string;
  recipeTitle: string;
  recipeSlug: string;
  versionNumber: number;
  message: string;
  url: string;
}

type Row = {
  kind: 'version' | 'brew_day';
  id: string;
  at: Date;
  actor_name: string;
  actor_handle: string;
  title: string;
  slug: string;
  number: number;
  message: string;
  is_fork: boolean;
};

const FEED_SIZE = 50;

/**
 * The home feed: new versions (new recipes and forks among them) and brew days from the members
 * and recipes the viewer follows, newest first. Only public, unhidden recipes appear, and never
 * the viewer's own doings. `before` pages back in time.
 */
export async function getFeed(
  viewer: Pick<Viewer, 'id'>,
  opts: { before?: Date } = {},
): Promise<{ items: FeedItem[]; next: Date | null }> {
  const before = (opts.before ?? new Date(Date.now() + 60_000)).toISOString();
  const result = await db.execute<Row>(sql`
    with followed_members as (select followee_id as id from member_follows where follower_id = ${viewer.id}),
         followed_recipes as (select recipe_id as id from recipe_follows where follower_id = ${viewer.id})
    select * from (
      select 'version' as kind, v.id, v.created_at as at, coalesce(u.name, u.handle) as actor_name, u.handle as actor_handle,
             r.title, r.slug, v.number, v.message, (r.forked_from_version_id is not null and v.number = 1) as is_fork
      from recipe_versions v
      join recipes r on r.id = v.recipe_id
      join users u on u.id = v.author_id
      where ${listedRecipeSql(null, r)} and u.suspended_at is null
        and v.author_id <> ${viewer.id} and v.created_at < ${before}::timestamptz
        and (v.author_id in (select id from followed_members) or r.id in (select id from followed_recipes))
      union all
      select 'brew_day', b.id, b.created_at, coalesce(u.name, u.handle), u.handle,
             r.title, r.slug, v.number, '', false
      from brew_days b
      join recipes r on r.id = b.recipe_id
      join recipe_versions v on v.id = b.version_id
      join users u on u.id = b.brewer_id
      where ${listedRecipeSql(null, r)} and u.suspended_at is null
        and b.brewer_id <> ${viewer.id} and b.created_at < ${before}::timestamptz
        and (b.brewer_id in (select id from followed_members) or r.id in (select id from followed_recipes))
    ) items
    order by at desc
    limit ${FEED_SIZE + 1}
  `);
  const rows = result.rows.slice(0, FEED_SIZE);
  const items = rows.map((r): FeedItem => {
    const at = new Date(r.at);
    const kind =
      r.kind === 'brew_day' ? 'brew_day' : r.is_fork ? 'fork' : Number(r.number) === 1 ? 'recipe' : 'version';
    return {
      kind,
      id: r.id,
      at,
      actorName: r.actor_name,
      actorHandle: r.actor_handle,
      recipeTitle: r.title,
      recipeSlug: r.slug,
      versionNumber: Number(r.number),
      message: r.message,
      // Brew days are shown on the version they brewed.
      url: `/recipes/${r.slug}/v/${r.number}`,
    };
  });
  return { items, next: result.rows.length > FEED_SIZE ? items[items.length - 1].at : null };
}
