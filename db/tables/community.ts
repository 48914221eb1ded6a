import { sql } from 'drizzle-orm';
import {
  bigint,
  boolean,
  check,
  index,
  integer,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import { REPORT_REASONS, REPORT_TARGETS } from '../../lib/moderation/words';
import { NOTIFICATION_KINDS } from '../../lib/notifications/kinds';
import { photos, recipes, users } from '../schema';

// Community: comments, stars, follows, notifications (with their e-mail queue) and reports.

export const notificationKind = pgEnum('notification_kind', NOTIFICATION_KINDS);
export const commentStatus = pgEnum('comment_status', ['published', 'held']);
export const reportTarget = pgEnum('report_target', REPORT_TARGETS);
export const reportReason = pgEnum('report_reason', REPORT_REASONS);
export const reportStatus = pgEnum('report_status', ['open', 'hidden', 'dismissed', 'suspended']);

/** Comments on a recipe; a reply names a top-level comment (replies go one level deep). */
export const comments = pgTable(
  'comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    recipeId: uuid('recipe_id')
      .notNull()
      .references(() => recipes.id),
    /** The version the author was reading when they wrote it. */
    versionNumber: integer('version_number'),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    parentId: uuid('parent_id').references((): AnyPgColumn => comments.id),
    body: text('body').notNull(),
    /** `held`: waiting for a moderator (see lib/community/hold-rule.ts); only its author and moderators see it. */
    status: commentStatus('status').notNull().default('published'),
    hasLink: boolean('has_link').notNull().default(false),
    approvedById: text('approved_by_id').references(() => users.id),
    hiddenAt: timestamp('hidden_at', { withTimezone: true }),
    hiddenReason: text('hidden_reason'),
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
    editedAt: timestamp('edited_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('comments_recipe_idx').on(t.recipeId, t.createdAt),
    index('comments_author_idx').on(t.authorId, t.createdAt),
    index('comments_parent_idx').on(t.parentId),
    index('comments_held_idx')
      .on(t.createdAt)
      .where(sql`${t.status} = 'held' and ${t.deletedAt} is null`),
  ],
);
export type Comment = typeof comments.$inferSelect;

export const stars = pgTable(
  'stars',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    recipeId: uuid('recipe_id')
      .notNull()
      .references(() => recipes.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.recipeId] }), index('stars_recipe_idx').on(t.recipeId)],
);
export type Star = typeof stars.$inferSelect;

export const memberFollows = pgTable(
  'member_follows',
  {
    followerId: text('follower_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    followeeId: text('followee_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    primaryKey({ columns: [t.followerId, t.followeeId] }),
    index('member_follows_followee_idx').on(t.followeeId),
    check('member_follows_not_self', sql`${t.followerId} <> ${t.followeeId}`),
  ],
);

export const recipeFollows = pgTable(
  'recipe_follows',
  {
    followerId: text('follower_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    recipeId: uuid('recipe_id')
      .notNull()
      .references(() => recipes.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.followerId, t.recipeId] }), index('recipe_follows_recipe_idx').on(t.recipeId)],
);

/** What a member is told in the site (the bell and /notifications). */
export const notifications = pgTable(
  'notifications',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: notificationKind('kind').notNull(),
    actorId: text('actor_id').references(() => users.id),
    recipeId: uuid('recipe_id').references(() => recipes.id),
    commentId: uuid('comment_id').references(() => comments.id),
    /** Our own path to open (`/recipes/slug#comment-…`). */
    url: text('url').notNull(),
    /** A short plain-text excerpt (a comment's first words, a brew-day note). */
    excerpt: text('excerpt').notNull().default(''),
    readAt: timestamp('read_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('notifications_user_idx').on(t.userId, t.createdAt),
    index('notifications_unread_idx')
      .on(t.userId)
      .where(sql`${t.readAt} is null`),
  ],
);
export type Notification = typeof notifications.$inferSelect;

/**
 * E-mails waiting to be sent, queued in the same transaction as the event. A row stays pending
 * (sent_at null) until the SMTP server took it; the sender gathers a member's pending rows into
 * one message at most every few minutes (lib/notifications/email.ts).
 */
export const notificationEmails = pgTable(
  'notification_emails',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    notificationId: uuid('notification_id')
      .notNull()
      .references(() => notifications.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: notificationKind('kind').notNull(),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    /** `sent`, or `skipped` when the member turned this kind off (or was suspended) before it went out. */
    outcome: varchar('outcome', { length: 10 }),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('notification_emails_pending_idx')
      .on(t.userId, t.createdAt)
      .where(sql`${t.sentAt} is null`),
    index('notification_emails_sent_idx').on(t.userId, t.sentAt),
  ],
);
export type NotificationEmail = typeof notificationEmails.$inferSelect;

/** A member's e-mail choice per kind; no row means e-mails of that kind are on. */
export const notificationPreferences = pgTable(
  'notification_preferences',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: notificationKind('kind').notNull(),
    email: boolean('email').notNull(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.kind] })],
);

/** A member's report of content or of another member, until a moderator handles it. */
export const reports = pgTable(
  'reports',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    reporterId: text('reporter_id')
      .notNull()
      .references(() => users.id),
    targetType: reportTarget('target_type').notNull(),
    targetId: text('target_id').notNull(),
    /** Whose content it is (the member, for a member report). */
    targetOwnerId: text('target_owner_id').references(() => users.id),
    /** The recipe the content belongs to, for context in the queue. */
    recipeId: uuid('recipe_id').references(() => recipes.id),
    reason: reportReason('reason').notNull(),
    note: text('note').notNull().default(''),
    status: reportStatus('status').notNull().default('open'),
    resolvedById: text('resolved_by_id').references(() => users.id),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    resolution: text('resolution').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('reports_open_idx')
      .on(t.createdAt)
      .where(sql`${t.status} = 'open'`),
    index('reports_target_idx').on(t.targetType, t.targetId),
    uniqueIndex('reports_one_open_per_reporter_key')
      .on(t.reporterId, t.targetType, t.targetId)
      .where(sql`${t.status} = 'open'`),
  ],
);
export type Report = typeof reports.$inferSelect;

/**
 * Photos a moderator hid (photos live in the brew-day tables; this keeps moderation in its own
 * table). Pages that list photos leave these out for everyone but the uploader and moderators.
 */
export const hiddenPhotos = pgTable('hidden_photos', {
  photoId: uuid('photo_id')
    .primaryKey()
    .references(() => photos.id),
  reason: text('reason').notNull(),
  hiddenById: text('hidden_by_id')
    .notNull()
    .references(() => users.id),
  hiddenAt: timestamp('hidden_at', { withTimezone: true }).notNull().defaultNow(),
});
