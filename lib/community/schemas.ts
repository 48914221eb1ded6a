import { z } from 'zod';
import { NOTIFICATION_KINDS } from '@/lib/notifications/kinds';
import { idOf } from '@/lib/validation/ids';

const COMMENT_MAX_CHARS = 5_000;

const commentBody = z
  .string({ error: 'Write your comment.' })
  .trim()
  .min(1, 'Write your comment.')
  .max(COMMENT_MAX_CHARS, `Keep a comment under ${COMMENT_MAX_CHARS} characters.`);

export const newCommentSchema = z.object({
  body: commentBody,
  parentId: idOf('The comment you reply to must be a comment id.').optional(),
  versionNumber: z.number({ error: 'The version number must be a number.' }).int().positive().optional(),
});
export type NewCommentInput = z.infer<typeof newCommentSchema>;

export const editCommentSchema = z.object({ body: commentBody });

const FOLLOW_TYPES = ['member', 'recipe'] as const;
export const followSchema = z.object({
  type: z.enum(FOLLOW_TYPES, { error: 'Follow a member or a recipe.' }),
  id: z
    .string({ error: 'Name who or what to follow.' })
    .min(1, 'Name who or what to follow.')
    .max(64, 'That is not an id.'),
});
export type FollowInput = z.infer<typeof followSchema>;

const emailChoicesSchema = z.object(
  Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k, z.boolean({ error: 'Choose on or off.' })])) as Record<
    (typeof NOTIFICATION_KINDS)[number],
    z.ZodBoolean
  >,
);

/** The settings page and PUT /api/me/settings; volumes are litres (the page converts gallons). */
export const settingsSchema = z.object({
  name: z
    .string({ error: 'Give a display name.' })
    .trim()
    .min(1, 'Give a display name.')
    .max(80, 'Keep the display name under 80 characters.'),
  bio: z.string({ error: 'The bio must be text.' }).trim().max(2_000, 'Keep the bio under 2,000 characters.'),
  units: z.enum(['metric', 'us'], { error: 'Choose metric or US units.' }),
  defaultBatchVolumeL: z
    .number({ error: 'Give the batch volume as a number.' })
    .min(1, 'A batch is at least 1 litre.')
    .max(2_000, 'A batch is at most 2,000 litres.'),
  defaultEfficiencyPct: z
    .number({ error: 'Give the efficiency as a number.' })
    .min(30, 'Efficiency is at least 30 %.')
    .max(100, 'Efficiency is at most 100 %.'),
  emailChoices: emailChoicesSchema,
});
export type SettingsInput = z.infer<typeof settingsSchema>;
