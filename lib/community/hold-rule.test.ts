import { describe, expect, it } from 'vitest';
import { containsLink, shouldHoldComment } from './hold-rule';

const now = new Date('2026-03-10T12:00:00Z');
const daysAgo = (d: number) => new Date(now.getTime() - d * 24 * 60 * 60 * 1000);

describe('containsLink', () => {
  it.each([
    'see https://deals.example/watches',
    'www.cheap-watches.test now',
    '[click here](/somewhere)',
    '<https://x.example>',
    'visit cheapwatches.com today',
  ])('finds a link in %j', (text) => expect(containsLink(text)).toBe(true));

  it.each(['Mash at 66 °C for 60 min.', 'Use 1.5 kg of pale malt, e.g. two-row.', 'OG 1.052, FG 1.010'])(
    'finds none in %j',
    (text) => expect(containsLink(text)).toBe(false),
  );
});

describe('shouldHoldComment', () => {
  const base = { role: 'member' as const, accountCreatedAt: daysAgo(1), hasLink: true, approvedLinkComments: 0, now };
  it('holds a new member’s link comment', () => expect(shouldHoldComment(base)).toBe(true));
  it('publishes a comment without a link', () => expect(shouldHoldComment({ ...base, hasLink: false })).toBe(false));
  it('publishes once the account is a week old', () =>
    expect(shouldHoldComment({ ...base, accountCreatedAt: daysAgo(7) })).toBe(false));
  it('publishes after three approvals', () => {
    expect(shouldHoldComment({ ...base, approvedLinkComments: 2 })).toBe(true);
    expect(shouldHoldComment({ ...base, approvedLinkComments: 3 })).toBe(false);
  });
  it('never holds a moderator', () => expect(shouldHoldComment({ ...base, role: 'moderator' })).toBe(false));
});
