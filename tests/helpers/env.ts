/** Where the app under test is served (scripts/test.sh starts it). */
export const BASE_URL = process.env.KF_BASE_URL ?? 'http://127.0.0.1:3100';
export const MAIL_OUTBOX_URL = process.env.MAIL_OUTBOX_URL ?? 'http://127.0.0.1:2581';
