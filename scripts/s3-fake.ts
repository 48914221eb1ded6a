/**
 * Runs the local S3 fake (s3rver) that keeps photo objects on disk under .data/s3:
 * `node --import tsx scripts/s3-fake.ts`. Port from S3_FAKE_PORT (default 4569), bucket from
 * S3_BUCKET (default kettlefork-photos, created at start), directory from S3_FAKE_DIR.
 */
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

const port = Number(process.env.S3_FAKE_PORT ?? 4569);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`S3_FAKE_PORT must be a port number from 0 to 65535, got "${process.env.S3_FAKE_PORT}"`);
  process.exit(1);
}
const directory = process.env.S3_FAKE_DIR ?? '.data/s3';
const bucket = process.env.S3_BUCKET ?? 'kettlefork-photos';
mkdirSync(directory, { recursive: true });

const server = new S3rver({
  port,
  address: '127.0.0.1',
  directory,
  silent: true,
  configureBuckets: [{ name: bucket, configs: [] }],
});
await server.run();
console.log(`S3 fake listening on http://127.0.0.1:${port}, bucket ${bucket}, objects in ${directory}`);

for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.on(signal, () => {
    void server.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  });
}
