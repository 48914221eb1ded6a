import 'server-only';
import { and, asc, desc, eq, inArray, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db } from '@/db';
import { proposalComments, proposals, recipeVersions, recipes, users, type Proposal } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { getBrewDaysByRecipeId, type BrewDaySummary } from '@/lib/brew-days/brew-days';
import { canView, isOwner } from '@/lib/recipes/access';
import { compareDocuments, type DocumentComparison } from '@/lib/recipes/compare';
import { canViewProposal, isLive } from './access';
import {
  forks,
  forkVisibleToOwner,
  getAncestorsByRecipeId,
  loadProposal,
  versionDoc,
  type Ancestor,
  type MaybeViewer,
} from './loading';
import { mergeDocuments, type MergeConflict } from './merge';
import { describeConflict, describeTaken, type ConflictView } from './merge-words';

// What the proposal pages and lists read: the proposal page's whole view, the lists by recipe and
// by member, and the recipes a fork may propose to.

/** The ancestors a member may propose to from their fork: the ones they can see. */
export async function getProposalTargets(viewer: MaybeViewer, recipeId: string): Promise<Ancestor[]> {
  return (await getAncestorsByRecipeId(db, { recipeId })).filter((a) => canView(a.recipe, viewer));
}

/** The proposal's recipe ids and proposer, if the viewer may see it (for reports). */
export async function getVisibleProposal(
  viewer: MaybeViewer,
  id: string,
): Promise<{ proposerId: string; sourceRecipeId: string }> {
  const { proposal } = await loadProposal(db, viewer, id);
  return { proposerId: proposal.proposerId, sourceRecipeId: proposal.sourceRecipeId };
}

export interface ProposalSummary {
  id: string;
  title: string;
  status: Proposal['status'];
  hidden: boolean;
  createdAt: Date;
  updatedAt: Date;
  proposerName: string;
  proposerHandle: string;
  source: { title: string; slug: string };
  fork: { title: string; slug: string };
  /** `incoming`: offered to the recipe (or member) in question; `outgoing`: offered from it. */
  direction: 'incoming' | 'outgoing';
}

const proposers = alias(users, 'proposer');

async function summaries(
  viewer: MaybeViewer,
  where: ReturnType<typeof eq>,
  direction: (p: Proposal) => ProposalSummary['direction'],
): Promise<ProposalSummary[]> {
  const rows = await db
    .select({
      proposal: proposals,
      source: recipes,
      fork: forks,
      proposerName: proposers.name,
      proposerHandle: proposers.handle,
    })
    .from(proposals)
    .innerJoin(recipes, eq(recipes.id, proposals.sourceRecipeId))
    .innerJoin(forks, eq(forks.id, proposals.forkRecipeId))
    .innerJoin(proposers, eq(proposers.id, proposals.proposerId))
    .where(where)
    .orderBy(desc(proposals.updatedAt))
    .limit(200);
  return rows
    .filter((r) => canViewProposal(r.proposal, r.source, r.fork, viewer))
    .map((r) => ({
      id: r.proposal.id,
      title: r.proposal.title,
      status: r.proposal.status,
      hidden: Boolean(r.proposal.hiddenAt),
      createdAt: r.proposal.createdAt,
      updatedAt: r.proposal.updatedAt,
      proposerName: r.proposerName ?? r.proposerHandle,
      proposerHandle: r.proposerHandle,
      source: { title: r.source.title, slug: r.source.slug },
      fork: { title: r.fork.title, slug: r.fork.slug },
      direction: direction(r.proposal),
    }));
}

/** Proposals offered to a recipe and from it (as a fork), newest activity first. */
export async function getProposalsByRecipeId({
  viewer,
  recipeId,
}: {
  viewer: MaybeViewer;
  recipeId: string;
}): Promise<ProposalSummary[]> {
  return summaries(viewer, or(eq(proposals.sourceRecipeId, recipeId), eq(proposals.forkRecipeId, recipeId))!, (p) =>
    p.sourceRecipeId === recipeId ? 'incoming' : 'outgoing',
  );
}

