import 'server-only';
import { and, eq, gt, sql } from 'drizzle-orm';
import type { Transaction } from '@/db';
import { notificationEmails, notificationPreferences, notifications } from '@/db/schema';
import type { NotificationKind } from './kinds';

export interface NotifyInput {
  /** Who is told. */
  userId: string;
  kind: NotificationKind;
  /** Who did it; nobody is told about their own doing. */
  actorId: string;
  /** The recipe it is about; the notification is shown only while the member may see that recipe. */
  recipeId?: string | null;
  commentId?: string | null;
  /** Our own path to open, e.g. `/recipes/millrace-pale#comment-…`. */
  url: string;
  /** A few words of plain text (a comment's start, a brew-day note); cut to 200 characters. */
  excerpt?: string;
}

/** Stars that come and go do not tell the owner twice in a day. */
const REPEAT_WINDOW_MS = 24 * 60 * 60 * 1000;

/**
 * Tells a member something happened: a row for the site's bell, and (unless the member turned
 * this kind off) an e-mail queued in `notification_emails`. Call it inside the transaction that
 * makes the change, so the notice exists exactly when the change does. Returns the id, or null
 * when nothing was recorded (the member did it themselves, or a star repeated within a day).
 */
export async function notify(tx: Transaction, input: NotifyInput): Promise<string | null> {
  if (input.userId === input.actorId) return null;
  if (input.kind === 'star' && input.recipeId) {
    const [recent] = await tx
      .select({ id: notifications.id })
      .from(notifications)
      .where(
        and(
          eq(notifications.userId, input.userId),
          eq(notifications.kind, 'star'),
          eq(notifications.actorId, input.actorId),
          eq(notifications.recipeId, input.recipeId),
          gt(notifications.createdAt, new Date(Date.now() - REPEAT_WINDOW_MS)),
        ),
      )
      .limit(1);
    if (recent) return null;
  }
  const [row] = await tx
    .insert(notifications)
    .values({
      userId: input.userId,
      kind: input.kind,
      actorId: input.actorId,
      recipeId: input.recipeId ?? null,
      commentId: input.commentId ?? null,
      url: input.url,
      excerpt: plainExcerpt(input.excerpt ?? ''),
    })
    .returning({ id: notifications.id });
  const [pref] = await tx
    .select({ email: notificationPreferences.email })
    .from(notificationPreferences)
    .where(and(eq(notificationPreferences.userId, input.userId), eq(notificationPreferences.kind, input.kind)));
  if (pref?.email !== false) {
    await tx.insert(notificationEmails).values({ notificationId: row.id, userId: input.userId, kind: input.kind });
  }
  return row.id;
}

/**
 * `notify` for every follower of `actorId` at once, in one statement whatever their number: a bell
 * row each, and an e-mail queued for each who has not turned this kind off. The actor is never
 * among them (a member cannot follow themselves). Stars are left to `notify`, which holds repeats
 * back. Returns how many members were told.
 */
export async function notifyFollowers(
  tx: Transaction,
  input: Omit<NotifyInput, 'userId' | 'kind' | 'commentId'> & { kind: Exclude<NotificationKind, 'star'> },
): Promise<number> {
  const result = await tx.execute<{ told: number }>(sql`
    with told as (
      insert into notifications (user_id, kind, actor_id, recipe_id, url, excerpt)
      select f.follower_id, ${input.kind}::notification_kind, ${input.actorId}, ${input.recipeId ?? null}::uuid,
             ${input.url}, ${plainExcerpt(input.excerpt ?? '')}
      from member_follows f
      where f.followee_id = ${input.actorId} and f.follower_id <> ${input.actorId}
      returning id, user_id, kind
    ), queued as (
      insert into notification_emails (notification_id, user_id, kind)
      select t.id, t.user_id, t.kind
      from told t
      where not exists (
        select 1 from notification_preferences p
        where p.user_id = t.user_id and p.kind = t.kind and p.email = false
      )
      returning 1
    )
    select (select count(*) from told)::int as told, (select count(*) from queued)::int as queued
  `);
  return result.rows[0]?.told ?? 0;
}

/** Markdown reduced to a short line of plain text. */
function plainExcerpt(text: string, max = 200): string {
  const plain = text
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/[#>*_`~]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  return plain.length > max ? `${plain.slice(0, max - 1)}…` : plain;
}
