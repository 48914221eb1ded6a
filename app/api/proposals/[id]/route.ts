import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { getProposalView, updateProposal } from '@/lib/proposals/proposals';
import { updateProposalSchema } from '@/lib/proposals/schemas';

// GET /api/proposals/[id] – a proposal with its comparison, three-way conflicts, brew days and discussion
export const GET = route({ access: 'public', params: idParams('proposal') }, async ({ viewer, params }) => ({
  proposal: await getProposalView(viewer, params.id),
}));

// PATCH /api/proposals/[id] – the proposer moves it to a newer version of the fork or rewords it
export const PATCH = route(
  { access: 'user', params: idParams('proposal'), body: updateProposalSchema, maxBodyBytes: 64 * 1024 },
  ({ viewer, params, body }) => updateProposal(viewer, params.id, body),
);

export const dynamic = 'force-dynamic';
