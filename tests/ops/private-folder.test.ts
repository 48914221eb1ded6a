import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import { afterAll, describe, expect, it } from 'vitest';

// A checkout inside a private folder (mode 0700, like root's home): the PostgreSQL server runs as
// the postgres OS user when we are root, and that user cannot enter the folder, so scripts/db.sh
// must keep the cluster where it can reach it, and stop, reset and status must find it again.
const parent = mkdtempSync(path.join(tmpdir(), 'kf-private-'));
const checkout = path.join(parent, 'kettlefork');
mkdirSync(path.join(checkout, 'scripts'), { recursive: true });
copyFileSync('scripts/db.sh', path.join(checkout, 'scripts', 'db.sh'));
execFileSync('chmod', ['700', parent]);

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

let port = 0;
function db(...args: string[]): string {
  return execFileSync('bash', [path.join(checkout, 'scripts', 'db.sh'), ...args], {
    env: { ...process.env, KF_PG_PORT: String(port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
    .toString()
    .trim();
}

async function selectOne(url: string): Promise<number> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query('select 1 as one')).rows[0].one;
  } finally {
    await client.end();
  }
}

let clusterDir = '';
afterAll(() => {
  try {
    db('stop');
  } catch {
    // already stopped
  }
  if (clusterDir && !clusterDir.startsWith(checkout))
    rmSync(path.dirname(clusterDir), { recursive: true, force: true });
  rmSync(parent, { recursive: true, force: true });
});

describe('the local database from a checkout inside a private folder', () => {
  it('starts, answers, stops, resets and reports its status', async () => {
    port = await freePort();
    expect(db('start')).toContain(`running on 127.0.0.1:${port}`);
    clusterDir = db('where');
    if (process.getuid?.() === 0) {
      // The server's user cannot enter the 0700 parent, so the cluster lives outside the checkout.
      expect(clusterDir.startsWith(checkout)).toBe(false);
    } else {
      expect(clusterDir).toBe(path.join(checkout, '.data', 'pg'));
    }
    expect(db('status')).toBe(`running on 127.0.0.1:${port}`);

    db('create', 'kf_private_check');
    expect(await selectOne(db('url', 'kf_private_check'))).toBe(1);

    // A second start finds the running cluster instead of making another.
    expect(db('start')).toContain('already running');

    db('reset');
    expect(db('where')).toBe(clusterDir);
    expect(db('status')).toBe(`running on 127.0.0.1:${port}`);

    expect(db('stop')).toBe('PostgreSQL stopped');
    expect(() => db('status')).toThrow();
  });
});
