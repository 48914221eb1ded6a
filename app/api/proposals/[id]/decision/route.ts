import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { decideProposal } from '@/lib/proposals/proposals';
import { decideProposalSchema } from '@/lib/proposals/schemas';

// POST /api/proposals/[id]/decision – the source's owner declines or asks for changes, with a comment
export const POST = route(
  { access: 'user', params: idParams('proposal'), body: decideProposalSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => decideProposal(viewer, params.id, body),
);
