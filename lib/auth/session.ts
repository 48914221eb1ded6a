import 'server-only';
import { and, eq, gt, isNull } from 'drizzle-orm';
import { getServerSession } from 'next-auth';
import { cookies } from 'next/headers';
import { cache } from 'react';
import { db } from '@/db';
import { sessions, users } from '@/db/schema';
import { authOptions } from './options';
import type { Role } from './roles';

export interface Viewer {
  id: string;
  name: string;
  email: string;
  handle: string;
  role: Role;
  units: 'metric' | 'us';
}

/**
 * The signed-in member for this request, or null. The role is read from the database on every
 * request (never from the client), and a session that was ended on the server or belongs to a
 * suspended member counts as signed out.
 */
export const getViewer = cache(async (): Promise<Viewer | null> => {
  // Reading cookies first marks the caller as per-request (never prerendered).
  if (!(await cookies()).getAll().some((c) => c.name.includes('next-auth.session-token'))) return null;
  const session = (await getServerSession(authOptions())) as { sid?: string } | null;
  if (!session?.sid) return null;
  const [row] = await db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      handle: users.handle,
      role: users.role,
      units: users.units,
    })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(eq(sessions.sessionToken, session.sid), gt(sessions.expires, new Date()), isNull(users.suspendedAt)))
    .limit(1);
  return row ? { ...row, name: row.name ?? row.handle } : null;
});
