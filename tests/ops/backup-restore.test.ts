import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { backup, restore } from '@/lib/ops/backup';
import { deleteObjects, getObject, putObject } from '@/lib/storage';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

const created: string[] = [];

function scratchDatabase(name: string): string {
  execFileSync('bash', ['scripts/db.sh', 'drop', name], { stdio: 'ignore' });
  execFileSync('bash', ['scripts/db.sh', 'create', name], { stdio: 'ignore' });
  created.push(name);
  return execFileSync('bash', ['scripts/db.sh', 'url', name]).toString().trim();
}

async function query<T>(url: string, text: string, values: unknown[] = []): Promise<T[]> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    return (await client.query(text, values)).rows as T[];
  } finally {
    await client.end();
  }
}

/** Row counts of every table, and one checksum over every version's document. */
async function fingerprint(url: string) {
  const tables = await query<{ name: string }>(
    url,
    `select tablename as name from pg_tables where schemaname = 'public' order by 1`,
  );
  const counts: Record<string, number> = {};
  for (const { name } of tables)
    counts[name] = (await query<{ n: number }>(url, `select count(*)::int as n from "${name}"`))[0].n;
  const [{ sum }] = await query<{ sum: string }>(
    url,
    `select md5(coalesce(string_agg(id::text || document::text, '|' order by id), '')) as sum from recipe_versions`,
  );
  return { counts, versionsChecksum: sum };
}

afterAll(() => {
  for (const name of created) execFileSync('bash', ['scripts/db.sh', 'drop', name], { stdio: 'ignore' });
});

describe('backup and restore', { timeout: 120_000 }, () => {
  it('round-trips the database and the photo bucket: row counts and every version’s document match', async () => {
    const { client } = await signedInClient();
    const recipe = await createRecipeVia(client, { document: paleAle({ title: 'Backed Up Pale' }) });
    await saveVia(client, recipe.recipe.id, recipe.version.id, paleAle({ title: 'Backed Up Pale', notes: 'second' }));
    const photoKey = `backup-test/${crypto.randomUUID()}.jpg`;
    const photoBytes = Buffer.from('not really a jpeg, but bytes are bytes');
    await putObject(photoKey, photoBytes, 'image/jpeg');

    const first = mkdtempSync(path.join(tmpdir(), 'kf-backup-'));
    const second = mkdtempSync(path.join(tmpdir(), 'kf-backup-'));
    try {
      const manifest = await backup(first, process.env.DATABASE_URL!);
      expect(manifest.photos).toBeGreaterThan(0);

      // Restore into a fresh database, with the photo gone from the bucket meanwhile.
      await deleteObjects([photoKey]);
      const restoredUrl = scratchDatabase(`kf_restore_a_${process.pid}`);
      await restore(first, restoredUrl);
      expect(await getObject(photoKey)).toEqual(photoBytes);

      const versions = await query<{ number: number; message: string }>(
        restoredUrl,
        `select v.number, v.message from recipe_versions v join recipes r on r.id = v.recipe_id where r.id = $1 order by v.number`,
        [recipe.recipe.id],
      );
      expect(versions.map((v) => v.number)).toEqual([1, 2]);

      // A backup of the restored database restores to the very same rows.
      await backup(second, restoredUrl);
      const againUrl = scratchDatabase(`kf_restore_b_${process.pid}`);
      await restore(second, againUrl);
      const [a, b] = await Promise.all([fingerprint(restoredUrl), fingerprint(againUrl)]);
      expect(Object.keys(a.counts).length).toBeGreaterThan(5);
      expect(b.counts).toEqual(a.counts);
      expect(b.versionsChecksum).toBe(a.versionsChecksum);

      // Versions stay append-only in the restored database too.
      await expect(query(againUrl, `update recipe_versions set message = 'changed'`)).rejects.toThrow(/append-only/);
    } finally {
      rmSync(first, { recursive: true, force: true });
      rmSync(second, { recursive: true, force: true });
      await deleteObjects([photoKey]);
    }
  });
});
