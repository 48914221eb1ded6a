import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { users, type User } from '@/db/schema';
import { hashPassword } from '@/lib/auth/password';
import { TestClient } from './http';

export const TEST_PASSWORD = 'grist-and-sparge-test';
let counter = 0;
let cachedHash: Promise<string> | undefined;

export function uniqueEmail(prefix = 'brewer'): string {
  counter += 1;
  return `${prefix}-${process.pid}-${Date.now().toString(36)}-${counter}@kettlefork.test`;
}

/** Inserts a member straight into the test database (the password is TEST_PASSWORD). */
export async function createUser(
  opts: { role?: User['role']; name?: string; suspended?: boolean } = {},
): Promise<User> {
  cachedHash ??= hashPassword(TEST_PASSWORD);
  const email = uniqueEmail(opts.role ?? 'member');
  const [user] = await db
    .insert(users)
    .values({
      email,
      name: opts.name ?? `Test ${opts.role ?? 'member'} ${counter}`,
      handle: email.split('@')[0],
      role: opts.role ?? 'member',
      passwordHash: await cachedHash,
      suspendedAt: opts.suspended ? new Date() : null,
    })
    .returning();
  return user;
}

/** A member of the given role, already signed in through the real sign-in route. */
export async function signedInClient(role: User['role'] = 'member'): Promise<{ user: User; client: TestClient }> {
  const user = await createUser({ role });
  const client = new TestClient();
  const ok = await client.signIn(user.email, TEST_PASSWORD);
  if (!ok) throw new Error(`could not sign in test ${role}`);
  return { user, client };
}

export async function reloadUser(id: string): Promise<User> {
  const [user] = await db.select().from(users).where(eq(users.id, id));
  return user;
}
