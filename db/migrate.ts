import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { db, getPool } from './index';

// Applies every pending migration in drizzle/ (idempotent).
await migrate(db, { migrationsFolder: new URL('../drizzle', import.meta.url).pathname });
console.log('migrations applied');
await getPool().end();
