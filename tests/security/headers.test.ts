import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { scriptSrc } from '../helpers/kept-pages';
import { createRecipeVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

describe('security headers', () => {
  it('gives every page a fresh script nonce that all of its scripts carry, and no inline scripts without it', async () => {
    const { client } = await signedInClient();
    const { client: moderator } = await signedInClient('moderator');
    const recipe = await createRecipeVia(client);
    const secret = await createRecipeVia(client, { visibility: 'private' });
    const anon = new TestClient();
    // Readers of a public recipe who see what everyone sees, of the home, about and guide pages, and
    // signed-out searchers get a kept copy allowed by script hashes instead (tests/recipes/page-cache.test.ts,
    // tests/community/kept-member-pages.test.ts, tests/search/kept-search-pages.test.ts); a private
    // recipe, a moderator's view and a member's search are rendered per request.
    const pages: [TestClient, string][] = [
      [client, '/search?q=pale'],
      [anon, '/sign-in'],
      [client, `/recipes/${secret.recipe.slug}`],
      [moderator, `/recipes/${recipe.recipe.slug}`],
      [anon, '/no-such-page'],
    ];
    for (const [reader, path] of pages) {
      const res = await reader.fetch(path);
      const policy = res.headers.get('content-security-policy') ?? '';
      const src = scriptSrc(policy);
      const nonce = src.match(/'nonce-([^']+)'/)?.[1];
      expect(nonce, path).toBeTruthy();
      expect(src, path).not.toContain("'unsafe-inline'");
      expect(src, path).not.toContain("'unsafe-eval'");
      expect(policy).toContain("frame-ancestors 'none'");
      expect(policy).toContain("object-src 'none'");
      const html = await res.text();
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length, path).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag, `${path}: ${tag}`).toContain(`nonce="${nonce}"`);
      const again = (await reader.fetch(path)).headers.get('content-security-policy');
      expect(again).not.toBe(policy);
    }
  });

  it('gives every HTML answer the policy: router prefetches that ask for a whole page, and the missing favicon', async () => {
    const { client } = await signedInClient();
    const recipe = await createRecipeVia(client);
    const anon = new TestClient();
    const requests: [string, Record<string, string>][] = [
      ['/', { 'next-router-prefetch': '1' }],
      [`/recipes/${recipe.recipe.slug}`, { 'next-router-prefetch': '1' }],
      ['/about', { 'next-router-prefetch': '1', purpose: 'prefetch' }],
      ['/favicon.ico', {}],
      ['/favicon.ico', { 'next-router-prefetch': '1' }],
    ];
    for (const [path, headers] of requests) {
      const res = await anon.fetch(path, { headers });
      const label = `${path} ${JSON.stringify(headers)}`;
      const type = res.headers.get('content-type') ?? '';
      expect(type, label).toContain('text/html');
      const policy = res.headers.get('content-security-policy') ?? '';
      const src = scriptSrc(policy);
      expect(src, label).not.toContain("'unsafe-inline'");
      expect(policy, label).toContain("frame-ancestors 'none'");
      const html = await res.text();
      const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
      expect(scripts.length, label).toBeGreaterThan(0);
      const nonce = src.match(/'nonce-([^']+)'/)?.[1];
      if (nonce) {
        for (const [whole] of scripts)
          expect(whole.slice(0, whole.indexOf('>') + 1), label).toContain(`nonce="${nonce}"`);
      } else {
        expect(src, label).toContain("'sha256-");
        // A kept recipe page: each inline script is allowed by its hash.
        for (const [, attrs, body] of scripts.filter((m) => !/\bsrc=/.test(m[1])))
          expect(src, `${label}: ${attrs}`).toContain(`'sha256-${createHash('sha256').update(body).digest('base64')}'`);
      }
    }
  });

  it('sends nosniff, the referrer policy and frame refusal on pages and on JSON', async () => {
    const anon = new TestClient();
    for (const path of ['/', '/api/me', '/api/recipes']) {
      const res = await anon.fetch(path);
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff');
      expect(res.headers.get('referrer-policy'), path).toBe('strict-origin-when-cross-origin');
      expect(res.headers.get('x-frame-options'), path).toBe('DENY');
      expect(res.headers.get('content-security-policy'), path).toContain("frame-ancestors 'none'");
    }
  });

  it('answers errors with a plain message and a request id, never a stack trace', async () => {
    const res = await new TestClient().json<{ error: { message: string; requestId: string } }>(
      'POST',
      '/api/accounts',
      '{not json',
      { 'content-type': 'application/json' },
    );
    expect(res.status).toBe(400);
    expect(res.body.error.requestId).toMatch(/^[0-9a-f-]{36}$/);
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });
});
