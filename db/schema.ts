import { relations, sql } from 'drizzle-orm';
import {
  bigint,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  real,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  varchar,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';
import type { RecipeDocument } from '@/lib/brewing/schema';
import type { RecipeStats } from '@/lib/brewing/stats';
import type { BrewhouseInput } from '@/lib/community/brewhouse-schema';

export const userRole = pgEnum('user_role', ['member', 'moderator', 'admin']);
export const unitSystem = pgEnum('unit_system', ['metric', 'us']);
export const recipeVisibility = pgEnum('recipe_visibility', ['public', 'unlisted', 'private']);

// Users carry next-auth's columns (id, name, email, emailVerified, image) plus our own.
export const users = pgTable(
  'users',
  {
    id: text('id')
      .primaryKey()
      .$defaultFn(() => crypto.randomUUID()),
    name: text('name'),
    email: text('email').notNull(),
    emailVerified: timestamp('email_verified', { mode: 'date', withTimezone: true }),
    image: text('image'),
    handle: varchar('handle', { length: 40 }).notNull(),
    passwordHash: text('password_hash'),
    role: userRole('role').notNull().default('member'),
    units: unitSystem('units').notNull().default('metric'),
    bio: text('bio').notNull().default(''),
    defaultBatchVolumeL: real('default_batch_volume_l').notNull().default(20),
    defaultEfficiencyPct: real('default_efficiency_pct').notNull().default(72),
    /** Losses and the member's water report (lib/community/brewhouse-schema.ts); null until first saved. */
    brewhouse: jsonb('brewhouse').$type<BrewhouseInput>(),
    suspendedAt: timestamp('suspended_at', { withTimezone: true }),
    suspendedReason: text('suspended_reason'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_key').on(sql`lower(${t.email})`), uniqueIndex('users_handle_key').on(t.handle)],
);
export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;

// next-auth: linked sign-in methods (the e-mail provider records one row per address).
export const accounts = pgTable(
  'accounts',
  {
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    type: text('type').notNull(),
    provider: text('provider').notNull(),
    providerAccountId: text('provider_account_id').notNull(),
    refresh_token: text('refresh_token'),
    access_token: text('access_token'),
    expires_at: integer('expires_at'),
    token_type: text('token_type'),
    scope: text('scope'),
    id_token: text('id_token'),
    session_state: text('session_state'),
  },
  (t) => [primaryKey({ columns: [t.provider, t.providerAccountId] })],
);
export type Account = typeof accounts.$inferSelect;

// Server-side record of every signed-in session; the session cookie only names a row here,
// so signing out (or a suspension) ends the session on the server.
export const sessions = pgTable(
  'sessions',
  {
    sessionToken: text('session_token').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
  },
  (t) => [index('sessions_user_idx').on(t.userId)],
);
export type Session = typeof sessions.$inferSelect;

// next-auth: single-use magic-link tokens (stored hashed by next-auth).
export const verificationTokens = pgTable(
  'verification_tokens',
  {
    identifier: text('identifier').notNull(),
    token: text('token').notNull(),
    expires: timestamp('expires', { mode: 'date', withTimezone: true }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);
export type VerificationToken = typeof verificationTokens.$inferSelect;

// Counters for rate-limiter-flexible's PostgreSQL store (its documented table shape).
export const rateLimits = pgTable('rate_limits', {
  key: varchar('key', { length: 255 }).primaryKey(),
  points: integer('points').notNull().default(0),
  expire: bigint('expire', { mode: 'number' }),
});

export const recipes = pgTable(
  'recipes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    slug: varchar('slug', { length: 160 }).notNull(),
    ownerId: text('owner_id')
      .notNull()
      .references(() => users.id),
    title: text('title').notNull(),
    visibility: recipeVisibility('visibility').notNull().default('public'),
    hiddenAt: timestamp('hidden_at', { withTimezone: true }),
    hiddenReason: text('hidden_reason'),
    forkedFromVersionId: uuid('forked_from_version_id').references((): AnyPgColumn => recipeVersions.id),
    headVersionId: uuid('head_version_id').references((): AnyPgColumn => recipeVersions.id),
    headNumber: integer('head_number').notNull().default(0),
    starCount: integer('star_count').notNull().default(0),
    forkCount: integer('fork_count').notNull().default(0),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('recipes_slug_key').on(t.slug),
    index('recipes_owner_idx').on(t.ownerId),
    index('recipes_forked_from_idx').on(t.forkedFromVersionId),
    index('recipes_updated_idx').on(t.updatedAt),
  ],
);
export type Recipe = typeof recipes.$inferSelect;
export type NewRecipe = typeof recipes.$inferInsert;

// Immutable: the application only ever inserts here.
export const recipeVersions = pgTable(
  'recipe_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    recipeId: uuid('recipe_id')
      .notNull()
      .references(() => recipes.id),
    number: integer('number').notNull(),
    parentVersionId: uuid('parent_version_id').references((): AnyPgColumn => recipeVersions.id),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    coAuthorId: text('co_author_id').references(() => users.id),
    message: text('message').notNull().default(''),
    document: jsonb('document').$type<RecipeDocument>().notNull(),
    stats: jsonb('stats').$type<RecipeStats>().notNull(),
    og: real('og').notNull(),
    fg: real('fg').notNull(),
    abv: real('abv').notNull(),
    ibu: real('ibu').notNull(),
    srm: real('srm').notNull(),
    styleCode: varchar('style_code', { length: 8 }),
    engineVersion: varchar('engine_version', { length: 20 }).notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('recipe_versions_recipe_number_key').on(t.recipeId, t.number),
    index('recipe_versions_parent_idx').on(t.parentVersionId),
    index('recipe_versions_style_idx').on(t.styleCode),
    index('recipe_versions_abv_idx').on(t.abv),
  ],
);
export type RecipeVersion = typeof recipeVersions.$inferSelect;
export type NewRecipeVersion = typeof recipeVersions.$inferInsert;

export const usersRelations = relations(users, ({ many }) => ({
  recipes: many(recipes),
  sessions: many(sessions),
}));

export const recipesRelations = relations(recipes, ({ one, many }) => ({
  owner: one(users, { fields: [recipes.ownerId], references: [users.id] }),
  versions: many(recipeVersions),
  head: one(recipeVersions, { fields: [recipes.headVersionId], references: [recipeVersions.id], relationName: 'head' }),
  forkedFrom: one(recipeVersions, {
    fields: [recipes.forkedFromVersionId],
    references: [recipeVersions.id],
    relationName: 'forkedFrom',
  }),
}));

export const recipeVersionsRelations = relations(recipeVersions, ({ one }) => ({
  recipe: one(recipes, { fields: [recipeVersions.recipeId], references: [recipes.id] }),
  author: one(users, { fields: [recipeVersions.authorId], references: [users.id] }),
  parent: one(recipeVersions, { fields: [recipeVersions.parentVersionId], references: [recipeVersions.id] }),
}));

export const sessionsRelations = relations(sessions, ({ one }) => ({
  user: one(users, { fields: [sessions.userId], references: [users.id] }),
}));

// Append-only audit log of every moderator and admin action.
export const moderationActions = pgTable(
  'moderation_actions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    actorId: text('actor_id')
      .notNull()
      .references(() => users.id),
    action: varchar('action', { length: 40 }).notNull(),
    targetType: varchar('target_type', { length: 20 }).notNull(),
    targetId: text('target_id').notNull(),
    reason: text('reason').notNull().default(''),
    details: jsonb('details').notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('moderation_actions_created_idx').on(t.createdAt),
    index('moderation_actions_target_idx').on(t.targetType, t.targetId),
  ],
);
export type ModerationAction = typeof moderationActions.$inferSelect;

// Recipes whose search document must be rewritten. Inserted in the same transaction as the
// change, removed once the search index has taken it, so an outage loses nothing.
export const searchOutbox = pgTable(
  'search_outbox',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    recipeId: uuid('recipe_id').notNull(),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('search_outbox_recipe_idx').on(t.recipeId)],
);
export type SearchOutboxEntry = typeof searchOutbox.$inferSelect;
export * from './tables/brew-days';
export * from './tables/community';
export * from './tables/proposals';
