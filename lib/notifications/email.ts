import 'server-only';
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { notificationEmails, notificationPreferences, notifications, recipes, users } from '@/db/schema';
import { env } from '@/lib/env';
import { sendMail, type OutgoingMail } from '@/lib/mail';
import { canView } from '@/lib/recipes/access';
import { describeNotification, KIND_LABELS, type NotificationKind } from './kinds';
import { unsubscribeToken, type UnsubscribeScope } from './unsubscribe-token';

/**
 * A member gets at most one notification e-mail per this many minutes: whatever happens in
 * between waits in `notification_emails` and goes out together in the next message.
 */
export const EMAIL_DIGEST_INTERVAL_MIN = 10;
/** How often the sender loop looks for e-mails that are due. */
const EMAIL_LOOP_INTERVAL_SEC = 30;
/** Members handled per run, so one run stays short. */
const MEMBERS_PER_RUN = 50;
/** Notices listed in one message; the rest are summed up with a link to the site. */
const ITEMS_PER_MESSAGE = 20;

export interface FlushOptions {
  /** The time the digest interval is measured from (tests move it forward). */
  now?: Date;
  /** Sends one message; the SMTP relay by default. */
  send?: (mail: OutgoingMail) => Promise<void>;
}

export interface FlushResult {
  /** Messages handed to the SMTP server. */
  sent: number;
  /** Members whose message could not be sent; their rows stay queued for the next run. */
  failed: number;
  /** Queued rows dropped because the member turned that kind off or cannot see the recipe any more. */
  skipped: number;
  /** The last send error of this run, if any. */
  error?: string;
}

/**
 * Sends every member whose digest interval has passed one message with their pending
 * notifications. Safe to run from several servers at once: a member's rows are locked while
 * their message is sent. When the SMTP server is down the rows stay queued and the error is
 * kept on them; the next run tries again.
 */
export async function flushEmailNotifications(opts: FlushOptions = {}): Promise<FlushResult> {
  const now = opts.now ?? new Date();
  const send = opts.send ?? sendMail;
  const cutoff = new Date(now.getTime() - EMAIL_DIGEST_INTERVAL_MIN * 60_000);
  const due = await db.execute<{ user_id: string }>(sql`
    select e.user_id from notification_emails e
    where e.sent_at is null
    group by e.user_id
    having coalesce((select max(s.sent_at) from notification_emails s where s.user_id = e.user_id and s.outcome = 'sent'), 'epoch'::timestamptz) <= ${cutoff.toISOString()}::timestamptz
    order by min(e.created_at)
    limit ${MEMBERS_PER_RUN}
  `);
  const result: FlushResult = { sent: 0, failed: 0, skipped: 0 };
  for (const { user_id: userId } of due.rows) {
    try {
      const outcome = await sendDigest(userId, send);
      if (outcome.sent) result.sent += 1;
      result.skipped += outcome.skipped;
    } catch (err) {
      result.failed += 1;
      result.error = String((err as Error).message ?? err);
      await db
        .update(notificationEmails)
        .set({
          attempts: sql`${notificationEmails.attempts} + 1`,
          lastError: String((err as Error).message ?? err).slice(0, 500),
        })
        .where(and(eq(notificationEmails.userId, userId), isNull(notificationEmails.sentAt)));
    }
  }
  return result;
}

const actors = alias(users, 'actor');

async function sendDigest(
  userId: string,
  send: (mail: OutgoingMail) => Promise<void>,
): Promise<{ sent: boolean; skipped: number }> {
  return db.transaction(async (tx) => {
    // Another server sending this member's digest right now holds these rows: leave them to it.
    const pending = await tx
      .select({ id: notificationEmails.id })
      .from(notificationEmails)
      .where(and(eq(notificationEmails.userId, userId), isNull(notificationEmails.sentAt)))
      .orderBy(asc(notificationEmails.id))
      .for('update', { skipLocked: true });
    if (!pending.length) return { sent: false, skipped: 0 };
    const ids = pending.map((p) => p.id);
    const [member] = await tx
      .select({
        id: users.id,
        email: users.email,
        name: users.name,
        handle: users.handle,
        role: users.role,
        suspendedAt: users.suspendedAt,
      })
      .from(users)
      .where(eq(users.id, userId));
    const offKinds = new Set(
      (
        await tx
          .select({ kind: notificationPreferences.kind })
          .from(notificationPreferences)
          .where(and(eq(notificationPreferences.userId, userId), eq(notificationPreferences.email, false)))
      ).map((p) => p.kind),
    );
    const rows = await tx
      .select({
        emailId: notificationEmails.id,
        kind: notificationEmails.kind,
        url: notifications.url,
        excerpt: notifications.excerpt,
        createdAt: notifications.createdAt,
        actorName: sql<string>`coalesce(${actors.name}, ${actors.handle}, 'Someone')`,
        recipe: {
          title: recipes.title,
          ownerId: recipes.ownerId,
          visibility: recipes.visibility,
          hiddenAt: recipes.hiddenAt,
        },
      })
      .from(notificationEmails)
      .innerJoin(notifications, eq(notifications.id, notificationEmails.notificationId))
      .leftJoin(actors, eq(actors.id, notifications.actorId))
      .leftJoin(recipes, eq(recipes.id, notifications.recipeId))
      .where(inArray(notificationEmails.id, ids))
      .orderBy(asc(notifications.createdAt));
    const viewer = member && { id: member.id, role: member.role };
    const wanted = rows.filter(
      (r) =>
        member &&
        !member.suspendedAt &&
        !offKinds.has(r.kind) &&
        (!r.recipe?.ownerId || canView(r.recipe as Parameters<typeof canView>[0], viewer)),
    );
    const skippedIds = rows.filter((r) => !wanted.includes(r)).map((r) => r.emailId);
    if (skippedIds.length) {
      await tx
        .update(notificationEmails)
        .set({ outcome: 'skipped', sentAt: new Date() })
        .where(inArray(notificationEmails.id, skippedIds));
    }
    if (!wanted.length) return { sent: false, skipped: skippedIds.length };
    await send(digestMessage(member!, wanted));
    await tx
      .update(notificationEmails)
      .set({ outcome: 'sent', sentAt: new Date(), attempts: sql`${notificationEmails.attempts} + 1`, lastError: null })
      .where(
        inArray(
          notificationEmails.id,
          wanted.map((w) => w.emailId),
        ),
      );
    return { sent: true, skipped: skippedIds.length };
  });
}

