import 'server-only';
import { and, asc, eq, inArray, isNull, or } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { comments, recipeVersions, recipes, reports, users, type Report } from '@/db/schema';
import { setSuspended } from '@/lib/auth/accounts';
import type { Viewer } from '@/lib/auth/session';
import { announceComment } from '@/lib/community/comments';
import { AppError } from '@/lib/errors';
import { consumeOrThrow, REPORT_PER_MEMBER } from '@/lib/rate-limit';
import { afterRecipeCommit } from '@/lib/recipes/events';
import { hideTarget, log, resolveTarget, unhideTarget } from './targets';
import type { ReportInput, ResolveReportInput } from './schemas';
import type { ReportReason, ReportTarget } from './words';
import { uniqueViolation } from '@/lib/db-errors';
import { requireId } from '@/lib/validation/ids';
import { suspensionRefusal } from '@/lib/auth/roles';

/** A member reports something they can see; one open report per member and target. */
export async function createReport(viewer: Viewer, input: ReportInput): Promise<{ id: string }> {
  const target = await resolveTarget(viewer, input.targetType, input.targetId);
  if (target.ownerId === viewer.id) {
    throw new AppError('bad_request', 'report', 'You cannot report your own content or yourself.', [
      { path: 'targetId', message: 'You cannot report your own content or yourself.' },
    ]);
  }
  await consumeOrThrow(REPORT_PER_MEMBER, viewer.id);
  try {
    const [row] = await db
      .insert(reports)
      .values({
        reporterId: viewer.id,
        targetType: input.targetType,
        targetId: input.targetId,
        targetOwnerId: target.ownerId,
        recipeId: target.recipeId,
        reason: input.reason,
        note: input.note,
      })
      .returning({ id: reports.id });
    return row;
  } catch (err) {
    if (uniqueViolation(err)) {
      throw new AppError('conflict', 'report', 'You have already reported this; a moderator will look at it soon.');
    }
    throw err;
  }
}

interface QueueReport {
  id: string;
  reporterName: string;
  reporterHandle: string;
  reason: ReportReason;
  note: string;
  createdAt: Date;
}

export interface QueueItem {
  targetType: ReportTarget;
  targetId: string;
  owner: { id: string; name: string; handle: string; role: Viewer['role']; suspended: boolean } | null;
  recipe: {
    id: string;
    title: string;
    slug: string;
    hidden: boolean;
    hiddenReason: string | null;
    notes: string;
  } | null;
  /** The reported comment, for a comment report. */
  comment: { body: string; state: 'published' | 'held' | 'hidden' | 'deleted' } | null;
  /** The reported member's bio, for a member report. */
  bio: string | null;
  reports: QueueReport[];
}

const reporters = alias(users, 'reporter');
const owners = alias(users, 'owner');

