// Serves the production build on every core: the primary process forks one `next start`
// worker per core and they share the listening socket. Background loops (search sync,
// e-mail digests) run in the first worker only; both are safe to run twice, but once is enough.
// Each worker's server runs scripts/request-guard.mjs first: it refuses paths that do not decode
// and tells the app the client's socket address.
import cluster from 'node:cluster';
import http from 'node:http';
import { availableParallelism } from 'node:os';
import { guardServers } from './request-guard.mjs';

const count = Math.max(1, Number(process.env.KF_WORKERS ?? availableParallelism()));

if (cluster.isPrimary && count > 1) {
  let stopping = false;
  const fork = (index) => {
    const background = index === 0 ? {} : { KF_SEARCH_SYNC: 'off', KF_EMAIL_SENDER: 'off' };
    const worker = cluster.fork({ ...background, KF_WORKER_INDEX: String(index) });
    worker.on('exit', (code, signal) => {
      if (stopping) return;
      console.error(`worker ${index} stopped (${signal ?? code}); starting another`);
      setTimeout(() => fork(index), 500);
    });
  };
  for (let i = 0; i < count; i++) fork(i);
  const stop = (signal) => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill(signal);
    setTimeout(() => process.exit(0), 5_000).unref();
    cluster.on('exit', () => {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
    });
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
} else {
  guardServers(http);
  process.argv = [process.argv[0], 'next', 'start', ...process.argv.slice(2)];
  await import('next/dist/bin/next');
}
