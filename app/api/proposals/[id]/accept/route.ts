import { route } from '@/lib/http/route';
import { acceptProposal } from '@/lib/proposals/proposals';
import { acceptProposalSchema } from '@/lib/proposals/schemas';

type Params = { id: string };

// POST /api/proposals/[id]/accept – the source's owner accepts: a new version crediting the proposer
export const POST = route<typeof acceptProposalSchema, Params, 'user'>(
  { access: 'user', body: acceptProposalSchema, maxBodyBytes: 128 * 1024 },
  ({ viewer, params, body }) => acceptProposal(viewer, params.id, body),
);
