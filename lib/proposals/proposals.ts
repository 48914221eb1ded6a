import 'server-only';
import { and, asc, desc, eq, inArray, or, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db, type Transaction } from '@/db';
import { proposalComments, proposals, recipeVersions, recipes, users, type Proposal, type Recipe } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { getBrewDaysByRecipeId, type BrewDaySummary } from '@/lib/brew-days/brew-days';
import { formatIssues, recipeDocumentSchema, type RecipeDocument, type RecipeStats } from '@/lib/brewing';
import { AppError } from '@/lib/errors';
import { notify } from '@/lib/notifications/notify';
import { COMMENT_PER_MEMBER, consumeOrThrow } from '@/lib/rate-limit';
import { canView, isOwner } from '@/lib/recipes/access';
import { compareDocuments, type DocumentComparison } from '@/lib/recipes/compare';
import { afterRecipeCommit } from '@/lib/recipes/events';
import { getVersionById, saveVersionInTransaction } from '@/lib/recipes/versions';
import { canViewProposal, isLive } from './access';
import { MergePickError, mergeDocuments, resolveMerge, type MergeConflict } from './merge';
import type { AcceptProposalInput, DecideProposalInput, OpenProposalInput, UpdateProposalInput } from './schemas';
import { uniqueViolation } from '@/lib/db-errors';
import { requireId } from '@/lib/validation/ids';

type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;
type Db = Transaction | typeof db;

const STATUS_WORDS: Record<Proposal['status'], string> = {
  open: 'open',
  accepted: 'accepted',
  declined: 'declined',
  changes_requested: 'waiting for changes',
  withdrawn: 'withdrawn',
};

export interface Ancestor {
  recipeId: string;
  slug: string;
  title: string;
  ownerId: string;
  ownerName: string;
  /** The ancestor's version this line of forks came from: the common ancestor of a merge. */
  baseVersionId: string;
  baseNumber: number;
  /** 1 for the recipe the fork came from directly, 2 for its source, and so on. */
  hops: number;
  recipe: Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>;
}

/** Every recipe a fork descends from (walking fork links upward), nearest first. */
async function getAncestorsByRecipeId(tx: Db, { recipeId }: { recipeId: string }): Promise<Ancestor[]> {
  const result = await tx.execute<{
    recipe_id: string;
    slug: string;
    title: string;
    owner_id: string;
    owner_name: string;
    visibility: Recipe['visibility'];
    hidden_at: Date | null;
    base_version_id: string;
    base_number: number;
    hops: number;
  }>(sql`
    with recursive up(ancestor_id, base_version_id, base_number, hops) as (
      select v.recipe_id, v.id, v.number, 1
      from recipes r join recipe_versions v on v.id = r.forked_from_version_id
      where r.id = ${recipeId}
      union all
      select v.recipe_id, v.id, v.number, u.hops + 1
      from up u
      join recipes r on r.id = u.ancestor_id
      join recipe_versions v on v.id = r.forked_from_version_id
      where u.hops < 100
    )
    select u.ancestor_id as recipe_id, r.slug, r.title, r.owner_id, coalesce(o.name, o.handle) as owner_name, r.visibility, r.hidden_at,
           u.base_version_id, u.base_number, u.hops
    from up u join recipes r on r.id = u.ancestor_id join users o on o.id = r.owner_id
    order by u.hops
  `);
  return result.rows.map((r) => ({
    recipeId: r.recipe_id,
    slug: r.slug,
    title: r.title,
    ownerId: r.owner_id,
    ownerName: r.owner_name,
    baseVersionId: r.base_version_id,
    baseNumber: r.base_number,
    hops: r.hops,
    recipe: { ownerId: r.owner_id, visibility: r.visibility, hiddenAt: r.hidden_at ? new Date(r.hidden_at) : null },
  }));
}

/** The ancestors a member may propose to from their fork: the ones they can see. */
export async function getProposalTargets(viewer: MaybeViewer, recipeId: string): Promise<Ancestor[]> {
  return (await getAncestorsByRecipeId(db, { recipeId })).filter((a) => canView(a.recipe, viewer));
}

