import 'server-only';
import { createHmac, timingSafeEqual } from 'node:crypto';
import { authSecret } from '@/lib/env';
import { NOTIFICATION_KINDS, type NotificationKind } from './kinds';

/** `all` stops every notification e-mail; any other scope stops one kind. */
export type UnsubscribeScope = NotificationKind | 'all';

function signature(userId: string, scope: UnsubscribeScope): string {
  return createHmac('sha256', authSecret()).update(`kettlefork-unsubscribe\n${userId}\n${scope}`).digest('base64url');
}

/** A token that lets whoever holds it (the member's inbox) stop one kind of e-mail for one member, without signing in. */
export function unsubscribeToken(userId: string, scope: UnsubscribeScope): string {
  return `${userId}.${scope}.${signature(userId, scope)}`;
}

/** The member and scope a token names, or null when it was not signed by us (or was altered). */
export function readUnsubscribeToken(token: string): { userId: string; scope: UnsubscribeScope } | null {
  const parts = token.split('.');
  if (parts.length !== 3) return null;
  const [userId, scope, sig] = parts;
  if (!userId || !(scope === 'all' || (NOTIFICATION_KINDS as readonly string[]).includes(scope))) return null;
  const expected = Buffer.from(signature(userId, scope as UnsubscribeScope));
  const given = Buffer.from(sig);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return { userId, scope: scope as UnsubscribeScope };
}
