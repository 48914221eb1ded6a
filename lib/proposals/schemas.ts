import { z } from 'zod';
import { idOf } from '@/lib/validation/ids';

const PROPOSAL_TITLE_MAX = 120;
const PROPOSAL_TEXT_MAX = 5_000;

const title = z
  .string({ error: 'Give the proposal a title.' })
  .trim()
  .min(1, 'Give the proposal a title.')
  .max(PROPOSAL_TITLE_MAX, `Keep the title under ${PROPOSAL_TITLE_MAX} characters.`);
const description = z
  .string({ error: 'The description must be text.' })
  .trim()
  .max(PROPOSAL_TEXT_MAX, `Keep the description under ${PROPOSAL_TEXT_MAX} characters.`);

/** POST /api/proposals: a version of the member's fork offered to one of its ancestors. */
export const openProposalSchema = z.object({
  versionId: idOf('Name the version you propose by its id.'),
  /** Which ancestor to propose to; the recipe the fork came from directly when left out. */
  sourceRecipeId: idOf('Name the recipe you propose to by its id.').optional(),
  title,
  description: description.default(''),
});
export type OpenProposalInput = z.infer<typeof openProposalSchema>;

/** PATCH /api/proposals/[id]: the proposer moves it to a newer version of the fork, or rewords it. */
export const updateProposalSchema = z
  .object({
    versionId: idOf('Name the newer version by its id.').optional(),
    title: title.optional(),
    description: description.optional(),
  })
  .refine((v) => v.versionId !== undefined || v.title !== undefined || v.description !== undefined, {
    path: ['versionId'],
    message: 'Say what to change: a newer version, the title or the description.',
  });
export type UpdateProposalInput = z.infer<typeof updateProposalSchema>;

/** POST /api/proposals/[id]/accept: the owner accepts, naming the head they reviewed against. */
export const acceptProposalSchema = z.object({
  sourceHeadVersionId: idOf('Name the version of your recipe you reviewed against.'),
  /** One choice per conflicting field: keep the recipe's own value (`ours`) or the proposal's (`theirs`). */
  picks: z
    .record(
      z.string().max(300, 'That is not a field of the recipe.'),
      z.enum(['ours', 'theirs'], { error: 'Choose “ours” or “theirs”.' }),
    )
    .refine((p) => Object.keys(p).length <= 500, 'Too many choices.')
    .default({}),
  message: z
    .string({ error: 'The message must be text.' })
    .trim()
    .max(500, 'Keep the message under 500 characters.')
    .default(''),
});
export type AcceptProposalInput = z.infer<typeof acceptProposalSchema>;

/** POST /api/proposals/[id]/decision: the owner declines or asks for changes, saying why. */
export const decideProposalSchema = z.object({
  decision: z.enum(['declined', 'changes_requested'], { error: 'Choose to decline or to ask for changes.' }),
  comment: z
    .string({ error: 'Say why, so the proposer knows.' })
    .trim()
    .min(1, 'Say why, so the proposer knows.')
    .max(PROPOSAL_TEXT_MAX, `Keep the comment under ${PROPOSAL_TEXT_MAX} characters.`),
});
export type DecideProposalInput = z.infer<typeof decideProposalSchema>;

/** POST /api/proposals/[id]/comments: a message in the proposal's discussion. */
export const proposalCommentSchema = z.object({
  body: z
    .string({ error: 'Write your comment.' })
    .trim()
    .min(1, 'Write your comment.')
    .max(PROPOSAL_TEXT_MAX, `Keep a comment under ${PROPOSAL_TEXT_MAX} characters.`),
});

/** GET /api/proposals: the signed-in member's proposals. */
export const listProposalsQuerySchema = z.object({
  direction: z.enum(['incoming', 'outgoing', 'all'], { error: 'Choose incoming, outgoing or all.' }).default('all'),
});
