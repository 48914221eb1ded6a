import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { addProposalComment } from '@/lib/proposals/proposals';
import { proposalCommentSchema } from '@/lib/proposals/schemas';

// POST /api/proposals/[id]/comments – add a message to a proposal's discussion
export const POST = route(
  { access: 'user', params: idParams('proposal'), body: proposalCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => addProposalComment(viewer, params.id, body.body),
);
