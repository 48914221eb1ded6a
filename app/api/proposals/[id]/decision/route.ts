import { route } from '@/lib/http/route';
import { decideProposal } from '@/lib/proposals/proposals';
import { decideProposalSchema } from '@/lib/proposals/schemas';

type Params = { id: string };

// POST /api/proposals/[id]/decision – the source's owner declines or asks for changes, with a comment
export const POST = route<typeof decideProposalSchema, Params, 'user'>(
  { access: 'user', body: decideProposalSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => decideProposal(viewer, params.id, body),
);
