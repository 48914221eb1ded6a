import 'server-only';
import { eq } from 'drizzle-orm';
import { db } from '@/db';
import { users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { getEmailChoices, setEmailChoices } from '@/lib/notifications/preferences';
import type { SettingsInput } from './schemas';

export type MemberSettings = SettingsInput & { handle: string; email: string };

export async function getSettings(viewer: Pick<Viewer, 'id'>): Promise<MemberSettings> {
  const [row] = await db
    .select({
      name: users.name,
      handle: users.handle,
      email: users.email,
      bio: users.bio,
      units: users.units,
      defaultBatchVolumeL: users.defaultBatchVolumeL,
      defaultEfficiencyPct: users.defaultEfficiencyPct,
    })
    .from(users)
    .where(eq(users.id, viewer.id));
  if (!row) throw new AppError('not_found', 'member');
  return { ...row, name: row.name ?? row.handle, emailChoices: await getEmailChoices(viewer.id) };
}

/** The batch size and efficiency a member's new recipes start from. */
export async function getBrewhouseDefaultsByUserId({
  userId,
}: {
  userId: string;
}): Promise<{ volumeL: number; efficiencyPct: number }> {
  const [row] = await db
    .select({ volumeL: users.defaultBatchVolumeL, efficiencyPct: users.defaultEfficiencyPct })
    .from(users)
    .where(eq(users.id, userId));
  if (!row) throw new AppError('not_found', 'member');
  return row;
}

/** Profile, units, brewhouse defaults and e-mail choices change together or not at all. */
export async function updateSettings(viewer: Pick<Viewer, 'id'>, input: SettingsInput): Promise<MemberSettings> {
  await db.transaction(async (tx) => {
    await tx
      .update(users)
      .set({
        name: input.name,
        bio: input.bio,
        units: input.units,
        defaultBatchVolumeL: input.defaultBatchVolumeL,
        defaultEfficiencyPct: input.defaultEfficiencyPct,
      })
      .where(eq(users.id, viewer.id));
    await setEmailChoices(tx, viewer.id, input.emailChoices);
  });
  return getSettings(viewer);
}
