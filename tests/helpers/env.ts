import { existsSync, readFileSync } from 'node:fs';

/** Where the app under test is served (scripts/test.sh starts it). */
export const BASE_URL = process.env.KF_BASE_URL ?? 'http://127.0.0.1:3100';
export const MAIL_OUTBOX_URL = process.env.MAIL_OUTBOX_URL ?? 'http://127.0.0.1:2581';

/** What the app under test has written to its log so far (scripts/test.sh keeps it per test slot). */
export function appLog(): string {
  const slot = process.env.KF_TEST_SLOT ?? '0';
  const file = `.data/logs/test-app${slot === '0' ? '' : `-${slot}`}.log`;
  if (!existsSync(file)) throw new Error(`the app's log is not at ${file}`);
  return readFileSync(file, 'utf8');
}
