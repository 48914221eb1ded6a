import { sql } from 'drizzle-orm';
import { db } from '../index';
import type { SeedContext } from './context';
import type { DemoFork, DemoRecipe } from './recipes';

/**
 * When things happened in the demo world: the Millrace Homebrew Circle's year of 2026, from the
 * first recipes in March to the brew days tasted in November. Versions follow each other by a
 * couple of weeks, forks come a little after the version they fork, brew days after the version
 * they brew, comments after the version they discuss and proposals after the version they offer.
 *
 * The seed saves everything through the product's own functions (which stamp the moment of
 * seeding), then `dateDemoWorld` moves the stamps onto this calendar in one transaction.
 */

const DAY_MS = 86_400_000;
const FIRST_RECIPE = Date.parse('2026-03-02T18:00:00Z');
/** A version's successor follows this many days later (plus a little spread per recipe). */
const VERSION_GAP_DAYS = 27;
const FORK_AFTER_DAYS = 11;
const FORK_VERSION_GAP_DAYS = 17;
/** The spam account arrives late in the year. */
const SPAM_AT = Date.parse('2026-11-21T03:12:00Z');

/** Version dates per demo recipe key, index 0 being version 1. */
export type VersionPlan = Map<string, Date[]>;

export function planVersionDates(recipes: readonly DemoRecipe[], forks: readonly DemoFork[]): VersionPlan {
  const plan: VersionPlan = new Map();
  recipes.forEach((r, i) => {
    const first = r.key === 'spam' ? SPAM_AT : FIRST_RECIPE + i * 3 * DAY_MS + (i % 4) * 3_600_000;
    const dates = [new Date(first)];
    for (let k = 0; k < (r.versions?.length ?? 0); k++)
      dates.push(new Date(dates[k].getTime() + (VERSION_GAP_DAYS + (i % 5)) * DAY_MS));
    plan.set(r.key, dates);
  });
  for (const f of forks) {
    const source = plan.get(f.from)?.[f.fromVersion - 1];
    if (!source) throw new Error(`demo fork ${f.key} comes from a version the plan does not have`);
    const dates = [new Date(source.getTime() + FORK_AFTER_DAYS * DAY_MS + 5_400_000)];
    for (let k = 0; k < f.versions.length; k++)
      dates.push(new Date(dates[k].getTime() + FORK_VERSION_GAP_DAYS * DAY_MS));
    plan.set(f.key, dates);
  }
  return plan;
}

/** `YYYY-MM-DD`, `days` after a date. */
export function dayAfter(date: Date, days: number): string {
  return new Date(date.getTime() + days * DAY_MS).toISOString().slice(0, 10);
}

const ts = (d: Date) => d.toISOString();

