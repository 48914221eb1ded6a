import { route } from '@/lib/http/route';
import { getProposalsByMember, openProposal } from '@/lib/proposals/proposals';
import { listProposalsQuerySchema, openProposalSchema } from '@/lib/proposals/schemas';

// GET /api/proposals – the signed-in member's proposals: offered to their recipes and offered by them
export const GET = route({ access: 'user', query: listProposalsQuerySchema }, async ({ viewer, query }) => {
  const { incoming, outgoing } = await getProposalsByMember(viewer);
  return {
    incoming: query.direction === 'outgoing' ? [] : incoming,
    outgoing: query.direction === 'incoming' ? [] : outgoing,
  };
});

// POST /api/proposals – propose a version of one's fork to a recipe it descends from
export const POST = route({ access: 'user', body: openProposalSchema, maxBodyBytes: 64 * 1024 }, ({ viewer, body }) =>
  openProposal(viewer, body),
);

export const dynamic = 'force-dynamic';
