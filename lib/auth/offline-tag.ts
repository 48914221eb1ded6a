import { createHmac } from 'node:crypto';
import { decode } from 'next-auth/jwt';
import type { NextRequest, NextResponse } from 'next/server';
import { authSecret } from '@/lib/env';

// Brew-day mode's service worker answers from its kept copy only to the session that copy was kept
// for. It cannot read the session cookie (HttpOnly), so each brew-day mode page also sets this
// readable cookie: a keyed hash of the server-side session id, useless as a credential, which the
// worker compares with the tag it kept beside its copy (public/brew-day-sw.js). Signing out clears it.

const OFFLINE_TAG_COOKIE = 'kf-offline-tag';

/** The brew-day mode page, the only page that hands the worker a tag. */
const LIVE_PAGE = /^\/brew-days\/[0-9a-f-]{36}\/live\/?$/;

const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?next-auth\.session-token=([^;]+)/;

async function sessionOf(request: NextRequest): Promise<{ sid: string; exp: number | null } | null> {
  const cookie = SESSION_COOKIE.exec(request.headers.get('cookie') ?? '');
  if (!cookie) return null;
  const token = await decode({ token: decodeURIComponent(cookie[1]), secret: authSecret() }).catch(() => null);
  if (typeof token?.sid !== 'string') return null;
  return { sid: token.sid, exp: typeof token.exp === 'number' ? token.exp : null };
}

/** Sets (or, without a session, clears) the offline tag on a brew-day mode page's answer. */
export async function setOfflineTag(request: NextRequest, response: NextResponse): Promise<void> {
  if (request.method !== 'GET' || !LIVE_PAGE.test(request.nextUrl.pathname)) return;
  const session = await sessionOf(request);
  const secure = request.nextUrl.protocol === 'https:';
  if (!session) {
    if (request.cookies.has(OFFLINE_TAG_COOKIE)) response.cookies.delete(OFFLINE_TAG_COOKIE);
    return;
  }
  const tag = createHmac('sha256', authSecret()).update(`brew-day offline copy:${session.sid}`).digest('hex');
  const maxAge = session.exp === null ? undefined : Math.max(0, session.exp - Math.floor(Date.now() / 1000));
  response.cookies.set(OFFLINE_TAG_COOKIE, tag.slice(0, 32), { path: '/', sameSite: 'lax', secure, maxAge });
}
