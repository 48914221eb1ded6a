import 'server-only';
import { and, count, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { notifications, recipes, users } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { canView } from '@/lib/recipes/access';
import { describeNotification, type NotificationKind } from './kinds';

export interface NotificationItem {
  id: string;
  kind: NotificationKind;
  text: string;
  excerpt: string;
  url: string;
  read: boolean;
  createdAt: Date;
}

const PAGE_SIZE = 50;
const actors = alias(users, 'actor');

/**
 * A member's notifications, newest first. A notice about a recipe they may no longer see (hidden
 * or made private since) is left out.
 */
export async function listNotifications(
  viewer: Pick<Viewer, 'id' | 'role'>,
  opts: { page?: number } = {},
): Promise<{ items: NotificationItem[]; hasMore: boolean }> {
  const page = opts.page ?? 1;
  const rows = await db
    .select({
      id: notifications.id,
      kind: notifications.kind,
      url: notifications.url,
      excerpt: notifications.excerpt,
      readAt: notifications.readAt,
      createdAt: notifications.createdAt,
      actorName: sql<string>`coalesce(${actors.name}, ${actors.handle}, 'Someone')`,
      recipe: {
        title: recipes.title,
        ownerId: recipes.ownerId,
        visibility: recipes.visibility,
        hiddenAt: recipes.hiddenAt,
      },
    })
    .from(notifications)
    .leftJoin(actors, eq(actors.id, notifications.actorId))
    .leftJoin(recipes, eq(recipes.id, notifications.recipeId))
    .where(eq(notifications.userId, viewer.id))
    .orderBy(desc(notifications.createdAt))
    .limit(PAGE_SIZE + 1)
    .offset((page - 1) * PAGE_SIZE);
  const items = rows
    .slice(0, PAGE_SIZE)
    .filter((r) => !r.recipe?.ownerId || canView(r.recipe as Parameters<typeof canView>[0], viewer))
    .map((r) => ({
      id: r.id,
      kind: r.kind,
      text: describeNotification(r.kind, r.actorName, r.recipe?.title ?? 'a recipe'),
      excerpt: r.excerpt,
      url: r.url,
      read: r.readAt !== null,
      createdAt: r.createdAt,
    }));
  return { items, hasMore: rows.length > PAGE_SIZE };
}

export async function countUnread(viewer: Pick<Viewer, 'id'>): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(notifications)
    .where(and(eq(notifications.userId, viewer.id), isNull(notifications.readAt)));
  return row.n;
}

/** Marks the given notifications (or all of them) read; only the member's own are touched. */
export async function markRead(viewer: Pick<Viewer, 'id'>, ids?: string[]): Promise<number> {
  const rows = await db
    .update(notifications)
    .set({ readAt: new Date() })
    .where(
      and(
        eq(notifications.userId, viewer.id),
        isNull(notifications.readAt),
        ids ? inArray(notifications.id, ids) : undefined,
      ),
    )
    .returning({ id: notifications.id });
  return rows.length;
}
