import { route } from '@/lib/http/route';
import { withdrawProposal } from '@/lib/proposals/proposals';

type Params = { id: string };

// POST /api/proposals/[id]/withdraw – the proposer takes the proposal back
export const POST = route<undefined, Params, 'user'>({ access: 'user' }, ({ viewer, params }) =>
  withdrawProposal(viewer, params.id),
);
