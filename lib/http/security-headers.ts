/**
 * The headers every answer carries (next.config.ts sets them on what Next.js serves; a kept recipe
 * page answered before Next.js sees the request, lib/page-cache.ts, carries them itself).
 */
export const SECURITY_HEADERS = [
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
];
