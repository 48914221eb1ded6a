import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { acceptProposal } from '@/lib/proposals/proposals';
import { acceptProposalSchema } from '@/lib/proposals/schemas';

// POST /api/proposals/[id]/accept – the source's owner accepts: a new version crediting the proposer
export const POST = route(
  { access: 'user', params: idParams('proposal'), body: acceptProposalSchema, maxBodyBytes: 128 * 1024 },
  ({ viewer, params, body }) => acceptProposal(viewer, params.id, body),
);