/** Open reports grouped by what they point at, oldest first, with the content in context. */
export async function listOpenReports(): Promise<QueueItem[]> {
  const rows = await db
    .select({
      report: reports,
      reporterName: reporters.name,
      reporterHandle: reporters.handle,
      owner: {
        id: owners.id,
        name: owners.name,
        handle: owners.handle,
        role: owners.role,
        suspendedAt: owners.suspendedAt,
        bio: owners.bio,
      },
      recipe: {
        id: recipes.id,
        title: recipes.title,
        slug: recipes.slug,
        hiddenAt: recipes.hiddenAt,
        hiddenReason: recipes.hiddenReason,
      },
      notes: recipeVersions.document,
    })
    .from(reports)
    .innerJoin(reporters, eq(reporters.id, reports.reporterId))
    .leftJoin(owners, eq(owners.id, reports.targetOwnerId))
    .leftJoin(recipes, eq(recipes.id, reports.recipeId))
    .leftJoin(recipeVersions, eq(recipeVersions.id, recipes.headVersionId))
    .where(eq(reports.status, 'open'))
    .orderBy(asc(reports.createdAt))
    .limit(500);
  const commentIds = rows.filter((r) => r.report.targetType === 'comment').map((r) => r.report.targetId);
  const commentRows = commentIds.length ? await db.select().from(comments).where(inArray(comments.id, commentIds)) : [];
  const commentsById = new Map(commentRows.map((c) => [c.id, c]));
  const groups = new Map<string, QueueItem>();
  for (const r of rows) {
    const key = `${r.report.targetType}:${r.report.targetId}`;
    let item = groups.get(key);
    if (!item) {
      const c = r.report.targetType === 'comment' ? commentsById.get(r.report.targetId) : undefined;
      item = {
        targetType: r.report.targetType,
        targetId: r.report.targetId,
        owner: r.owner
          ? {
              id: r.owner.id,
              name: r.owner.name ?? r.owner.handle,
              handle: r.owner.handle,
              role: r.owner.role,
              suspended: Boolean(r.owner.suspendedAt),
            }
          : null,
        recipe: r.recipe
          ? {
              id: r.recipe.id,
              title: r.recipe.title,
              slug: r.recipe.slug,
              hidden: Boolean(r.recipe.hiddenAt),
              hiddenReason: r.recipe.hiddenReason,
              notes: String((r.notes as { notes?: unknown } | null)?.notes ?? '').slice(0, 1_000),
            }
          : null,
        comment: c ? { body: c.body, state: c.deletedAt ? 'deleted' : c.hiddenAt ? 'hidden' : c.status } : null,
        bio: r.report.targetType === 'member' ? (r.owner?.bio ?? '') : null,
        reports: [],
      };
      groups.set(key, item);
    }
    item.reports.push({
      id: r.report.id,
      reporterName: r.reporterName ?? r.reporterHandle,
      reporterHandle: r.reporterHandle,
      reason: r.report.reason,
      note: r.report.note,
      createdAt: r.report.createdAt,
    });
  }
  return [...groups.values()];
}

const STATUS_WORDS: Record<Report['status'], string> = {
  open: 'still open',
  hidden: 'the content was hidden',
  dismissed: 'the report was dismissed',
  suspended: 'the member was suspended',
};

/**
 * A moderator handles a report: hide the content, dismiss the report, or suspend its owner
 * (which hides the reported content too). Every open report on the same target is settled with
 * it. The reports are locked first, so a second moderator acting at the same moment is told
 * who got there first instead of acting twice.
 */
export async function resolveReport(
  actor: Viewer,
  reportId: string,
  input: ResolveReportInput,
): Promise<{ status: Report['status']; settled: number }> {
  requireId(reportId, 'report');
  const [first] = await db.select().from(reports).where(eq(reports.id, reportId));
  if (!first) throw new AppError('not_found', 'report');
  if (input.action === 'suspend') await checkSuspendable(actor, first.targetOwnerId);
  let recipeChanged = false;
  const result = await db.transaction(async (tx) => {
    // Locked in id order, so moderators settling different reports on one target cannot deadlock.
    const locked = await tx
      .select()
      .from(reports)
      .where(
        and(
          eq(reports.targetType, first.targetType),
          eq(reports.targetId, first.targetId),
          or(eq(reports.status, 'open'), eq(reports.id, reportId)),
        ),
      )
      .orderBy(asc(reports.id))
      .for('update');
    const report = locked.find((r) => r.id === reportId)!;
    if (report.status !== 'open') {
      const [by] = report.resolvedById
        ? await tx
            .select({ name: users.name, handle: users.handle })
            .from(users)
            .where(eq(users.id, report.resolvedById))
        : [];
      throw new AppError(
        'conflict',
        'report',
        `This report was already handled${by ? ` by ${by.name ?? by.handle}` : ''}: ${STATUS_WORDS[report.status]}. Nothing more was done.`,
      );
    }
    const open = locked.filter((r) => r.status === 'open');
    const details = { reportIds: open.map((r) => r.id) };
    const target = { type: report.targetType, id: report.targetId, recipeId: report.recipeId };
    let status: Report['status'] = 'dismissed';
    if (input.action === 'dismiss') {
      await log(tx, actor, 'dismiss_reports', report.targetType, report.targetId, input.reason, details);
    } else {
      if (input.action === 'hide' || report.targetType !== 'member')
        recipeChanged = (await hideTarget(tx, actor, target, input.reason, details)).recipeChanged;
      status = 'hidden';
      if (input.action === 'suspend') {
        // setSuspended writes its own log entry and ends the member's sessions.
        await setSuspended(actor, report.targetOwnerId!, true, input.reason);
        status = 'suspended';
      }
    }
    await tx
      .update(reports)
      .set({ status, resolvedById: actor.id, resolvedAt: new Date(), resolution: input.reason })
      .where(
        inArray(
          reports.id,
          open.map((r) => r.id),
        ),
      );
    return { status, settled: open.length };
  });
  if (recipeChanged) afterRecipeCommit();
  return result;
}

