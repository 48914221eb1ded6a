// Pure: the rule that holds a new member's link comments for a moderator.

/** Accounts younger than this are new. */
const NEW_ACCOUNT_DAYS = 7;
/** A new member's link comments are held until moderators have approved this many of them. */
const APPROVALS_BEFORE_TRUSTED = 3;

/**
 * A comment containing a link, from a member (not a moderator) whose account is younger than
 * NEW_ACCOUNT_DAYS, is held for review — unpublished, seen only by its author and the
 * moderators — unless moderators have already approved APPROVALS_BEFORE_TRUSTED of that member's
 * link comments.
 */
export function shouldHoldComment(input: {
  role: 'member' | 'moderator' | 'admin';
  accountCreatedAt: Date;
  hasLink: boolean;
  approvedLinkComments: number;
  now?: Date;
}): boolean {
  if (!input.hasLink || input.role !== 'member') return false;
  const ageMs = (input.now ?? new Date()).getTime() - input.accountCreatedAt.getTime();
  if (ageMs >= NEW_ACCOUNT_DAYS * 24 * 60 * 60 * 1000) return false;
  return input.approvedLinkComments < APPROVALS_BEFORE_TRUSTED;
}

const LINK_PATTERNS = [
  /\b(?:https?|ftp):\/\//i,
  /\bwww\.[a-z0-9-]/i,
  /\]\s*\([^)]*\)/, // a Markdown link or image
  /<[a-z][a-z0-9+.-]*:[^>]*>/i, // an autolink
  /\b[a-z0-9-]{2,}\.(?:com|net|org|info|biz|shop|store|online|site|top|xyz|click|io|co|ru|cn|example)\b/i,
];

/** True when text contains something a reader could follow: a URL, a Markdown link or a bare domain. */
export function containsLink(text: string): boolean {
  return LINK_PATTERNS.some((p) => p.test(text));
}
