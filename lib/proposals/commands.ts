import 'server-only';
import { eq, sql } from 'drizzle-orm';
import { db, type Transaction } from '@/db';
import { proposalComments, proposals, recipeVersions, recipes, users, type Proposal } from '@/db/schema';
import type { Viewer } from '@/lib/auth/session';
import { formatIssues, recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import { uniqueViolation } from '@/lib/db-errors';
import { AppError } from '@/lib/errors';
import { notify } from '@/lib/notifications/notify';
import { COMMENT_PER_MEMBER, consumeOrThrow } from '@/lib/rate-limit';
import { canView, isOwner } from '@/lib/recipes/access';
import { afterRecipeCommit } from '@/lib/recipes/events';
import { getVersionById, saveVersionInTransaction } from '@/lib/recipes/versions';
import { isLive } from './access';
import { forkVisibleToOwner, getAncestorsByRecipeId, loadProposal, versionDoc } from './loading';
import { MergePickError, mergeDocuments, resolveMerge } from './merge';
import type { AcceptProposalInput, DecideProposalInput, OpenProposalInput, UpdateProposalInput } from './schemas';

// The proposal commands: open, update, withdraw, decide, accept, comment and hide. Each change runs
// in one transaction with the notices it sends.

const STATUS_WORDS: Record<Proposal['status'], string> = {
  open: 'open',
  accepted: 'accepted',
  declined: 'declined',
  changes_requested: 'waiting for changes',
  withdrawn: 'withdrawn',
};

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

function refuseUnlessLive(proposal: Proposal): void {
  if (isLive(proposal)) return;
  throw new AppError(
    'conflict',
    'proposal',
    `This proposal was already ${STATUS_WORDS[proposal.status]}. Nothing was changed.`,
  );
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

type Decision =
  | { status: 'declined' | 'changes_requested'; decisionComment: string }
  | { status: 'accepted'; acceptedVersionId: string };

/**
 * Closes or returns a proposal on the source owner's word and tells the proposer, inside the
 * caller's transaction.
 */
async function recordDecision(
  tx: Transaction,
  viewer: Viewer,
  { proposal, source }: { proposal: Proposal; source: { id: string } },
  decision: Decision,
  excerpt: string,
): Promise<void> {
  const now = new Date();
  await tx
    .update(proposals)
    .set({ ...decision, decidedById: viewer.id, decidedAt: now, updatedAt: now })
    .where(eq(proposals.id, proposal.id));
  await notify(tx, {
    userId: proposal.proposerId,
    kind: 'proposal_decision',
    actorId: viewer.id,
    recipeId: source.id,
    url: `/proposals/${proposal.id}`,
    excerpt,
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
    await recordDecision(
      tx,
      viewer,
      { proposal, source },
      { status: input.decision, decisionComment: input.comment },
      `${input.decision === 'declined' ? 'Declined' : 'Changes asked for'}: ${input.comment}`,
    );
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
    await recordDecision(
      tx,
      viewer,
      { proposal, source },
      { status: 'accepted', acceptedVersionId: result.version.id },
      `Accepted as version ${result.version.number} of ${source.title}.`,
    );
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
