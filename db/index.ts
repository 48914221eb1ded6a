import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import { env } from '@/lib/env';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

const globalForDb = globalThis as unknown as { kfPool?: Pool; kfDb?: Database };

function createPool(): Pool {
  const pool = new Pool({
    connectionString: env().DATABASE_URL,
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