/** A fork the source's owner can see: public or unlisted, and not hidden by moderators. */
function forkVisibleToOwner(fork: Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>, sourceOwnerId: string): boolean {
  return canView(fork, { id: sourceOwnerId, role: 'member' });
}

function forkNotVisibleError(): AppError {
  return new AppError(
    'conflict',
    'proposal',
    'The proposed version is no longer visible: its fork was made private or hidden by the moderators. Nothing was changed.',
  );
}

/** A fork's owner offers one of its versions to a recipe it descends from. */
export async function openProposal(viewer: Viewer, input: OpenProposalInput): Promise<{ id: string }> {
  const { recipe: fork, version } = await getVersionById(viewer, input.versionId);
  if (!isOwner(fork, viewer)) {
    throw new AppError('forbidden', 'version', 'You can propose only a version of your own fork.', [
      { path: 'versionId', message: 'You can propose only a version of your own fork.' },
    ]);
  }
  if (!fork.forkedFromVersionId) {
    throw new AppError(
      'bad_request',
      'recipe',
      `“${fork.title}” is not a fork, so there is no original to propose to.`,
      [{ path: 'versionId', message: 'This recipe is not a fork of another recipe.' }],
    );
  }
  const ancestors = await getAncestorsByRecipeId(db, { recipeId: fork.id });
  const target = input.sourceRecipeId ? ancestors.find((a) => a.recipeId === input.sourceRecipeId) : ancestors[0];
  if (input.sourceRecipeId && !target) {
    // A recipe the member cannot see at all is "not found", exactly as a missing one.
    const [other] = await db.select().from(recipes).where(eq(recipes.id, input.sourceRecipeId));
    if (!other || !canView(other, viewer)) throw new AppError('not_found', 'recipe');
    throw new AppError(
      'bad_request',
      'proposal',
      `“${other.title}” is not a recipe your fork descends from; you can propose only to an ancestor of your fork.`,
      [{ path: 'sourceRecipeId', message: 'Not an ancestor of your fork.' }],
    );
  }
  if (!target || !canView(target.recipe, viewer)) throw new AppError('not_found', 'recipe');
  if (!forkVisibleToOwner(fork, target.ownerId)) {
    const message = fork.hiddenAt
      ? 'Your fork is hidden by the moderators, so its owner could not see what you propose.'
      : 'Your fork is private, so the owner of the original could not see it. Make it public or unlisted first.';
    throw new AppError('bad_request', 'proposal', message, [{ path: 'versionId', message }]);
  }
  try {
    const id = await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(proposals)
        .values({
          sourceRecipeId: target.recipeId,
          forkRecipeId: fork.id,
          proposerId: viewer.id,
          proposedVersionId: version.id,
          baseVersionId: target.baseVersionId,
          title: input.title,
          description: input.description,
        })
        .returning({ id: proposals.id });
      await notify(tx, {
        userId: target.ownerId,
        kind: 'proposal',
        actorId: viewer.id,
        recipeId: target.recipeId,
        url: `/proposals/${row.id}`,
        excerpt: input.title,
      });
      return row.id;
    });
    return { id };
  } catch (err) {
    if (uniqueViolation(err)) {
      throw new AppError(
        'conflict',
        'proposal',
        `Your fork already has an open proposal to “${target.title}”. Update that one to a newer version instead.`,
      );
    }
    throw err;
  }
}

interface LoadedProposal {
  proposal: Proposal;
  source: Recipe;
  fork: Recipe;
}

const forks = alias(recipes, 'fork');

async function loadProposal(
  tx: Db,
  viewer: MaybeViewer,
  id: string,
  opts: { lock?: boolean } = {},
): Promise<LoadedProposal> {
  requireId(id, 'proposal');
  const query = tx
    .select({ proposal: proposals, source: recipes, fork: forks })
    .from(proposals)
    .innerJoin(recipes, eq(recipes.id, proposals.sourceRecipeId))
    .innerJoin(forks, eq(forks.id, proposals.forkRecipeId))
    .where(eq(proposals.id, id));
  const [row] = opts.lock ? await query.for('update', { of: proposals }) : await query;
  if (!row || !canViewProposal(row.proposal, row.source, row.fork, viewer)) throw new AppError('not_found', 'proposal');
  return row;
}

