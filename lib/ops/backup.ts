import 'server-only';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { getObject, listObjectKeys, putObject } from '@/lib/storage';

export interface BackupManifest {
  createdAt: string;
  database: string;
  photos: number;
}

/** Finds a PostgreSQL client tool (pg_dump, pg_restore) next to the server binaries or on PATH. */
function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  for (const dir of readdirSync('/usr/lib/postgresql', { withFileTypes: true })
    .filter((d) => d.isDirectory())
    .map((d) => d.name)
    .sort()
    .reverse()) {
    const candidate = `/usr/lib/postgresql/${dir}/bin/${name}`;
    if (existsSync(candidate)) return candidate;
  }
  return name;
}

/** The database without its password, for the manifest. */
function describeDatabase(url: string): string {
  const u = new URL(url);
  return `${u.hostname}:${u.port}${u.pathname}`;
}

/**
 * Writes a backup into `dir`: the database as a pg_dump custom archive and every photo object
 * as a file named by its key, with a manifest.
 */
export async function backup(dir: string, databaseUrl: string): Promise<BackupManifest> {
  mkdirSync(path.join(dir, 'photos'), { recursive: true });
  execFileSync(
    pgTool('pg_dump'),
    ['--format=custom', '--no-owner', '--file', path.join(dir, 'database.dump'), databaseUrl],
    { stdio: 'inherit' },
  );
  const keys = await listObjectKeys();
  for (const key of keys) {
    const body = await getObject(key);
    if (!body) continue;
    const file = path.join(dir, 'photos', key);
    mkdirSync(path.dirname(file), { recursive: true });
    writeFileSync(file, body);
  }
  const manifest = {
    createdAt: new Date().toISOString(),
    database: describeDatabase(databaseUrl),
    photos: keys.length,
  };
  writeFileSync(path.join(dir, 'manifest.json'), JSON.stringify(manifest, null, 2));
  return manifest;
}

function filesBelow(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.relative(dir, path.join(d.parentPath, d.name)));
}

/**
 * Restores a backup into the (empty or existing) database at `databaseUrl`, replacing what is
 * there, and puts every photo back into the bucket.
 */
export async function restore(dir: string, databaseUrl: string): Promise<{ photos: number }> {
  const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as BackupManifest;
  execFileSync(
    pgTool('pg_restore'),
    [
      '--clean',
      '--if-exists',
      '--no-owner',
      '--single-transaction',
      '--dbname',
      databaseUrl,
      path.join(dir, 'database.dump'),
    ],
    { stdio: 'inherit' },
  );
  const files = filesBelow(path.join(dir, 'photos'));
  for (const key of files)
    await putObject(key.split(path.sep).join('/'), readFileSync(path.join(dir, 'photos', key)), 'image/jpeg');
  if (files.length !== manifest.photos)
    throw new Error(`the backup lists ${manifest.photos} photos but holds ${files.length}`);
  return { photos: files.length };
}