/** The signed-in member's proposals: offered to their recipes, and offered by them. */
export async function getProposalsByMember(
  viewer: Viewer,
): Promise<{ incoming: ProposalSummary[]; outgoing: ProposalSummary[] }> {
  const rows = await summaries(viewer, or(eq(recipes.ownerId, viewer.id), eq(proposals.proposerId, viewer.id))!, (p) =>
    p.proposerId === viewer.id ? 'outgoing' : 'incoming',
  );
  return {
    incoming: rows.filter((r) => r.direction === 'incoming'),
    outgoing: rows.filter((r) => r.direction === 'outgoing'),
  };
}

interface ProposalCommentView {
  id: string;
  body: string;
  authorName: string;
  authorHandle: string;
  createdAt: Date;
}

export interface ProposalView {
  proposal: Pick<
    Proposal,
    | 'id'
    | 'title'
    | 'description'
    | 'status'
    | 'decisionComment'
    | 'createdAt'
    | 'updatedAt'
    | 'decidedAt'
    | 'hiddenReason'
  > & { hidden: boolean };
  proposer: { id: string; name: string; handle: string };
  source: { id: string; slug: string; title: string; ownerName: string; headVersionId: string; headNumber: number };
  fork: { id: string; slug: string; title: string; ownerName: string };
  base: { id: string; number: number };
  /** Null when the viewer can no longer see the fork. */
  proposed: { id: string; number: number; message: string } | null;
  accepted: { number: number } | null;
  /** The source's head has had versions since the fork: the three-way picture applies. */
  headMoved: boolean;
  /** The source's version the comparison starts from: the head while open, the fork's base once closed. */
  compareFrom: { id: string; number: number };
  comparison: DocumentComparison | null;
  conflicts: MergeConflict[];
  /** The conflicts labelled and in the viewer's units, for screens. */
  conflictViews: ConflictView[];
  fromTheirs: string[];
  /** The fields taken from the proposal without asking, in words. */
  fromTheirsWords: string[];
  brewDays: BrewDaySummary[];
  comments: ProposalCommentView[];
  /** Later versions of the fork the proposer may move the proposal to. */
  newerVersions: { id: string; number: number; message: string }[];
  can: { accept: boolean; decide: boolean; update: boolean; withdraw: boolean; comment: boolean; report: boolean };
  /** Why the owner cannot accept right now, when they cannot. */
  blocked: string | null;
}