/** The proposal's recipe ids and proposer, if the viewer may see it (for reports). */
export async function getVisibleProposal(
  viewer: MaybeViewer,
  id: string,
): Promise<{ proposerId: string; sourceRecipeId: string }> {
  const { proposal } = await loadProposal(db, viewer, id);
  return { proposerId: proposal.proposerId, sourceRecipeId: proposal.sourceRecipeId };
}

function refuseUnlessLive(proposal: Proposal): void {
  if (isLive(proposal)) return;
  throw new AppError(
    'conflict',
    'proposal',
    `This proposal was already ${STATUS_WORDS[proposal.status]}. Nothing was changed.`,
  );
}

async function versionDoc(
  tx: Db,
  versionId: string,
): Promise<{
  id: string;
  number: number;
  recipeId: string;
  document: RecipeDocument;
  stats: RecipeStats;
  message: string;
}> {
  const [row] = await tx
    .select({
      id: recipeVersions.id,
      number: recipeVersions.number,
      recipeId: recipeVersions.recipeId,
      document: recipeVersions.document,
      stats: recipeVersions.stats,
      message: recipeVersions.message,
    })
    .from(recipeVersions)
    .where(eq(recipeVersions.id, versionId));
  // Documents written by an older engine are re-checked (and given today's defaults) on the way in.
  return { ...row, document: recipeDocumentSchema.parse(row.document), stats: row.stats as RecipeStats };
}

/** The proposer moves the proposal to a newer version of the fork, or rewords it; it is open again. */
export async function updateProposal(viewer: Viewer, id: string, input: UpdateProposalInput): Promise<{ id: string }> {
  await db.transaction(async (tx) => {
    const { proposal, source, fork } = await loadProposal(tx, viewer, id, { lock: true });
    if (proposal.proposerId !== viewer.id)
      throw new AppError('forbidden', 'proposal', 'Only the member who proposed this can change it.');
    refuseUnlessLive(proposal);
    let proposedVersionId = proposal.proposedVersionId;
    if (input.versionId && input.versionId !== proposal.proposedVersionId) {
      const [next] = await tx
        .select({ id: recipeVersions.id, number: recipeVersions.number, recipeId: recipeVersions.recipeId })
        .from(recipeVersions)
        .where(eq(recipeVersions.id, input.versionId));
      if (!next || next.recipeId !== fork.id) {
        throw new AppError('bad_request', 'proposal', `Choose a version of your fork “${fork.title}”.`, [
          { path: 'versionId', message: `Not a version of “${fork.title}”.` },
        ]);
      }
      const current = await versionDoc(tx, proposal.proposedVersionId);
      if (next.number <= current.number) {
        throw new AppError(
          'bad_request',
          'proposal',
          `Choose a version newer than version ${current.number}, the one proposed now.`,
          [{ path: 'versionId', message: `Not newer than version ${current.number}.` }],
        );
      }
      if (!forkVisibleToOwner(fork, source.ownerId)) throw forkNotVisibleError();
      proposedVersionId = next.id;
      await notify(tx, {
        userId: source.ownerId,
        kind: 'proposal',
        actorId: viewer.id,
        recipeId: source.id,
        url: `/proposals/${proposal.id}`,
        excerpt: `${input.title ?? proposal.title}: now proposing version ${next.number} of ${fork.title}`,
      });
    }
    await tx
      .update(proposals)
      .set({
        proposedVersionId,
        title: input.title ?? proposal.title,
        description: input.description ?? proposal.description,
        status: 'open',
        updatedAt: new Date(),
      })
      .where(eq(proposals.id, proposal.id));
  });
  return { id };
}

