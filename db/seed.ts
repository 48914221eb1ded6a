import { sql } from 'drizzle-orm';
import { db, getPool } from './index';
import { users } from './schema';
import { DEMO_PASSWORD, demoPeople } from './seed/people';
import { hashPassword } from '@/lib/auth/password';

// Idempotent: running it again leaves an existing demo world as it is.
async function seedPeople(): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const p of demoPeople) {
    await db
      .insert(users)
      .values({ ...p, passwordHash, emailVerified: new Date() })
      .onConflictDoNothing({ target: users.handle });
  }
}

await seedPeople();
const [{ n }] = (await db.execute(sql`select count(*)::int as n from users`)).rows as { n: number }[];
console.log(`seed: ${n} members`);
await getPool().end();
