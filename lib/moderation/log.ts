import 'server-only';
import { and, desc, eq } from 'drizzle-orm';
import { db } from '@/db';
import { moderationActions, users } from '@/db/schema';
import type { ActionLogQuery } from './schemas';

export interface LoggedAction {
  id: string;
  action: string;
  targetType: string;
  targetId: string;
  reason: string;
  details: unknown;
  createdAt: Date;
  actorName: string;
  actorHandle: string;
}

const PAGE_SIZE = 100;

/** The moderation log, newest first, filtered by action, actor handle or target type. */
export async function listModerationActions(
  query: ActionLogQuery,
): Promise<{ actions: LoggedAction[]; hasMore: boolean }> {
  const rows = await db
    .select({
      id: moderationActions.id,
      action: moderationActions.action,
      targetType: moderationActions.targetType,
      targetId: moderationActions.targetId,
      reason: moderationActions.reason,
      details: moderationActions.details,
      createdAt: moderationActions.createdAt,
      actorName: users.name,
      actorHandle: users.handle,
    })
    .from(moderationActions)
    .innerJoin(users, eq(users.id, moderationActions.actorId))
    .where(
      and(
        query.action ? eq(moderationActions.action, query.action) : undefined,
        query.actor ? eq(users.handle, query.actor) : undefined,
        query.targetType ? eq(moderationActions.targetType, query.targetType) : undefined,
      ),
    )
    .orderBy(desc(moderationActions.createdAt))
    .limit(PAGE_SIZE + 1)
    .offset((query.page - 1) * PAGE_SIZE);
  return {
    actions: rows.slice(0, PAGE_SIZE).map((r) => ({ ...r, actorName: r.actorName ?? r.actorHandle })),
    hasMore: rows.length > PAGE_SIZE,
  };
}

/** Actions that appear in the log, for the filter's choices. */
export const LOGGED_ACTIONS = [
  'hide_recipe',
  'hide_comment',
  'hide_photo',
  'unhide_recipe',
  'unhide_comment',
  'unhide_photo',
  'dismiss_reports',
  'approve_comment',
  'delete_comment',
  'suspend_user',
  'reinstate_user',
  'change_role',
] as const;