/** The proposer takes the proposal back. */
export async function withdrawProposal(viewer: Viewer, id: string): Promise<{ status: Proposal['status'] }> {
  return db.transaction(async (tx) => {
    const { proposal } = await loadProposal(tx, viewer, id, { lock: true });
    if (proposal.proposerId !== viewer.id)
      throw new AppError('forbidden', 'proposal', 'Only the member who proposed this can withdraw it.');
    refuseUnlessLive(proposal);
    await tx.update(proposals).set({ status: 'withdrawn', updatedAt: new Date() }).where(eq(proposals.id, proposal.id));
    return { status: 'withdrawn' as const };
  });
}

/** The source's owner declines or asks for changes, with a comment the proposer is sent. */
export async function decideProposal(
  viewer: Viewer,
  id: string,
  input: DecideProposalInput,
): Promise<{ status: Proposal['status'] }> {
  return db.transaction(async (tx) => {
    const { proposal, source } = await loadProposal(tx, viewer, id, { lock: true });
    if (!isOwner(source, viewer))
      throw new AppError('forbidden', 'proposal', `Only the owner of “${source.title}” can decide on this proposal.`);
    refuseUnlessLive(proposal);
    await tx
      .update(proposals)
      .set({
        status: input.decision,
        decisionComment: input.comment,
        decidedById: viewer.id,
        decidedAt: new Date(),
        updatedAt: new Date(),
      })
      .where(eq(proposals.id, proposal.id));
    await notify(tx, {
      userId: proposal.proposerId,
      kind: 'proposal_decision',
      actorId: viewer.id,
      recipeId: source.id,
      url: `/proposals/${proposal.id}`,
      excerpt: `${input.decision === 'declined' ? 'Declined' : 'Changes asked for'}: ${input.comment}`,
    });
    return { status: input.decision };
  });
}

function pickIssuesError(err: MergePickError): AppError {
  const fields = err.issues.map((i) => ({ path: `picks.${i.path}`, message: i.message }));
  return new AppError(
    'bad_request',
    'proposal',
    `Please check your choices: ${err.issues.map((i) => i.message).join(' ')}`,
    fields,
  );
}

/**
 * The source's owner accepts: a new version of the source with the proposed document (or the
 * merged one, when the source moved on since the fork), crediting the proposer as co-author, and
 * the proposal closed, in one transaction. Like any save it names the head it was reviewed
 * against, and is refused with 409 if the head has moved since. The proposal row is locked, so a
 * second acceptance waits and is then told it was already accepted.
 */
