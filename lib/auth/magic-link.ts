import 'server-only';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { users } from '@/db/schema';
import { env } from '@/lib/env';
import { sendMail } from '@/lib/mail';

/**
 * Sends the sign-in link to a member; an address with no account gets a note on how to sign up
 * instead, so the page that asked shows the same thing either way.
 */
export async function sendMagicLink(email: string, url: string): Promise<void> {
  const [user] = await db
    .select({ name: users.name, suspendedAt: users.suspendedAt })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  if (!user) {
    await sendMail({
      to: email,
      subject: 'Signing in to Kettlefork',
      text: `Someone asked to sign in to Kettlefork with this address, but it has no account yet.\n\nTo create one, visit ${new URL('/sign-up', env().NEXTAUTH_URL)}\n\nIf this was not you, you can ignore this message.`,
    });
    return;
  }
  if (user.suspendedAt) return;
  await sendMail({
    to: email,
    subject: 'Your Kettlefork sign-in link',
    text: `Hello ${user.name ?? 'brewer'},\n\nUse this link within 15 minutes to sign in to Kettlefork. It works once.\n\n${url}\n\nIf you did not ask for it, ignore this message; nobody can sign in without it.`,
  });
}
