import { sql } from 'drizzle-orm';
import { index, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { recipeVersions, recipes, users } from '../schema';

// Proposals: a fork's version offered back to a recipe it descends from, with a discussion.

export const PROPOSAL_STATUSES = ['open', 'accepted', 'declined', 'changes_requested', 'withdrawn'] as const;
export const proposalStatus = pgEnum('proposal_status', PROPOSAL_STATUSES);

export const proposals = pgTable(
  'proposals',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** The recipe the change is offered to (an ancestor of the fork). */
    sourceRecipeId: uuid('source_recipe_id')
      .notNull()
      .references(() => recipes.id),
    /** The fork the proposed version belongs to. */
    forkRecipeId: uuid('fork_recipe_id')
      .notNull()
      .references(() => recipes.id),
    proposerId: text('proposer_id')
      .notNull()
      .references(() => users.id),
    proposedVersionId: uuid('proposed_version_id')
      .notNull()
      .references(() => recipeVersions.id),
    /** The source's version the fork came from: the common ancestor of the three-way merge. */
    baseVersionId: uuid('base_version_id')
      .notNull()
      .references(() => recipeVersions.id),
    status: proposalStatus('status').notNull().default('open'),
    title: text('title').notNull(),
    description: text('description').notNull().default(''),
    /** What the source's owner said when declining or asking for changes. */
    decisionComment: text('decision_comment').notNull().default(''),
    decidedById: text('decided_by_id').references(() => users.id),
    decidedAt: timestamp('decided_at', { withTimezone: true }),
    /** The source's new version written on acceptance. */
    acceptedVersionId: uuid('accepted_version_id').references(() => recipeVersions.id),
    hiddenAt: timestamp('hidden_at', { withTimezone: true }),
    hiddenReason: text('hidden_reason'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('proposals_source_idx').on(t.sourceRecipeId, t.createdAt),
    index('proposals_fork_idx').on(t.forkRecipeId, t.createdAt),
    index('proposals_proposer_idx').on(t.proposerId, t.createdAt),
    // One live proposal per fork and source: a newer version updates it instead.
    uniqueIndex('proposals_one_live_key')
      .on(t.forkRecipeId, t.sourceRecipeId)
      .where(sql`${t.status} in ('open', 'changes_requested')`),
  ],
);
export type Proposal = typeof proposals.$inferSelect;
export type ProposalStatus = (typeof PROPOSAL_STATUSES)[number];

/** The discussion under a proposal, oldest first. */
export const proposalComments = pgTable(
  'proposal_comments',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    proposalId: uuid('proposal_id')
      .notNull()
      .references(() => proposals.id),
    authorId: text('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('proposal_comments_proposal_idx').on(t.proposalId, t.createdAt)],
);
export type ProposalComment = typeof proposalComments.$inferSelect;
