import 'server-only';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { eq } from 'drizzle-orm';
import type { NextAuthOptions } from 'next-auth';
import type { Adapter } from 'next-auth/adapters';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { db } from '@/db';
import { accounts, sessions, users, verificationTokens } from '@/db/schema';
import { authSecret, env } from '@/lib/env';
import {
  MAGIC_LINK_PER_ACCOUNT,
  SIGN_IN_PER_ACCOUNT,
  SIGN_IN_PER_ADDRESS,
  clientAddress,
  tryConsume,
} from '@/lib/rate-limit';
import { emailSchema } from './schemas';
import { verifyPassword } from './password';
import { sendMagicLink } from './magic-link';
import { safeCallbackPath } from './callback';

const SESSION_MAX_AGE_SEC = 30 * 24 * 60 * 60;
const MAGIC_LINK_MAX_AGE_SEC = 15 * 60;

// next-auth's own tables through the Drizzle adapter. Accounts are created by sign-up only:
// a magic link is sent to existing members, so the adapter never has to invent a user.
function adapter(): Adapter {
  const base = DrizzleAdapter(db, {
    usersTable: users,
    accountsTable: accounts,
    sessionsTable: sessions,
    verificationTokensTable: verificationTokens,
  }) as unknown as Adapter;
  return {
    ...base,
    createUser: () => {
      throw new Error('Accounts are created through sign-up only.');
    },
  };
}

/** Same answer for "no such account", "wrong password" and "rate limited": null. */
async function authorizeWithPassword(
  credentials: Record<string, string> | undefined,
  headers: Record<string, string | string[] | undefined> | undefined,
) {
  const email = emailSchema.safeParse(credentials?.email ?? '');
  const password = credentials?.password ?? '';
  if (!email.success || !password || password.length > 200) return null;
  const [perAddress, perAccount] = await Promise.all([
    tryConsume(SIGN_IN_PER_ADDRESS, clientAddress(headers)),
    tryConsume(SIGN_IN_PER_ACCOUNT, email.data),
  ]);
  if (!perAddress || !perAccount) {
    // A locked account or address answers no faster than a wrong password, so timing tells nothing.
    await verifyPassword(password, null);
    return null;
  }
  const [user] = await db.select().from(users).where(eq(users.email, email.data)).limit(1);
  const ok = await verifyPassword(password, user?.passwordHash);
  if (!user || !ok || user.suspendedAt) return null;
  return { id: user.id, email: user.email, name: user.name };
}

export function authOptions(): NextAuthOptions {
  const e = env();
  return {
    secret: authSecret(),
    adapter: adapter(),
    session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_SEC },
    useSecureCookies: e.KF_SECURE_COOKIES ? e.KF_SECURE_COOKIES === 'true' : e.NEXTAUTH_URL.startsWith('https://'),
    pages: { signIn: '/sign-in', error: '/sign-in', verifyRequest: '/sign-in/check-email' },
    providers: [
      CredentialsProvider({
        id: 'credentials',
        name: 'E-mail and password',
        credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
        authorize: (credentials, req) => authorizeWithPassword(credentials, req?.headers),
      }),
      EmailProvider({
        server: e.SMTP_URL,
        from: e.MAIL_FROM,
        maxAge: MAGIC_LINK_MAX_AGE_SEC,
        normalizeIdentifier: (identifier) => identifier.trim().toLowerCase(),
        async sendVerificationRequest({ identifier, url }) {
          if (!(await tryConsume(MAGIC_LINK_PER_ACCOUNT, identifier))) return;
          await sendMagicLink(identifier, url);
        },
      }),
    ],
    callbacks: {
      // Links in sign-in e-mails and next-auth's own redirects stay on our site.
      async redirect({ url, baseUrl }) {
        const path = url.startsWith(baseUrl) ? url.slice(baseUrl.length) || '/' : url;
        return `${baseUrl}${safeCallbackPath(path)}`;
      },
      async signIn({ user, email }) {
        // Asking for a link always looks the same, whether or not the address has an account.
        if (email?.verificationRequest) return true;
        const [row] = await db
          .select({ suspendedAt: users.suspendedAt })
          .from(users)
          .where(eq(users.id, user.id))
          .limit(1);
        return Boolean(row) && !row.suspendedAt;
      },
      async jwt({ token, user }) {
        if (user) {
          // A fresh server-side session at every sign-in; the cookie only names it.
          const sid = crypto.randomUUID();
          await db
            .insert(sessions)
            .values({ sessionToken: sid, userId: user.id, expires: new Date(Date.now() + SESSION_MAX_AGE_SEC * 1000) });
          token.sid = sid;
          token.sub = user.id;
        }
        return token;
      },
      async session({ session, token }) {
        return { ...session, sid: typeof token.sid === 'string' ? token.sid : undefined };
      },
    },
    events: {
      async signOut({ token }) {
        if (token?.sid && typeof token.sid === 'string') {
          await db.delete(sessions).where(eq(sessions.sessionToken, token.sid));
        }
      },
    },
  };
}