/** Everything the proposal page shows, if the viewer may see the proposal (404 otherwise). */
export async function getProposalView(
  viewer: (NonNullable<MaybeViewer> & Pick<Viewer, 'units'>) | null,
  id: string,
): Promise<ProposalView> {
  const units = viewer?.units ?? 'metric';
  const { proposal, source, fork } = await loadProposal(db, viewer, id);
  const [people, headDoc, baseDoc, proposedDoc] = await Promise.all([
    db
      .select({ id: users.id, name: users.name, handle: users.handle })
      .from(users)
      .where(inArray(users.id, [proposal.proposerId, source.ownerId, fork.ownerId])),
    versionDoc(db, source.headVersionId!),
    versionDoc(db, proposal.baseVersionId),
    versionDoc(db, proposal.proposedVersionId),
  ]);
  const person = (pid: string) => {
    const p = people.find((x) => x.id === pid)!;
    return { id: p.id, name: p.name ?? p.handle, handle: p.handle };
  };
  const forkVisible = canView(fork, viewer);
  const ownerCanSeeFork = forkVisibleToOwner(fork, source.ownerId);
  const headMoved = source.headVersionId !== proposal.baseVersionId;
  const live = isLive(proposal);
  let comparison: DocumentComparison | null = null;
  let conflicts: MergeConflict[] = [];
  let fromTheirs: string[] = [];
  let taken: ReturnType<typeof mergeDocuments>['taken'] = [];
  // An open proposal is read against the source as it is now; a closed one as what it offered.
  const compareFrom = live ? headDoc : baseDoc;
  if (forkVisible) {
    // The fork's own name is not part of the proposal: compare under the source's title.
    comparison = compareDocuments(
      compareFrom.document,
      { ...proposedDoc.document, title: compareFrom.document.title },
      { units },
    );
    if (live && headMoved)
      ({ conflicts, fromTheirs, taken } = mergeDocuments(baseDoc.document, headDoc.document, proposedDoc.document));
  }
  const [commentRows, brewDays, newer, accepted] = await Promise.all([
    db
      .select({
        id: proposalComments.id,
        body: proposalComments.body,
        createdAt: proposalComments.createdAt,
        name: users.name,
        handle: users.handle,
      })
      .from(proposalComments)
      .innerJoin(users, eq(users.id, proposalComments.authorId))
      .where(eq(proposalComments.proposalId, proposal.id))
      .orderBy(asc(proposalComments.createdAt))
      .limit(500),
    forkVisible
      ? getBrewDaysByRecipeId({ recipeId: fork.id, viewer }).then((days) =>
          days.filter((d) => d.versionNumber === proposedDoc.number),
        )
      : Promise.resolve([]),
    viewer?.id === proposal.proposerId && live
      ? db
          .select({ id: recipeVersions.id, number: recipeVersions.number, message: recipeVersions.message })
          .from(recipeVersions)
          .where(and(eq(recipeVersions.recipeId, fork.id), sql`${recipeVersions.number} > ${proposedDoc.number}`))
          .orderBy(desc(recipeVersions.number))
      : Promise.resolve([]),
    proposal.acceptedVersionId
      ? db
          .select({ number: recipeVersions.number })
          .from(recipeVersions)
          .where(eq(recipeVersions.id, proposal.acceptedVersionId))
      : Promise.resolve([]),
  ]);
  const owner = isOwner(source, viewer);
  const proposer = viewer?.id === proposal.proposerId;
  const blocked = !live
    ? null
    : !ownerCanSeeFork
      ? 'The proposed version is no longer visible: its fork was made private or hidden by the moderators, so it cannot be accepted.'
      : null;
  return {
    proposal: {
      id: proposal.id,
      title: proposal.title,
      description: proposal.description,
      status: proposal.status,
      decisionComment: proposal.decisionComment,
      createdAt: proposal.createdAt,
      updatedAt: proposal.updatedAt,
      decidedAt: proposal.decidedAt,
      hidden: Boolean(proposal.hiddenAt),
      hiddenReason: proposal.hiddenAt ? proposal.hiddenReason : null,
    },
    proposer: person(proposal.proposerId),
    source: {
      id: source.id,
      slug: source.slug,
      title: source.title,
      ownerName: person(source.ownerId).name,
      headVersionId: source.headVersionId!,
      headNumber: source.headNumber,
    },
    fork: { id: fork.id, slug: fork.slug, title: fork.title, ownerName: person(fork.ownerId).name },
    base: { id: baseDoc.id, number: baseDoc.number },
    proposed: forkVisible ? { id: proposedDoc.id, number: proposedDoc.number, message: proposedDoc.message } : null,
    accepted: accepted[0] ?? null,
    headMoved,
    compareFrom: { id: compareFrom.id, number: compareFrom.number },
    comparison,
    conflicts,
    conflictViews: conflicts.map((c) => describeConflict(c, units)),
    fromTheirs,
    fromTheirsWords: taken.map((t) => describeTaken(t, units)),
    brewDays,
    comments: commentRows.map((c) => ({
      id: c.id,
      body: c.body,
      createdAt: c.createdAt,
      authorName: c.name ?? c.handle,
      authorHandle: c.handle,
    })),
    newerVersions: newer,
    can: {
      accept: owner && live && !blocked && !proposal.hiddenAt,
      decide: owner && live,
      update: proposer && live,
      withdraw: proposer && live,
      comment: Boolean(viewer),
      report: Boolean(viewer) && !proposer,
    },
    blocked: owner ? blocked : null,
  };
}
