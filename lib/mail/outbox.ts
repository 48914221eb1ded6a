import 'server-only';
import { env } from '@/lib/env';
import type { StoredMessage } from './fake/server';

/** What the local SMTP fake has received, newest first (empty when it cannot be reached). */
export async function listOutbox(
  opts: { to?: string } = {},
): Promise<{ available: boolean; messages: StoredMessage[] }> {
  const url = new URL('/messages', env().MAIL_OUTBOX_URL);
  if (opts.to) url.searchParams.set('to', opts.to);
  try {
    const res = await fetch(url, { cache: 'no-store', signal: AbortSignal.timeout(3_000) });
    if (!res.ok) return { available: false, messages: [] };
    const body = (await res.json()) as { messages: StoredMessage[] };
    return { available: true, messages: body.messages };
  } catch {
    return { available: false, messages: [] };
  }
}
