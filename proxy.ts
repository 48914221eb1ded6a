import { NextResponse, type NextRequest } from 'next/server';
import { setOfflineTag } from '@/lib/auth/offline-tag';
import { databaseReachable } from '@/lib/db-health';
import { pagePolicy } from '@/lib/http/page-policy';
import { keptAnswer } from '@/lib/page-cache';

/**
 * Every page gets a Content-Security-Policy that lets no inline script run unless the framework
 * wrote it. Readers of a public or unlisted recipe page get a kept copy (lib/page-cache.ts) whose
 * policy lists the hash of each of its inline scripts (signed-in ones too, unless the page would show
 * them something it shows nobody else); every other page is rendered per request with
 * a fresh nonce that Next.js puts on its own scripts. Under scripts/serve.mjs kept copies are
 * answered before this runs (scripts/request-guard.mjs); this answers them when served otherwise.
 * Styles may be inline (React style attributes and chart libraries set them); scripts may not.
 */
export async function proxy(request: NextRequest) {
  // scripts/serve.mjs refuses these before Next.js sees them; this covers pages served any other way.
  if (!pathDecodes(request.nextUrl.pathname)) {
    return new NextResponse('Bad request: the address has broken percent-encoding.\n', {
      status: 400,
      headers: { 'content-type': 'text/plain; charset=utf-8', 'cache-control': 'no-store' },
    });
  }
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
  const policy = pagePolicy(`'nonce-${nonce}' 'strict-dynamic'`);
  if (!(await databaseReachable())) return unavailable(policy);
  const kept = await keptAnswer(
    {
      method: request.method,
      pathname: request.nextUrl.pathname,
      search: request.nextUrl.search,
      header: (name) => request.headers.get(name),
    },
    { encoded: false },
  ).catch(() => null);
  if (kept) {
    const body = kept.body && new Uint8Array(kept.body);
    return new NextResponse(body, { status: kept.status, headers: kept.headers });
  }
  const requestHeaders = new Headers(request.headers);
  requestHeaders.delete('x-kf-page-render');
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('Content-Security-Policy', policy);
  await setOfflineTag(request, response);
  return response;
}

/** Next.js answers a path that is not percent-encoded UTF-8 with a 500 once it tries to decode it. */
function pathDecodes(pathname: string): boolean {
  try {
    decodeURIComponent(pathname);
    return true;
  } catch {
    return false;
  }
}

/** While the database is down, pages answer at once with a plain 503 and come back by themselves. */
function unavailable(policy: string): NextResponse {
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Kettlefork is briefly unavailable</title></head><body style="font-family: Georgia, serif; background: #fbf7f0; color: #211c16; max-width: 36rem; margin: 4rem auto; padding: 0 1rem"><h1>Kettlefork is briefly unavailable</h1><p>We cannot reach our database just now. Nothing you saved is lost; please try again in a moment.</p></body></html>`;
  return new NextResponse(html, {
    status: 503,
    headers: {
      'content-type': 'text/html; charset=utf-8',
      'retry-after': '5',
      'cache-control': 'no-store',
      'content-security-policy': policy,
    },
  });
}

export const config = {
  // Every page, router prefetches and error pages (a missing /favicon.ico) included: any HTML answer
  // must carry the policy. API answers, built assets and the icon carry the static headers from next.config.ts.
  matcher: ['/((?!api/|_next/static|_next/image|icon.svg).*)'],
};
