import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { withReplicas } from 'drizzle-orm/pg-core';
import { Pool } from 'pg';
import { env } from '@/lib/env';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

const globalForDb = globalThis as unknown as {
  kfPool?: Pool;
  kfDb?: Database;
  kfReadDb?: { urls: string; db: Database };
};

function createPool(connectionString: string = env().DATABASE_URL): Pool {
  const pool = new Pool({
    connectionString,
    max: Number(process.env.KF_PG_POOL_MAX ?? 10),
    connectionTimeoutMillis: 5_000,
    idleTimeoutMillis: 30_000,
    // A query that hangs (for example while the server restarts) must not hold a request forever.
    query_timeout: 8_000,
  });
  // An idle client losing its connection must not crash the process; the pool replaces it.
  pool.on('error', (err) => console.error('[db] idle client error:', err.message));
  return pool;
}

export function getPool(): Pool {
  globalForDb.kfPool ??= createPool();
  return globalForDb.kfPool;
}

// Cached on globalThis so hot reloads in development reuse one pool.
export const db: Database = (globalForDb.kfDb ??= drizzle(getPool(), { schema }));

/**
 * For reads that may lag the primary by a moment: public listings, public pages, search rebuilds.
 * With `DATABASE_REPLICA_URLS` set (comma-separated) Drizzle's `withReplicas` sends its selects to a
 * replica picked at random and anything else (and `readDb.$primary`) to the primary; without it this
 * is the primary. Writes, transactions and read-your-own-write paths (the editor after a save, the
 * 409 head check, an owner's own listing) use `db`, which is always the primary.
 */
export function readDatabase(): Database {
  const urls = env().DATABASE_REPLICA_URLS;
  if (!urls) return db;
  if (globalForDb.kfReadDb?.urls !== urls) {
    const replicas = urls
      .split(',')
      .map((u) => u.trim())
      .filter(Boolean)
      .map((url) => drizzle(createPool(url), { schema }));
    const [first, ...rest] = replicas;
    globalForDb.kfReadDb = { urls, db: first ? withReplicas(db, [first, ...rest]) : db };
  }
  return globalForDb.kfReadDb.db;
}
