import { z } from 'zod';

// Validated once, at first use; a bad or missing variable stops the process with its name.
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DATABASE_URL: z.string().url().default('postgres://postgres@127.0.0.1:54329/kettlefork'),
  /** Read replicas of DATABASE_URL, comma-separated; reads that may lag go there (db/index.ts). */
  DATABASE_REPLICA_URLS: z
    .string()
    .default('')
    .refine((v) => v.split(',').every((u) => !u.trim() || URL.canParse(u.trim())), {
      message: 'DATABASE_REPLICA_URLS must be comma-separated postgres:// addresses',
    }),
  NEXTAUTH_URL: z.string().url().default('http://127.0.0.1:3000'),
  NEXTAUTH_SECRET: z.string().min(32, 'NEXTAUTH_SECRET must be at least 32 characters').optional(),
  SMTP_URL: z.string().default('smtp://127.0.0.1:2525'),
  MAIL_FROM: z.string().default('Kettlefork <no-reply@kettlefork.test>'),
  MAIL_OUTBOX_URL: z.string().url().default('http://127.0.0.1:2580'),
  MEILI_HOST: z.string().url().default('http://127.0.0.1:7701'),
  MEILI_KEY: z.string().optional(),
  KF_SECURE_COOKIES: z.enum(['true', 'false']).optional(),
  S3_ENDPOINT: z.string().url().default('http://127.0.0.1:4569'),
  S3_BUCKET: z.string().min(3).default('kettlefork-photos'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  S3_REGION: z.string().default('us-east-1'),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid environment variables:\n${lines}`);
  }
  cached = parsed.data;
  return cached;
}

/**
 * The secret that signs session cookies and unsubscribe links. Required in production; a
 * development or test process without one gets a random per-process secret.
 */
export function authSecret(): string {
  const { NEXTAUTH_SECRET, NODE_ENV } = env();
  if (NEXTAUTH_SECRET) return NEXTAUTH_SECRET;
  if (NODE_ENV === 'production')
    throw new Error('Invalid environment variables:\n  NEXTAUTH_SECRET: required in production');
  const g = globalThis as { __kfLocalSecret?: string };
  g.__kfLocalSecret ??= Array.from(crypto.getRandomValues(new Uint8Array(32)), (b) =>
    b.toString(16).padStart(2, '0'),
  ).join('');
  return g.__kfLocalSecret;
}
