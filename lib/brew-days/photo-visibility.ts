import { notExists, or, eq, sql, type SQL } from 'drizzle-orm';
import { db } from '@/db';
import { hiddenPhotos, photos } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';

/**
 * Which photos a viewer may see: a photo moderators hid is left out for everyone but the member
 * who uploaded it and the moderators. Undefined means no restriction.
 */
export function photoVisibleTo(viewer: Pick<Viewer, 'id' | 'role'> | null): SQL | undefined {
  if (viewer && hasRole(viewer, 'moderator')) return undefined;
  const notHidden = notExists(
    db
      .select({ one: sql`1` })
      .from(hiddenPhotos)
      .where(eq(hiddenPhotos.photoId, photos.id)),
  );
  return viewer ? or(eq(photos.uploaderId, viewer.id), notHidden) : notHidden;
}
