// What a kept page answers with (lib/page-cache.ts): a shared-cache lifetime and a hash-only script policy.
import { createHash } from 'node:crypto';
import { expect } from 'vitest';

const KEPT_CACHE_CONTROL = 'public, max-age=0, s-maxage=10, must-revalidate';

/** The script-src directive of a Content-Security-Policy. */
export function scriptSrc(policy: string): string {
  return (
    policy
      .split(';')
      .map((d) => d.trim())
      .find((d) => d.startsWith('script-src')) ?? ''
  );
}

/** Checks a kept page's policy: no nonce, no unsafe-inline, and a hash for exactly its inline scripts. */
export async function expectKept(res: Response, label: string): Promise<string> {
  expect(res.status, label).toBe(200);
  expect(res.headers.get('cache-control'), label).toBe(KEPT_CACHE_CONTROL);
  const src = scriptSrc(res.headers.get('content-security-policy') ?? '');
  expect(src, label).not.toContain("'nonce-");
  expect(src, label).not.toContain("'unsafe-inline'");
  expect(src, label).not.toContain("'strict-dynamic'");
  const html = await res.text();
  expect(html, label).not.toMatch(/\snonce="/);
  // Nor a nonce inside the framework's payload: every worker keeps the same bytes for one state.
  expect(html, label).not.toMatch(/nonce\\":\\"[A-Za-z0-9+/=]{8,}/);
  const inline = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)].filter((m) => !/\bsrc=/.test(m[1]));
  expect(inline.length, label).toBeGreaterThan(0);
  const listed = new Set(src.match(/'sha256-[^']+'/g));
  const needed = new Set(inline.map((m) => `'sha256-${createHash('sha256').update(m[2]).digest('base64')}'`));
  expect(listed, label).toEqual(needed);
  return html;
}
