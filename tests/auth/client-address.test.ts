import type { ChildProcess } from 'node:child_process';
import { request } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL } from '../helpers/env';
import { TestClient } from '../helpers/http';
import { TEST_PASSWORD, createUser } from '../helpers/users';
import { startChild, stopAndWait, waitFor } from '../load/processes';

// A second server for this file alone, from the suite's production build, served the way brewers
// get it (scripts/serve.mjs) but without TRUST_PROXY: the address is the socket's, nothing a client says.
const PORT = Number(new URL(BASE_URL).port) + 5;
const DIRECT_URL = `http://127.0.0.1:${PORT}`;

interface Answer {
  status: number;
  body: string;
  setCookies: string[];
}

/** One request to the second server from the given loopback address (all of 127/8 is this machine). */
function send(
  from: string,
  method: string,
  path: string,
  headers: Record<string, string> = {},
  body?: string,
): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = request(
      `${DIRECT_URL}${path}`,
      {
        method,
        localAddress: from,
        headers: { ...headers, ...(body ? { 'content-length': Buffer.byteLength(body) } : {}) },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () =>
          resolve({
            status: res.statusCode ?? 0,
            body: Buffer.concat(chunks).toString('utf8'),
            setCookies: [res.headers['set-cookie'] ?? []].flat(),
          }),
        );
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

const cookiePairs = (lines: string[]) => lines.map((line) => line.split(';')[0]);

/** A credentials sign-in as the sign-in page makes it; true when a session cookie comes back. */
async function signIn(from: string, email: string, password: string, forged: Record<string, string> = {}) {
  const csrf = await send(from, 'GET', '/api/auth/csrf', forged);
  const { csrfToken } = JSON.parse(csrf.body) as { csrfToken: string };
  const res = await send(
    from,
    'POST',
    '/api/auth/callback/credentials',
    {
      ...forged,
      'content-type': 'application/x-www-form-urlencoded',
      cookie: cookiePairs(csrf.setCookies).join('; '),
      origin: DIRECT_URL,
    },
    new URLSearchParams({ email, password, csrfToken, json: 'true' }).toString(),
  );
  return res.setCookies.some((c) => c.startsWith('next-auth.session-token='));
}

describe('per-address sign-in limits served directly (no trusted proxy)', () => {
  let server: ChildProcess;
  beforeAll(async () => {
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'production',
      KF_WORKERS: '1',
      KF_SEARCH_SYNC: 'off',
      KF_EMAIL_SENDER: 'off',
      NEXTAUTH_URL: DIRECT_URL,
      KF_BASE_URL: DIRECT_URL,
    };
    delete env.TRUST_PROXY;
    server = startChild(['scripts/serve.mjs', '-H', '127.0.0.1', '-p', String(PORT)], env);
    await waitFor(`${DIRECT_URL}/api/health`, 90);
  }, 120_000);
  afterAll(async () => {
    if (server) await stopAndWait(server);
  });

  it('counts each socket address on its own and ignores forged address headers', async () => {
    const user = await createUser();
    // 30 failures from 127.0.0.2, each claiming another address in both headers a client might forge.
    for (let i = 0; i < 30; i++) {
      const forged = { 'x-forwarded-for': `10.77.0.${i}`, 'x-kettlefork-client-address': `10.78.0.${i}` };
      expect(await signIn('127.0.0.2', `nobody-${i}@kettlefork.test`, 'wrong-password-xx', forged)).toBe(false);
    }
    // 127.0.0.2 has spent its budget: even the right password is refused there.
    expect(await signIn('127.0.0.2', user.email, TEST_PASSWORD)).toBe(false);
    // Another address still signs in, even when it claims to be the locked-out one.
    expect(await signIn('127.0.0.1', user.email, TEST_PASSWORD, { 'x-kettlefork-client-address': '127.0.0.2' })).toBe(
      true,
    );
  }, 120_000);

  it('answers a path with broken percent-encoding with a plain 400', async () => {
    const res = await send('127.0.0.1', 'GET', '/recipes/x%ED%A0%80');
    expect(res.status).toBe(400);
    expect(res.body).toMatch(/percent-encoding/);
  });
});

describe('sign-in timing', () => {
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

  async function timedSignIn(email: string, password: string): Promise<number> {
    const client = new TestClient();
    const csrf = await client.get<{ csrfToken: string }>('/api/auth/csrf');
    const started = performance.now();
    const res = await client.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, password, csrfToken: csrf.body.csrfToken, json: 'true' }).toString(),
    });
    await res.text();
    return performance.now() - started;
  }

  it('refuses a locked account no faster than a wrong password', async () => {
    const locked = await createUser();
    for (let i = 0; i < 10; i++) await timedSignIn(locked.email, `wrong-password-${i}-xx`);
    const open = await createUser();
    const lockedMs: number[] = [];
    const wrongMs: number[] = [];
    // Interleaved, so a change in the machine's load falls on both alike.
    for (let i = 0; i < 5; i++) {
      lockedMs.push(await timedSignIn(locked.email, TEST_PASSWORD));
      wrongMs.push(await timedSignIn(open.email, `wrong-password-${i}-yy`));
    }
    const ratio = median(lockedMs) / median(wrongMs);
    console.info(
      `[sign-in timing] locked median ${median(lockedMs).toFixed(0)} ms, wrong password ${median(wrongMs).toFixed(0)} ms, ratio ${ratio.toFixed(2)}`,
    );
    expect(ratio).toBeGreaterThan(0.6);
    expect(ratio).toBeLessThan(1.6);
  }, 120_000);
});
