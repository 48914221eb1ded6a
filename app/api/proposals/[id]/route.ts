import { route } from '@/lib/http/route';
import { getProposalView, updateProposal } from '@/lib/proposals/proposals';
import { updateProposalSchema } from '@/lib/proposals/schemas';

type Params = { id: string };

// GET /api/proposals/[id] – a proposal with its comparison, three-way conflicts, brew days and discussion
export const GET = route<undefined, Params, 'public'>({ access: 'public' }, async ({ viewer, params }) => ({
  proposal: await getProposalView(viewer, params.id),
}));

// PATCH /api/proposals/[id] – the proposer moves it to a newer version of the fork or rewords it
export const PATCH = route<typeof updateProposalSchema, Params, 'user'>(
  { access: 'user', body: updateProposalSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => updateProposal(viewer, params.id, body),
);

export const dynamic = 'force-dynamic';
