import 'server-only';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { getPool } from '@/db';
import { AppError } from '@/lib/errors';

// Counters live in PostgreSQL (table rate_limits, created by our migrations), so every
// web instance shares them and a restart does not reset them.
const limiters = new Map<string, RateLimiterPostgres>();

export interface LimitRule {
  name: string;
  points: number;
  durationSec: number;
  blockDurationSec?: number;
}

function limiter(rule: LimitRule): RateLimiterPostgres {
  let l = limiters.get(rule.name);
  if (!l) {
    l = new RateLimiterPostgres({
      storeClient: getPool(),
      tableName: 'rate_limits',
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: rule.name,
      points: rule.points,
      duration: rule.durationSec,
      blockDuration: rule.blockDurationSec ?? 0,
    });
    limiters.set(rule.name, l);
  }
  return l;
}

/** Takes one point for `key`; false when the rule's budget is spent. */
export async function tryConsume(rule: LimitRule, key: string): Promise<boolean> {
  try {
    await limiter(rule).consume(key.toLowerCase(), 1);
    return true;
  } catch (err) {
    if (err instanceof RateLimiterRes) return false;
    throw err;
  }
}

export async function consumeOrThrow(rule: LimitRule, key: string): Promise<void> {
  if (!(await tryConsume(rule, key))) throw new AppError('rate_limited');
}

export const SIGN_IN_PER_ACCOUNT: LimitRule = { name: 'signin-account', points: 10, durationSec: 15 * 60 };
export const SIGN_IN_PER_ADDRESS: LimitRule = { name: 'signin-address', points: 30, durationSec: 15 * 60 };
export const MAGIC_LINK_PER_ACCOUNT: LimitRule = { name: 'magic-account', points: 5, durationSec: 60 * 60 };
export const SIGN_UP_PER_ADDRESS: LimitRule = { name: 'signup-address', points: 20, durationSec: 60 * 60 };

/** Set by scripts/serve.mjs (scripts/request-guard.mjs) from the socket; the same name in both. */
const CLIENT_ADDRESS_HEADER = 'x-kettlefork-client-address';

/**
 * The client's address, the key of the per-address limits. Behind our own load balancer
 * (TRUST_PROXY=1), which overwrites X-Forwarded-For, its first entry. Otherwise the connecting
 * socket's address, which scripts/serve.mjs stamps on every request as CLIENT_ADDRESS_HEADER after
 * removing any copy the client sent (and says so with KF_SOCKET_ADDRESS_HEADER=1 in its workers'
 * environment); a client-sent X-Forwarded-For is never believed there, or a client could pick a
 * fresh address per request. Served any other way (`next dev`, a bare `next start`) nobody removes a
 * forged copy, so the header is ignored and every client shares the one key 'direct': stricter,
 * never looser.
 */
export function clientAddress(headers: Headers | Record<string, string | string[] | undefined> | undefined): string {
  const get = (name: string): string | undefined => {
    if (!headers) return undefined;
    if (headers instanceof Headers) return headers.get(name) ?? undefined;
    const v = headers[name];
    return Array.isArray(v) ? v[0] : v;
  };
  const socket = process.env.KF_SOCKET_ADDRESS_HEADER === '1' ? get(CLIENT_ADDRESS_HEADER)?.trim() : undefined;
  if (process.env.TRUST_PROXY === '1') {
    return get('x-forwarded-for')?.split(',')[0]?.trim() || get('x-real-ip') || socket || 'direct';
  }
  return socket || 'direct';
}

// Community posting, per member (key: the member's id).
export const COMMENT_PER_MEMBER: LimitRule = { name: 'comment-member', points: 10, durationSec: 10 * 60 };
export const REPORT_PER_MEMBER: LimitRule = { name: 'report-member', points: 20, durationSec: 60 * 60 };
/** Stars and follows together. */
export const REACTION_PER_MEMBER: LimitRule = { name: 'reaction-member', points: 120, durationSec: 60 * 60 };