interface DigestItem {
  kind: NotificationKind;
  url: string;
  excerpt: string;
  actorName: string;
  recipe: { title: string } | null;
}

function unsubscribeUrl(userId: string, scope: UnsubscribeScope): string {
  return new URL(
    `/api/unsubscribe?token=${encodeURIComponent(unsubscribeToken(userId, scope))}`,
    env().NEXTAUTH_URL,
  ).toString();
}

/** One plain-text message listing the notices, with a one-click unsubscribe link per kind. */
function digestMessage(
  member: { id: string; email: string; name: string | null; handle: string },
  items: DigestItem[],
): OutgoingMail {
  const base = env().NEXTAUTH_URL;
  const lines = items.slice(0, ITEMS_PER_MESSAGE).map((item) => {
    const line = describeNotification(item.kind, item.actorName, item.recipe?.title ?? 'a recipe');
    const excerpt = item.excerpt ? `\n  “${item.excerpt}”` : '';
    return `• ${line}${excerpt}\n  ${new URL(item.url, base).toString()}`;
  });
  if (items.length > ITEMS_PER_MESSAGE)
    lines.push(`…and ${items.length - ITEMS_PER_MESSAGE} more: ${new URL('/notifications', base).toString()}`);
  const kinds = [...new Set(items.map((i) => i.kind))];
  const subject =
    items.length === 1
      ? describeNotification(items[0].kind, items[0].actorName, items[0].recipe?.title ?? 'a recipe')
      : `${items.length} new things on Kettlefork`;
  const stopLines = kinds.map(
    (k) => `Stop e-mails like this (${KIND_LABELS[k].toLowerCase()}): ${unsubscribeUrl(member.id, k)}`,
  );
  // The mail client's own unsubscribe button stops what this message is about: its one kind, or all of them.
  const headerScope: UnsubscribeScope = kinds.length === 1 ? kinds[0] : 'all';
  const text = [
    `Hello ${member.name ?? member.handle},`,
    '',
    items.length === 1 ? 'This happened on Kettlefork:' : 'These happened on Kettlefork:',
    '',
    ...lines,
    '',
    '—',
    ...stopLines,
    `Stop all notification e-mails: ${unsubscribeUrl(member.id, 'all')}`,
    `Choose what we e-mail you: ${new URL('/settings', base).toString()}`,
  ].join('\n');
  return {
    to: member.email,
    subject: subject.length > 150 ? `${subject.slice(0, 149)}…` : subject,
    text,
    headers: {
      'List-Unsubscribe': `<${unsubscribeUrl(member.id, headerScope)}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  };
}

const globalForLoop = globalThis as unknown as { kfEmailLoop?: NodeJS.Timeout };

/**
 * The loop's period in milliseconds: EMAIL_LOOP_INTERVAL_SEC, or KF_EMAIL_INTERVAL_MS when set to a
 * positive whole number (the fault run shortens it so an SMTP outage and its recovery fit in seconds).
 */
function emailLoopIntervalMs(raw = process.env.KF_EMAIL_INTERVAL_MS): number {
  const ms = Number(raw);
  return raw && Number.isInteger(ms) && ms > 0 ? ms : EMAIL_LOOP_INTERVAL_SEC * 1000;
}

/** Started once per server (instrumentation.ts): sends due digests every emailLoopIntervalMs(). */
export function startEmailNotificationLoop(): void {
  if (globalForLoop.kfEmailLoop) return;
  let running = false;
  let lastError = '';
  globalForLoop.kfEmailLoop = setInterval(() => {
    if (running) return;
    running = true;
    flushEmailNotifications()
      .then((r) => {
        if (r.error && r.error !== lastError) console.error('[mail] notification e-mails wait in the queue:', r.error);
        lastError = r.error ?? '';
      })
      .catch((err: Error) => {
        // Logged once per outage, not on every tick.
        if (err.message !== lastError) console.error('[mail] notification e-mails not sent yet:', err.message);
        lastError = err.message;
      })
      .finally(() => {
        running = false;
      });
  }, emailLoopIntervalMs());
  globalForLoop.kfEmailLoop.unref();
}
