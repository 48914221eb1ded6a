import { NextResponse, type NextRequest } from 'next/server';

/**
 * A fresh nonce and Content-Security-Policy for every page request: Next.js puts the nonce on
 * its own scripts, so no inline script runs without it. Styles may be inline (React style
 * attributes and chart libraries set them); scripts may not.
 */
export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
  const dev = process.env.NODE_ENV === 'development';
  const policy = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('Content-Security-Policy', policy);
  return response;
}

export const config = {
  // Pages only: API answers, built assets and icons carry the static headers from next.config.ts.
  matcher: [{ source: '/((?!api/|_next/static|_next/image|icon.svg|favicon.ico).*)', missing: [{ type: 'header', key: 'next-router-prefetch' }] }],
};
