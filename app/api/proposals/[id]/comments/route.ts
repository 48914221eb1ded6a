import { route } from '@/lib/http/route';
import { addProposalComment } from '@/lib/proposals/proposals';
import { proposalCommentSchema } from '@/lib/proposals/schemas';

type Params = { id: string };

// POST /api/proposals/[id]/comments – add a message to a proposal's discussion
export const POST = route<typeof proposalCommentSchema, Params, 'user'>(
  { access: 'user', body: proposalCommentSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => addProposalComment(viewer, params.id, body.body),
);
