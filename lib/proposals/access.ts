import type { Proposal, Recipe } from '@/db/schema';
import { hasRole } from '@/lib/auth/roles';
import type { Viewer } from '@/lib/auth/session';
import { canView } from '@/lib/recipes/access';

type MaybeViewer = Pick<Viewer, 'id' | 'role'> | null;
type Gate = Pick<Recipe, 'ownerId' | 'visibility' | 'hiddenAt'>;

const LIVE_STATUSES = ['open', 'changes_requested'] as const;

export function isLive(proposal: Pick<Proposal, 'status'>): boolean {
  return (LIVE_STATUSES as readonly string[]).includes(proposal.status);
}

/**
 * Who may see a proposal: anyone who can see the recipe it is offered to and the fork it comes
 * from; its proposer and the source's owner even when the fork is no longer visible to others (so
 * the owner sees why it cannot be accepted). A hidden proposal only its proposer and the moderators.
 */
export function canViewProposal(
  proposal: Pick<Proposal, 'proposerId' | 'hiddenAt'>,
  source: Gate,
  fork: Gate,
  viewer: MaybeViewer,
): boolean {
  const moderator = Boolean(viewer && hasRole(viewer, 'moderator'));
  const proposer = viewer?.id === proposal.proposerId;
  if (proposal.hiddenAt && !proposer && !moderator) return false;
  if (!canView(source, viewer)) return false;
  if (proposer || moderator || viewer?.id === source.ownerId) return true;
  return canView(fork, viewer);
}
