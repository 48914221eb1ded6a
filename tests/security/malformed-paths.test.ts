import { request } from 'node:http';
import { describe, expect, it } from 'vitest';
import { BASE_URL } from '../helpers/env';

/** The path goes on the wire exactly as written (fetch and URL would leave it alone too, but say nothing of it). */
function get(path: string): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = request(`${BASE_URL}/`, { path, method: 'GET' }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString('utf8') }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('paths with broken percent-encoding', () => {
  // A lone surrogate (ED A0 80), a cut-off sequence, a lone %, non-hex digits, an overlong slash
  // (C0 AF), a stray continuation byte: none is UTF-8 (RFC 3629), so none names anything we serve.
  const broken = [
    '/recipes/x%ED%A0%80',
    '/api/recipes/%E0%A4%A',
    '/api/recipes/%',
    '/recipes/%zz',
    '/recipes/%C0%AF',
    '/members/%80',
    '/api/search/%E0%A4?q=pale',
    '/_next/static/%E0%A4%A',
  ];

  for (const path of broken) {
    it(`answers ${path} with a clear 400, never a 500`, async () => {
      const res = await get(path);
      expect(res.status, res.body.slice(0, 200)).toBe(400);
      expect(res.body).toMatch(/percent-encoding/);
    });
  }

  it('still serves well-formed encoded paths and leaves the query alone', async () => {
    expect((await get('/api/health')).status).toBe(200);
    // A real but unknown recipe name with an encoded space and é: a 404 page, not a refusal.
    expect((await get('/recipes/no-such%20recipe-caf%C3%A9')).status).toBe(404);
    // The query is the search's to read; a stray % there is not a broken path.
    expect((await get('/api/search?q=100%')).status).toBeLessThan(500);
  });
});
