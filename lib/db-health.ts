import { Pool } from 'pg';

const CHECK_EVERY_MS = 250;

const globalForHealth = globalThis as unknown as {
  kfHealthPool?: Pool;
  kfHealth?: { at: number; ok: boolean; pending?: Promise<boolean> };
};

function healthPool(): Pool {
  globalForHealth.kfHealthPool ??= new Pool({
    connectionString: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/kettlefork',
    max: 1,
    connectionTimeoutMillis: 1_000,
    query_timeout: 1_000,
    idleTimeoutMillis: 10_000,
  });
  globalForHealth.kfHealthPool.on('error', () => undefined);
  return globalForHealth.kfHealthPool;
}

/**
 * Whether PostgreSQL answers, checked at most four times a second and never waiting more than about
 * a second: pages use it to answer a plain 503 during an outage instead of hanging.
 */
export async function databaseReachable(): Promise<boolean> {
  const state = (globalForHealth.kfHealth ??= { at: 0, ok: true });
  if (Date.now() - state.at < CHECK_EVERY_MS) return state.ok;
  state.pending ??= healthPool()
    .query('select 1')
    .then(
      () => true,
      () => false,
    )
    .then((ok) => {
      Object.assign(state, { at: Date.now(), ok, pending: undefined });
      return ok;
    });
  return state.pending;
}
