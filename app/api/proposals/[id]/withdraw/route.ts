import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { withdrawProposal } from '@/lib/proposals/proposals';

// POST /api/proposals/[id]/withdraw – the proposer takes the proposal back
export const POST = route({ access: 'user', params: idParams('proposal') }, ({ viewer, params }) =>
  withdrawProposal(viewer, params.id),
);
