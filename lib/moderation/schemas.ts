import { z } from 'zod';
import { REPORT_REASONS, REPORT_TARGETS } from './words';
import { idOf } from '@/lib/validation/ids';
import { textSchema } from '@/lib/validation/text';

export const reportSchema = z.object({
  targetType: z.enum(REPORT_TARGETS, { error: 'Say what you report: a recipe, version, comment, photo or member.' }),
  targetId: z
    .string({ error: 'Say which one you report.' })
    .trim()
    .min(1, 'Say which one you report.')
    .max(64, 'That is not an id.'),
  reason: z.enum(REPORT_REASONS, { error: 'Choose a reason: spam, abuse, unsafe advice or other.' }),
  note: z
    .string({ error: 'The note must be text.' })
    .trim()
    .max(1_000, 'Keep the note under 1,000 characters.')
    .default(''),
});
export type ReportInput = z.infer<typeof reportSchema>;

const moderatorReason = z.string({ error: 'Give a reason.' }).trim().max(500, 'Keep the reason under 500 characters.');

export const resolveReportSchema = z
  .object({
    action: z.enum(['hide', 'dismiss', 'suspend'], { error: 'Choose hide, dismiss or suspend.' }),
    reason: moderatorReason.default(''),
  })
  .refine((v) => v.action === 'dismiss' || v.reason.length > 0, {
    path: ['reason'],
    message: 'Say why; the owner sees this reason.',
  });
export type ResolveReportInput = z.infer<typeof resolveReportSchema>;

export const reviewCommentSchema = z
  .object({
    action: z.enum(['approve', 'hide'], { error: 'Choose approve or hide.' }),
    reason: moderatorReason.default(''),
  })
  .refine((v) => v.action === 'approve' || v.reason.length > 0, {
    path: ['reason'],
    message: 'Say why; the author sees this reason.',
  });

export const restoreSchema = z.object({
  targetType: z.enum(['recipe', 'comment', 'photo'], { error: 'Restore a recipe, comment or photo.' }),
  targetId: idOf('Name what to restore by its id.'),
  reason: moderatorReason.default(''),
});

export const actionLogQuerySchema = z.object({
  action: z
    .string()
    .trim()
    .max(40, 'That is not an action.')
    .regex(/^[a-z_]*$/, 'That is not an action.')
    .optional(),
  actor: textSchema('Member').trim().max(40, 'That is not a handle.').optional(),
  targetType: z
    .string()
    .trim()
    .max(20, 'That is not a target type.')
    .regex(/^[a-z_]*$/, 'That is not a target type.')
    .optional(),
  page: z.coerce.number({ error: 'The page must be a number.' }).int().min(1).max(1000).default(1),
});
export type ActionLogQuery = z.infer<typeof actionLogQuerySchema>;
