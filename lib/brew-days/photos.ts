import 'server-only';
import { and, eq, sql } from 'drizzle-orm';
import { db } from '@/db';
import { moderationActions, photos, users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { deleteObjects, getObject, putObject } from '@/lib/storage';
import { processPhoto } from '@/lib/storage/images';
import { loadOwnBrewDay, loadVisibleBrewDay } from './brew-days';
import { photoVisibleTo } from './photo-visibility';
import { requireId } from '@/lib/validation/ids';

/**
 * Per-member photo quota (ASVS 12.1.3): at most this many photos and this many stored bytes
 * (display and thumbnail together) across all of a member's brew days, and a cap per brew day.
 */
export const PHOTO_QUOTA_COUNT = 300;
const PHOTO_QUOTA_BYTES = 300 * 1024 * 1024;
const PHOTOS_PER_BREW_DAY = 30;

type Executor = Pick<typeof db, 'select'>;

async function usage(tx: Executor, uploaderId: string, brewDayId: string) {
  const [row] = await tx
    .select({
      count: sql<number>`count(*)::int`,
      bytes: sql<number>`coalesce(sum(${photos.storedBytes}), 0)::bigint`,
      onDay: sql<number>`count(*) filter (where ${photos.brewDayId} = ${brewDayId})::int`,
    })
    .from(photos)
    .where(eq(photos.uploaderId, uploaderId));
  return { count: row.count, bytes: Number(row.bytes), onDay: row.onDay };
}

function checkQuota(used: { count: number; bytes: number; onDay: number }, addingBytes: number): void {
  if (used.onDay >= PHOTOS_PER_BREW_DAY) {
    throw new AppError(
      'forbidden',
      'photo',
      `A brew day holds at most ${PHOTOS_PER_BREW_DAY} photos; delete one to add another.`,
    );
  }
  if (used.count >= PHOTO_QUOTA_COUNT || used.bytes + addingBytes > PHOTO_QUOTA_BYTES) {
    throw new AppError(
      'forbidden',
      'photo',
      `You have reached your photo allowance (${PHOTO_QUOTA_COUNT} photos or ${PHOTO_QUOTA_BYTES / 1024 / 1024} MB); delete some photos to add more.`,
    );
  }
}

/**
 * Checks and re-encodes an uploaded photo, stores both sizes under server-chosen keys and records
 * them. If storing fails nothing is recorded; if recording fails the stored objects are deleted.
 */
export async function uploadPhoto(
  viewer: Viewer,
  brewDayId: string,
  bytes: Uint8Array,
  caption: string,
): Promise<{ id: string }> {
  const { day } = await loadOwnBrewDay(viewer, brewDayId, 'add photos to');
  checkQuota(await usage(db, viewer.id, day.id), 0);
  const processed = await processPhoto(bytes);
  const stem = `brew-days/${day.id}/${crypto.randomUUID()}`;
  const keys = { display: `${stem}-display.jpg`, thumb: `${stem}-thumb.jpg` };
  const storedBytes = processed.display.length + processed.thumb.length;
  try {
    await Promise.all([
      putObject(keys.display, processed.display, 'image/jpeg'),
      putObject(keys.thumb, processed.thumb, 'image/jpeg'),
    ]);
  } catch (err) {
    await deleteObjects([keys.display, keys.thumb]).catch(() => {});
    console.error('[photos] store failed:', (err as Error).message);
    throw new AppError(
      'unavailable',
      'photo',
      'The photo store is briefly unavailable; nothing was saved. Please try again.',
    );
  }
  try {
    return await db.transaction(async (tx) => {
      // The member's row lock makes concurrent uploads take turns over the quota.
      await tx.select({ id: users.id }).from(users).where(eq(users.id, viewer.id)).for('update');
      checkQuota(await usage(tx, viewer.id, day.id), storedBytes);
      const [row] = await tx
        .insert(photos)
        .values({
          brewDayId: day.id,
          uploaderId: viewer.id,
          displayKey: keys.display,
          thumbKey: keys.thumb,
          caption,
          width: processed.width,
          height: processed.height,
          storedBytes,
        })
        .returning({ id: photos.id });
      return row;
    });
  } catch (err) {
    await deleteObjects([keys.display, keys.thumb]).catch((e: Error) =>
      console.error('[photos] could not remove objects after a failed insert:', e.message),
    );
    throw err;
  }
}

/** The JPEG bytes of one size of a photo, if the viewer may see its brew day (404 otherwise). */
export async function getPhotoBytes(
  viewer: Pick<Viewer, 'id' | 'role'> | null,
  photoId: string,
  size: 'display' | 'thumb',
): Promise<Buffer> {
  requireId(photoId, 'photo');
  const [photo] = await db
    .select()
    .from(photos)
    .where(and(eq(photos.id, photoId), photoVisibleTo(viewer)));
  if (!photo) throw new AppError('not_found', 'photo');
  await loadVisibleBrewDay(viewer, photo.brewDayId).catch(() => {
    throw new AppError('not_found', 'photo');
  });
  const bytes = await getObject(size === 'display' ? photo.displayKey : photo.thumbKey);
  if (!bytes) throw new AppError('not_found', 'photo');
  return bytes;
}

/** The brewer or a moderator deletes a photo: its row and both stored objects. */
export async function deletePhoto(viewer: Viewer, photoId: string, reason = ''): Promise<void> {
  requireId(photoId, 'photo');
  const [photo] = await db.select().from(photos).where(eq(photos.id, photoId));
  if (!photo) throw new AppError('not_found', 'photo');
  const { day } = await loadVisibleBrewDay(viewer, photo.brewDayId).catch(() => {
    throw new AppError('not_found', 'photo');
  });
  const isBrewer = day.brewerId === viewer.id;
  if (!isBrewer && !hasRole(viewer, 'moderator'))
    throw new AppError('forbidden', 'photo', 'Only the brewer or a moderator can delete this photo.');
  await db.transaction(async (tx) => {
    await tx.delete(photos).where(and(eq(photos.id, photo.id), eq(photos.brewDayId, day.id)));
    if (!isBrewer) {
      await tx.insert(moderationActions).values({
        actorId: viewer.id,
        action: 'delete_photo',
        targetType: 'photo',
        targetId: photo.id,
        reason,
        details: { brewDayId: day.id, uploaderId: photo.uploaderId },
      });
    }
    // Inside the transaction: if the store refuses, the row stays and the photo still shows.
    await deleteObjects([photo.displayKey, photo.thumbKey]);
  });
}