/** Moves every stamp of the freshly seeded demo world onto the plan. One transaction. */
export async function dateDemoWorld(ctx: SeedContext, plan: VersionPlan): Promise<void> {
  await db.transaction(async (tx) => {
    // Versions are append-only; the demo world, created moments ago in this same run, is the one
    // place their stamps are set afterwards. The guard is back before the transaction commits.
    await tx.execute(sql`alter table recipe_versions disable trigger recipe_versions_append_only`);
    for (const [key, dates] of plan) {
      const recipeId = ctx.recipes.get(key);
      if (!recipeId) continue;
      for (const [i, at] of dates.entries()) {
        await tx.execute(
          sql`update recipe_versions set created_at = ${ts(at)} where recipe_id = ${recipeId} and number = ${i + 1}`,
        );
      }
    }

    // Brew days are logged the evening of the brew; readings, tastings and photos on their own days.
    await tx.execute(sql`
      update brew_days set created_at = brewed_on + time '20:30',
                           updated_at = coalesce(packaged_on, brewed_on) + time '20:30'`);
    await tx.execute(sql`update brew_readings set created_at = taken_on + time '08:15'`);
    await tx.execute(sql`update tastings set created_at = tasted_on + time '21:00'`);
    await tx.execute(sql`
      update photos p set created_at = coalesce(
        (select max(t.tasted_on) from tastings t where t.brew_day_id = p.brew_day_id),
        (select b.packaged_on from brew_days b where b.id = p.brew_day_id)) + time '21:05'`);

    // Comments: a few days after the version they discuss (the one named, else the head), two
    // days apart on one recipe; replies a day after their thread; the spam account's last.
    await tx.execute(sql`
      with firsts as (
        select c.id, v.created_at as version_at,
               row_number() over (partition by c.recipe_id order by c.created_at, c.id) as n
        from comments c
        join recipes r on r.id = c.recipe_id
        join recipe_versions v on v.recipe_id = c.recipe_id and v.number = coalesce(c.version_number, r.head_number)
        where c.parent_id is null
      )
      update comments c set created_at = f.version_at + interval '3 days' + (f.n - 1) * interval '2 days'
      from firsts f where f.id = c.id`);
    await tx.execute(sql`
      update comments c set created_at = p.created_at + interval '1 day 2 hours'
      from comments p where p.id = c.parent_id`);
    await tx.execute(sql`
      update comments c set created_at = ${ts(new Date(SPAM_AT + 2 * DAY_MS))}::timestamptz + (
        select count(*) from comments o where o.author_id = c.author_id and o.created_at < c.created_at
      ) * interval '5 hours'
      from users u where u.id = c.author_id and u.handle = 'spamly'`);

    // Proposals: three days after the later of the version offered and the source's head then;
    // the discussion follows; an accepted one is taken in (its new version saved) a week on.
    await tx.execute(sql`
      update proposals p set created_at = greatest(pv.created_at, bv.created_at) + interval '3 days',
                             updated_at = greatest(pv.created_at, bv.created_at) + interval '3 days'
      from recipe_versions pv, recipe_versions bv
      where pv.id = p.proposed_version_id and bv.id = p.base_version_id`);
    await tx.execute(sql`
      update proposals p set created_at = greatest(p.created_at, h.created_at + interval '3 days'),
                             updated_at = greatest(p.created_at, h.created_at + interval '3 days')
      from recipe_versions h
      where h.recipe_id = p.source_recipe_id and h.number = (
        select max(number) from recipe_versions x
        where x.recipe_id = p.source_recipe_id and x.id is distinct from p.accepted_version_id)`);
    await tx.execute(sql`
      with numbered as (
        select id, proposal_id, row_number() over (partition by proposal_id order by created_at, id) as n
        from proposal_comments
      )
      update proposal_comments c set created_at = p.created_at + n.n * interval '1 day 3 hours'
      from numbered n, proposals p where n.id = c.id and p.id = c.proposal_id`);
    await tx.execute(sql`
      update proposals set decided_at = created_at + interval '7 days', updated_at = created_at + interval '7 days'
      where decided_at is not null`);
    await tx.execute(sql`
      update recipe_versions v set created_at = p.decided_at
      from proposals p where p.accepted_version_id = v.id`);
    await tx.execute(sql`alter table recipe_versions enable trigger recipe_versions_append_only`);

    await tx.execute(sql`
      update recipes r set created_at = s.first_at, updated_at = s.last_at
      from (select recipe_id, min(created_at) as first_at, max(created_at) as last_at
            from recipe_versions group by recipe_id) s
      where s.recipe_id = r.id and r.id in (
        select id from recipes where owner_id in (select id from users where email like '%@kettlefork.test'))`);

    // Members joined over the winter; stars and follows come after what they mark.
    await tx.execute(sql`
      with numbered as (
        select id, row_number() over (order by handle) as n from users where email like '%@kettlefork.test'
      )
      update users u set created_at = timestamptz '2026-01-12 19:00+00' + n.n * interval '2 days 3 hours'
      from numbered n where n.id = u.id`);
    await tx.execute(sql`
      update users set created_at = ${ts(new Date(SPAM_AT - 3_600_000))} where handle = 'spamly'`);
    await tx.execute(sql`
      update stars s set created_at = r.updated_at + interval '4 days' + (
        select count(*) from stars o where o.recipe_id = s.recipe_id and o.user_id < s.user_id) * interval '1 day'
      from recipes r where r.id = s.recipe_id`);
    await tx.execute(sql`
      update member_follows f set created_at = greatest(a.created_at, b.created_at) + interval '10 days'
      from users a, users b where a.id = f.follower_id and b.id = f.followee_id`);
    await tx.execute(sql`
      update recipe_follows f set created_at = r.created_at + interval '2 days'
      from recipes r where r.id = f.recipe_id`);
    await tx.execute(sql`
      update reports set created_at = ${ts(new Date(SPAM_AT + 3 * DAY_MS))}::timestamptz + (
        select count(*) from reports o where o.created_at < reports.created_at) * interval '2 hours'`);

    // Notices carry the moment of what they tell.
    await tx.execute(sql`
      update notifications n set created_at = c.created_at from comments c where c.id = n.comment_id`);
    await tx.execute(sql`
      update notifications n set created_at = case when n.kind = 'proposal' then p.created_at
                                                   else coalesce(p.decided_at, p.updated_at) end
      from proposals p where n.comment_id is null and n.url = '/proposals/' || p.id`);
    // A fork's and a new recipe's notice link to the new recipe; a star's to the starred one.
    await tx.execute(sql`
      update notifications n set created_at = r.created_at
      from recipes r where n.kind in ('fork', 'new_recipe') and n.url = '/recipes/' || r.slug`);
    await tx.execute(sql`
      update notifications n set created_at = s.created_at
      from stars s where n.kind = 'star' and s.user_id = n.actor_id and s.recipe_id = n.recipe_id`);
    await tx.execute(sql`
      update notification_emails e set created_at = n.created_at from notifications n where n.id = e.notification_id`);

    // The search index takes the dates in on its next pass.
    await tx.execute(sql`insert into search_outbox (recipe_id) select id from recipes`);
  });
}
