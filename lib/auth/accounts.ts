import 'server-only';
import { count, eq, sql } from 'drizzle-orm';
import { db } from '@/db';
import { moderationActions, sessions, users, type User } from '@/db/schema';
import { uniqueViolation } from '@/lib/db-errors';
import { env } from '@/lib/env';
import { AppError, invalidInput } from '@/lib/errors';
import { sendMail } from '@/lib/mail';
import { slugify } from '@/lib/slug';
import { hashPassword } from './password';
import { hasRole, suspensionRefusal, type Role } from './roles';
import { signUpSchema, type SignUpInput } from './schemas';
import type { Viewer } from './session';

/** A URL-safe handle from a display name, made unique with a numeric suffix when taken. */
async function freeHandle(name: string, email: string): Promise<string> {
  const base = slugify(name, 30) || slugify(email.split('@')[0], 30) || 'brewer';
  const taken = await db
    .select({ handle: users.handle })
    .from(users)
    .where(sql`${users.handle} = ${base} OR ${users.handle} LIKE ${base + '-%'}`);
  const used = new Set(taken.map((t) => t.handle));
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}-${n}`)) return `${base}-${n}`;
}

export type PublicUser = Pick<User, 'id' | 'name' | 'email' | 'handle' | 'role'>;

/**
 * Signs up with an e-mail address. A new address gets an account; a taken one gets nothing here, and
 * its owner is e-mailed instead. The caller answers both the same way, so sign-up never tells
 * whether an address has an account. Returns the new account, or null when the address was taken.
 */
export async function createAccount(input: SignUpInput): Promise<PublicUser | null> {
  const parsed = signUpSchema.safeParse(input);
  if (!parsed.success) throw invalidInput(parsed.error, 'sign-up');
  const { name, email, password } = parsed.data;
  // Hash before looking, so a taken address costs the same time as a new one.
  const passwordHash = await hashPassword(password);
  const taken = await db.select({ id: users.id }).from(users).where(eq(users.email, email)).limit(1);
  if (taken.length) return addressTaken(email);
  // Two sign-ups can race for one address or for one handle; the unique indexes decide. A lost
  // handle race picks the next free handle; a lost address race is a taken address.
  for (let attempt = 0; ; attempt++) {
    try {
      const [user] = await db
        .insert(users)
        .values({ name, email, passwordHash, handle: await freeHandle(name, email) })
        .returning({ id: users.id, name: users.name, email: users.email, handle: users.handle, role: users.role });
      return user;
    } catch (err) {
      const violation = uniqueViolation(err);
      if (violation?.constraint === 'users_email_key') return addressTaken(email);
      if (violation?.constraint === 'users_handle_key' && attempt < 4) continue;
      if (violation)
        throw new AppError('conflict', 'account', 'Someone signed up at the same moment. Please try again.');
      throw err;
    }
  }
}

/** Tells the owner of a taken address that someone tried to sign up with it; the answer waits for nothing. */
function addressTaken(email: string): null {
  const site = env().NEXTAUTH_URL.replace(/\/$/, '');
  sendMail({
    to: email,
    subject: 'Someone tried to sign up to Kettlefork with your address',
    text: [
      'Someone (perhaps you) just tried to create a Kettlefork account with this e-mail address.',
      'You already have an account, so nothing was changed.',
      '',
      `Sign in: ${site}/sign-in`,
      'Forgotten your password? On that page, ask for a sign-in link by e-mail instead.',
      '',
      'If this was not you, you can ignore this message: nobody can use your account without your password or your inbox.',
    ].join('\n'),
  }).catch((err: unknown) => console.error('sign-up notice to an existing member not sent:', (err as Error).message));
  return null;
}

async function loadTarget(userId: string): Promise<User> {
  const [target] = await db.select().from(users).where(eq(users.id, userId)).limit(1);
  if (!target) throw new AppError('not_found', 'member');
  return target;
}

/** Admins change roles; nobody changes their own, and the last admin cannot be demoted. */
export async function changeRole(actor: Viewer, userId: string, role: Role): Promise<PublicUser> {
  if (!hasRole(actor, 'admin')) throw new AppError('forbidden', 'member', 'Only an admin can change roles.');
  if (actor.id === userId) throw new AppError('forbidden', 'member', 'You cannot change your own role.');
  return db.transaction(async (tx) => {
    const [target] = await tx.select().from(users).where(eq(users.id, userId)).for('update').limit(1);
    if (!target) throw new AppError('not_found', 'member');
    if (target.role === 'admin' && role !== 'admin') {
      const [{ admins }] = await tx.select({ admins: count() }).from(users).where(eq(users.role, 'admin'));
      if (admins <= 1) throw new AppError('conflict', 'member', 'Kettlefork needs at least one admin.');
    }
    const [updated] = await tx
      .update(users)
      .set({ role })
      .where(eq(users.id, userId))
      .returning({ id: users.id, name: users.name, email: users.email, handle: users.handle, role: users.role });
    await tx.insert(moderationActions).values({
      actorId: actor.id,
      action: 'change_role',
      targetType: 'user',
      targetId: userId,
      details: { from: target.role, to: role },
    });
    return updated;
  });
}

/**
 * Suspends or reinstates a member, as suspensionRefusal() allows. Suspension ends every session on the server at once.
 */
export async function setSuspended(actor: Viewer, userId: string, suspended: boolean, reason = ''): Promise<void> {
  if (!hasRole(actor, 'moderator')) throw new AppError('forbidden', 'member', 'Only moderators can suspend members.');
  const target = await loadTarget(userId);
  const refusal = suspensionRefusal(actor, target);
  if (refusal) throw new AppError('forbidden', 'member', refusal);
  await db.transaction(async (tx) => {
    await tx
      .update(users)
      .set(
        suspended ? { suspendedAt: new Date(), suspendedReason: reason } : { suspendedAt: null, suspendedReason: null },
      )
      .where(eq(users.id, userId));
    if (suspended) await tx.delete(sessions).where(eq(sessions.userId, userId));
    await tx.insert(moderationActions).values({
      actorId: actor.id,
      action: suspended ? 'suspend_user' : 'reinstate_user',
      targetType: 'user',
      targetId: userId,
      reason,
    });
  });
}

export async function listUsers(opts: { limit?: number } = {}) {
  return db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      handle: users.handle,
      role: users.role,
      suspendedAt: users.suspendedAt,
      createdAt: users.createdAt,
    })
    .from(users)
    .orderBy(users.createdAt)
    .limit(opts.limit ?? 500);
}
