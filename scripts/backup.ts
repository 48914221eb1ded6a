// npm run backup -- [folder]: the database and the photo bucket, into backups/<timestamp> by default.
import path from 'node:path';
import { backup } from '../lib/ops/backup';
import { env } from '../lib/env';

const dir = process.argv[2] ?? path.join('backups', new Date().toISOString().replace(/[:.]/g, '-'));
const manifest = await backup(dir, env().DATABASE_URL);
console.log(`backup written to ${dir}: database ${manifest.database}, ${manifest.photos} photos`);
process.exit(0);