export async function acceptProposal(
  viewer: Viewer,
  id: string,
  input: AcceptProposalInput,
): Promise<{ recipe: { id: string; slug: string }; version: { id: string; number: number } }> {
  const saved = await db.transaction(async (tx) => {
    const { proposal, source, fork } = await loadProposal(tx, viewer, id, { lock: true });
    if (!isOwner(source, viewer))
      throw new AppError('forbidden', 'proposal', `Only the owner of “${source.title}” can accept this proposal.`);
    if (proposal.status === 'accepted') {
      const [v] = proposal.acceptedVersionId
        ? await tx
            .select({ number: recipeVersions.number })
            .from(recipeVersions)
            .where(eq(recipeVersions.id, proposal.acceptedVersionId))
        : [];
      throw new AppError(
        'conflict',
        'proposal',
        `This proposal was already accepted${v ? ` as version ${v.number}` : ''}. Nothing more was saved.`,
      );
    }
    refuseUnlessLive(proposal);
    if (!forkVisibleToOwner(fork, source.ownerId)) throw forkNotVisibleError();
    const [head] = await tx
      .select({ headVersionId: recipes.headVersionId })
      .from(recipes)
      .where(eq(recipes.id, source.id))
      .for('update');
    if (head.headVersionId !== input.sourceHeadVersionId) {
      const headVersion = await versionDoc(tx, head.headVersionId!);
      throw new AppError(
        'conflict',
        'recipe',
        `Version ${headVersion.number} of “${source.title}” was saved after the one you reviewed against. Look at the proposal again, then accept.`,
        [],
        { head: { id: headVersion.id, number: headVersion.number } },
      );
    }
    const [base, ours, theirs] = await Promise.all([
      versionDoc(tx, proposal.baseVersionId),
      versionDoc(tx, head.headVersionId!),
      versionDoc(tx, proposal.proposedVersionId),
    ]);
    let merged: RecipeDocument;
    try {
      merged = resolveMerge(mergeDocuments(base.document, ours.document, theirs.document), input.picks);
    } catch (err) {
      if (err instanceof MergePickError) throw pickIssuesError(err);
      throw err;
    }
    const checked = recipeDocumentSchema.safeParse(merged);
    if (!checked.success) {
      const fields = formatIssues(checked.error).map((f) => ({ path: `document.${f.path}`, message: f.message }));
      throw new AppError(
        'bad_request',
        'proposal',
        `The merged recipe would not be valid: ${fields[0].message}. Choose differently for the fields involved.`,
        fields,
      );
    }
    const [proposer] = await tx
      .select({ name: users.name, handle: users.handle })
      .from(users)
      .where(eq(users.id, proposal.proposerId));
    const result = await saveVersionInTransaction(tx, viewer, source.id, {
      document: checked.data,
      baseVersionId: input.sourceHeadVersionId,
      message: input.message || `Accepted “${proposal.title}” from ${proposer.name ?? proposer.handle}`,
      coAuthorId: proposal.proposerId,
    });
    await tx
      .update(proposals)
      .set({
        status: 'accepted',
        acceptedVersionId: result.version.id,
        decidedById: viewer.id,
        decidedAt: new Date(),
        updatedAt: new Date(),
      })
      .where(eq(proposals.id, proposal.id));
    await notify(tx, {
      userId: proposal.proposerId,
      kind: 'proposal_decision',
      actorId: viewer.id,
      recipeId: source.id,
      url: `/proposals/${proposal.id}`,
      excerpt: `Accepted as version ${result.version.number} of ${source.title}.`,
    });
    return result;
  });
  afterRecipeCommit();
  return saved;
}

/** A message in a proposal's discussion, from anyone who can see the proposal. */
export async function addProposalComment(viewer: Viewer, id: string, body: string): Promise<{ id: string }> {
  const { proposal } = await loadProposal(db, viewer, id);
  await consumeOrThrow(COMMENT_PER_MEMBER, viewer.id);
  const [row] = await db
    .insert(proposalComments)
    .values({ proposalId: proposal.id, authorId: viewer.id, body })
    .returning({ id: proposalComments.id });
  return row;
}

/** Moderation: hides a reported proposal inside the moderator's transaction. */
export async function hideProposal(tx: Transaction, id: string, reason: string): Promise<void> {
  await tx
    .update(proposals)
    .set({ hiddenAt: sql`coalesce(${proposals.hiddenAt}, now())`, hiddenReason: reason })
    .where(eq(proposals.id, id));
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
  fromTheirs: string[];
  brewDays: BrewDaySummary[];
  comments: ProposalCommentView[];
  /** Later versions of the fork the proposer may move the proposal to. */
  newerVersions: { id: string; number: number; message: string }[];
  can: { accept: boolean; decide: boolean; update: boolean; withdraw: boolean; comment: boolean; report: boolean };
  /** Why the owner cannot accept right now, when they cannot. */
  blocked: string | null;
}

/** Everything the proposal page shows, if the viewer may see the proposal (404 otherwise). */
export async function getProposalView(viewer: MaybeViewer, id: string): Promise<ProposalView> {
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
  // An open proposal is read against the source as it is now; a closed one as what it offered.
  const compareFrom = live ? headDoc : baseDoc;
  if (forkVisible) {
    // The fork's own name is not part of the proposal: compare under the source's title.
    comparison = compareDocuments(
      compareFrom.document,
      { ...proposedDoc.document, title: compareFrom.document.title },
      { units: (viewer as { units?: 'metric' | 'us' } | null)?.units ?? 'metric' },
    );
    if (live && headMoved)
      ({ conflicts, fromTheirs } = mergeDocuments(baseDoc.document, headDoc.document, proposedDoc.document));
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
    fromTheirs,
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
