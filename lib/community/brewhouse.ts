import 'server-only';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { EMPTY_BREWHOUSE, type BrewhouseInput, type MemberBrewhouse } from './brewhouse-schema';

export async function getBrewhouse(viewer: Pick<Viewer, 'id'>): Promise<MemberBrewhouse> {
  const [row] = await db
    .select({
      brewhouse: users.brewhouse,
      batchVolumeL: users.defaultBatchVolumeL,
      efficiencyPct: users.defaultEfficiencyPct,
    })
    .from(users)
    .where(eq(users.id, viewer.id));
  if (!row) throw new AppError('not_found', 'member');
  return { ...EMPTY_BREWHOUSE, ...row.brewhouse, batchVolumeL: row.batchVolumeL, efficiencyPct: row.efficiencyPct };
}

/** One row, one column: the whole brewhouse is replaced at once. */
export async function updateBrewhouse(viewer: Pick<Viewer, 'id'>, input: BrewhouseInput): Promise<MemberBrewhouse> {
  await db.update(users).set({ brewhouse: input }).where(eq(users.id, viewer.id));
  return getBrewhouse(viewer);
}