async function checkSuspendable(actor: Viewer, ownerId: string | null): Promise<void> {
  if (!ownerId) throw new AppError('bad_request', 'report', 'This report names nobody who could be suspended.');
  const [owner] = await db.select({ role: users.role }).from(users).where(eq(users.id, ownerId));
  if (!owner) throw new AppError('not_found', 'member');
  const refusal = suspensionRefusal(actor, { id: ownerId, role: owner.role });
  if (refusal) throw new AppError('forbidden', 'member', refusal);
}

export interface HeldComment {
  id: string;
  body: string;
  createdAt: Date;
  author: { id: string; name: string; handle: string; joinedAt: Date };
  recipe: { title: string; slug: string };
}

/** Comments waiting for review under the new-member link rule, oldest first. */
export async function listHeldComments(): Promise<HeldComment[]> {
  const rows = await db
    .select({
      comment: comments,
      authorName: users.name,
      authorHandle: users.handle,
      joinedAt: users.createdAt,
      title: recipes.title,
      slug: recipes.slug,
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .innerJoin(recipes, eq(recipes.id, comments.recipeId))
    .where(and(eq(comments.status, 'held'), isNull(comments.deletedAt), isNull(comments.hiddenAt)))
    .orderBy(asc(comments.createdAt))
    .limit(200);
  return rows.map((r) => ({
    id: r.comment.id,
    body: r.comment.body,
    createdAt: r.comment.createdAt,
    author: {
      id: r.comment.authorId,
      name: r.authorName ?? r.authorHandle,
      handle: r.authorHandle,
      joinedAt: r.joinedAt,
    },
    recipe: { title: r.title, slug: r.slug },
  }));
}

/** A moderator publishes a held comment (its notifications go out now) or hides it with a reason. */
export async function reviewHeldComment(
  actor: Viewer,
  commentId: string,
  input: { action: 'approve' | 'hide'; reason: string },
): Promise<{ state: 'published' | 'hidden' }> {
  requireId(commentId, 'comment');
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ comment: comments, recipe: recipes })
      .from(comments)
      .innerJoin(recipes, eq(recipes.id, comments.recipeId))
      .where(eq(comments.id, commentId))
      .for('update', { of: comments });
    if (!row) throw new AppError('not_found', 'comment');
    const c = row.comment;
    if (c.status !== 'held' || c.hiddenAt || c.deletedAt)
      throw new AppError(
        'conflict',
        'comment',
        'This comment was already reviewed (or removed by its author). Nothing more was done.',
      );
    if (input.action === 'hide') {
      await hideTarget(tx, actor, { type: 'comment', id: c.id, recipeId: c.recipeId }, input.reason, { held: true });
      return { state: 'hidden' as const };
    }
    await tx.update(comments).set({ status: 'published', approvedById: actor.id }).where(eq(comments.id, c.id));
    const [parent] = c.parentId
      ? await tx.select({ authorId: comments.authorId }).from(comments).where(eq(comments.id, c.parentId))
      : [];
    await announceComment(tx, c, row.recipe, parent?.authorId ?? null);
    await log(tx, actor, 'approve_comment', 'comment', c.id, input.reason, { recipeId: c.recipeId });
    return { state: 'published' as const };
  });
}

/** A moderator undoes a hide. */
export async function restoreHidden(
  actor: Viewer,
  input: { targetType: 'recipe' | 'comment' | 'photo'; targetId: string; reason: string },
): Promise<void> {
  const { recipeChanged } = await db.transaction((tx) =>
    unhideTarget(tx, actor, input.targetType, input.targetId, input.reason),
  );
  if (recipeChanged) afterRecipeCommit();
}
