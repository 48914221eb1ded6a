/**
 * Runs the in-memory search fake: `npx tsx scripts/search-fake.ts`.
 * Listens on 127.0.0.1:MEILI_FAKE_PORT (default 7701; 0 picks a free port) and stops on SIGTERM/SIGINT.
 * When started with an IPC channel, it answers the message "memory" with its process.memoryUsage().
 */
import { createFakeSearchServer } from '../lib/search/fake';

function portFromEnv(): number {
  const raw = process.env.MEILI_FAKE_PORT ?? '7701';
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(`MEILI_FAKE_PORT must be a port number from 0 to 65535, got "${raw}"`);
    process.exit(1);
  }
  return port;
}

async function main(): Promise<void> {
  const server = await createFakeSearchServer({
    port: portFromEnv(),
    host: '127.0.0.1',
    apiKey: process.env.MEILI_FAKE_KEY || undefined,
  });
  console.log(`search fake listening on ${server.url}`);

  const stop = () => {
    server.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);

  if (process.send) {
    process.on('message', (message) => {
      if (message === 'memory') {
        (globalThis as { gc?: () => void }).gc?.();
        process.send?.({ memory: process.memoryUsage() });
      }
    });
    process.once('disconnect', stop);
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
