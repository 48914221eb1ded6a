import 'server-only';
import { eq } from 'drizzle-orm';
import { db, type Transaction } from '@/db';
import { notificationPreferences } from '@/db/schema';
import { NOTIFICATION_KINDS, type NotificationKind } from './kinds';
import type { UnsubscribeScope } from './unsubscribe-token';

export type EmailChoices = Record<NotificationKind, boolean>;

/** Which kinds a member gets e-mails for (every kind is on until they turn it off). */
export async function getEmailChoices(userId: string): Promise<EmailChoices> {
  const rows = await db.select().from(notificationPreferences).where(eq(notificationPreferences.userId, userId));
  const choices = Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, true])) as EmailChoices;
  for (const r of rows) choices[r.kind] = r.email;
  return choices;
}

export async function setEmailChoices(tx: Transaction, userId: string, choices: Partial<EmailChoices>): Promise<void> {
  for (const kind of NOTIFICATION_KINDS) {
    const email = choices[kind];
    if (email === undefined) continue;
    await tx
      .insert(notificationPreferences)
      .values({ userId, kind, email })
      .onConflictDoUpdate({
        target: [notificationPreferences.userId, notificationPreferences.kind],
        set: { email, updatedAt: new Date() },
      });
  }
}

/** What an unsubscribe link (or the mail client's button) does: turn one kind, or all, off or back on. */
export async function setEmailScope(userId: string, scope: UnsubscribeScope, email: boolean): Promise<void> {
  const kinds = scope === 'all' ? NOTIFICATION_KINDS : [scope];
  await db.transaction((tx) => setEmailChoices(tx, userId, Object.fromEntries(kinds.map((k) => [k, email]))));
}
