import type { StoredMessage } from '@/lib/mail/fake/server';
import { MAIL_OUTBOX_URL } from './env';

/** Waits until the mail fake holds a message to `to` matching `match`, and returns it. */
export async function waitForMail(
  to: string,
  match: (m: StoredMessage) => boolean = () => true,
  timeoutMs = 10_000,
): Promise<StoredMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const res = await fetch(`${MAIL_OUTBOX_URL}/messages?to=${encodeURIComponent(to)}`);
    const { messages } = (await res.json()) as { messages: StoredMessage[] };
    const found = messages.find(match);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}
