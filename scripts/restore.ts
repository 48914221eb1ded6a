// npm run restore -- <folder>: replaces the database named by DATABASE_URL and refills the photo bucket.
import { restore } from '../lib/ops/backup';
import { env } from '../lib/env';

const dir = process.argv[2];
if (!dir) {
  console.error('usage: npm run restore -- <backup folder>');
  process.exit(2);
}
const { photos } = await restore(dir, env().DATABASE_URL);
console.log(`restored ${dir} into ${new URL(env().DATABASE_URL).pathname.slice(1)}: ${photos} photos`);
process.exit(0);
