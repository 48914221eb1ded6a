import { execFileSync } from 'node:child_process';
import { chownSync, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

// A real streaming replica of the test cluster, on loopback beside it: pg_basebackup -R copies the
// running cluster and writes the standby settings, and the copy follows the primary's WAL.
// The standby needs at least the primary's max_connections (scripts/db.sh starts it with 200).
const primaryUrl = new URL(process.env.DATABASE_URL!);
const primaryPort = Number(primaryUrl.port);
const replicaPort = primaryPort + 40;
// Beside the primary's cluster, which scripts/db.sh keeps where the postgres user can reach it
// (outside the checkout when the checkout sits in a private folder).
const primaryDir = execFileSync('bash', ['scripts/db.sh', 'where']).toString().trim();
const replicaDir = path.join(path.dirname(primaryDir), `pg-replica-${primaryPort}`);
const replicaUrl = Object.assign(new URL(primaryUrl), { port: String(replicaPort) }).toString();

function bindir(): string {
  try {
    return execFileSync('pg_config', ['--bindir']).toString().trim();
  } catch {
    return execFileSync('bash', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1']).toString().trim();
  }
}

/** Runs a PostgreSQL program as the postgres OS user when we are root, as scripts/db.sh does. */
function asPostgres(program: string, args: string[]) {
  const bin = path.join(bindir(), program);
  // From / so a working folder the postgres user cannot enter does not matter.
  if (process.getuid?.() === 0)
    execFileSync('runuser', ['-u', 'postgres', '--', bin, ...args], { stdio: 'pipe', cwd: '/' });
  else execFileSync(bin, args, { stdio: 'pipe', cwd: '/' });
}

function stopReplica() {
  try {
    asPostgres('pg_ctl', ['-D', replicaDir, '-m', 'immediate', '-w', 'stop']);
  } catch {
    // not running
  }
}

async function onReplica<T>(query: string): Promise<T> {
  const client = new Client({ connectionString: replicaUrl });
  await client.connect();
  try {
    return (await client.query(query)).rows[0] as T;
  } finally {
    await client.end();
  }
}

async function until(check: () => Promise<boolean>, what: string) {
  for (let i = 0; i < 100; i++) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`timed out waiting for ${what}`);
}

describe('read replicas', () => {
  beforeAll(async () => {
    stopReplica();
    rmSync(replicaDir, { recursive: true, force: true });
    mkdirSync(replicaDir, { recursive: true, mode: 0o700 });
    if (process.getuid?.() === 0) {
      const uid = Number(execFileSync('id', ['-u', 'postgres']).toString());
      const gid = Number(execFileSync('id', ['-g', 'postgres']).toString());
      chownSync(replicaDir, uid, gid);
    }
    asPostgres('pg_basebackup', [
      '-h',
      '127.0.0.1',
      '-p',
      String(primaryPort),
      '-U',
      'postgres',
      '-D',
      replicaDir,
      '-R',
      '-X',
      'stream',
      '-c',
      'fast',
    ]);
    asPostgres('pg_ctl', [
      '-D',
      replicaDir,
      '-l',
      path.join(replicaDir, 'replica.log'),
      '-w',
      '-t',
      '60',
      '-o',
      `-p ${replicaPort} -c listen_addresses=127.0.0.1 -c unix_socket_directories=${replicaDir} -c hot_standby=on -c max_connections=200`,
      'start',
    ]);
    await until(
      async () => (await onReplica<{ r: boolean }>('select pg_is_in_recovery() as r').catch(() => null))?.r === true,
      'the replica to accept reads',
    );
  }, 120_000);

  afterAll(() => {
    stopReplica();
    rmSync(replicaDir, { recursive: true, force: true });
  });

  it('serves public listings from the replica and reads a save back from the primary', async () => {
    // The app's modules, loaded afresh with the replica configured.
    process.env.DATABASE_REPLICA_URLS = replicaUrl;
    vi.resetModules();
    const { readDatabase } = await import('@/db');
    const { listRecipes } = await import('@/lib/recipes/listing');
    const { sql } = await import('drizzle-orm');
    expect(readDatabase()).toHaveProperty('$primary');

    const { client: owner, user } = await signedInClient();
    const viewer = { id: user.id };
    const first = await createRecipeVia(owner, { document: paleAle({ title: 'Replica Warm-up Pale' }) });
    await until(
      async () => (await listRecipes(null)).cards.some((c) => c.id === first.recipe.id),
      'the replica to catch up',
    );
    // Selects through readDatabase() are answered by the standby, which is in recovery.
    const { users } = await import('@/db/schema');
    const [where] = await readDatabase()
      .select({ standby: sql<boolean>`pg_is_in_recovery()` })
      .from(users)
      .limit(1);
    expect(where).toEqual({ standby: true });

    // Hold the replica back: it stops applying the primary's changes until resumed.
    await onReplica('select pg_wal_replay_pause()');
    try {
      const saved = await createRecipeVia(owner, { document: paleAle({ title: 'Saved During Replica Pause' }) });
      // A public listing comes from the paused replica, so it does not have the new recipe yet…
      expect((await listRecipes(null)).cards.map((c) => c.id)).not.toContain(saved.recipe.id);
      // …while the owner's own listing (read-your-own-write) comes from the primary and does.
      const mine = await listRecipes(viewer, { ownerHandle: user.handle });
      expect(mine.cards.map((c) => c.title)).toContain('Saved During Replica Pause');
      // And the save itself is on the primary, read back through the app at once.
      const back = await owner.get<{ recipe: { headVersionId: string } }>(`/api/recipes/${saved.recipe.id}`);
      expect(back.status).toBe(200);
      expect(back.body.recipe.headVersionId).toBe(saved.version.id);
    } finally {
      await onReplica('select pg_wal_replay_resume()');
    }
    await until(
      async () => (await listRecipes(null)).cards.some((c) => c.title === 'Saved During Replica Pause'),
      'the replica to apply the paused changes',
    );
  });
});
