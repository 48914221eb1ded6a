// Pure: names of report targets and reasons, shared by server and client code.

export const REPORT_TARGETS = ['recipe', 'version', 'comment', 'photo', 'member', 'proposal'] as const;
export type ReportTarget = (typeof REPORT_TARGETS)[number];

export const REPORT_REASONS = ['spam', 'abuse', 'unsafe', 'other'] as const;
export type ReportReason = (typeof REPORT_REASONS)[number];

export const REASON_LABELS: Record<ReportReason, string> = {
  spam: 'Spam or advertising',
  abuse: 'Abuse or harassment',
  unsafe: 'Unsafe brewing advice',
  other: 'Something else',
};

export const TARGET_LABELS: Record<ReportTarget, string> = {
  recipe: 'recipe',
  version: 'recipe version',
  comment: 'comment',
  photo: 'photo',
  member: 'member',
  proposal: 'proposal',
};
