import { count, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { users } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { appLog } from '../helpers/env';
import { waitForMail } from '../helpers/mail';
import { uniqueEmail } from '../helpers/users';
import type { FieldIssue } from '@/lib/errors';

type ApiError = { error: { code: string; message: string; fields: FieldIssue[] } };

async function userCount(): Promise<number> {
  const [{ n }] = await db.select({ n: count() }).from(users);
  return n;
}

describe('sign-up', () => {
  it('creates a member with a bcrypt-hashed password and signs in with it', async () => {
    const client = new TestClient();
    const email = uniqueEmail('signup');
    const res = await client.post<{ message: string }>('/api/accounts', {
      name: 'Perpetua Glass',
      email,
      password: 'barley-wine-winter',
    });
    expect(res.status).toBe(201);
    const [row] = await db.select().from(users).where(eq(users.email, email));
    expect(row.role).toBe('member');
    expect(row.passwordHash).toMatch(/^\$2[aby]\$12\$/);
    expect(row.passwordHash).not.toContain('barley');
    expect(await client.signIn(email, 'barley-wine-winter')).toBe(true);
  });

  it('answers a taken address exactly as a new one, creates nothing and e-mails the owner instead', async () => {
    const client = new TestClient();
    const email = uniqueEmail('case');
    const first = await client.post<{ message: string }>('/api/accounts', {
      name: 'Case One',
      email,
      password: 'barley-wine-winter',
    });
    expect(first.status).toBe(201);
    // The same address in another case is the same address (stored in lower case).
    const again = await client.post<{ message: string }>('/api/accounts', {
      name: 'Case Two',
      email: email.toUpperCase(),
      password: 'another-long-password',
    });
    expect(again.status).toBe(first.status);
    expect(again.body).toEqual(first.body);
    const rows = await db.select({ name: users.name }).from(users).where(eq(users.email, email));
    expect(rows).toEqual([{ name: 'Case One' }]);
    const notice = await waitForMail(email, (m) => /tried to sign up/.test(m.subject));
    expect(notice.text).toMatch(/already have an account/);
    expect(notice.text).toContain('/sign-in');
    // The owner's password still works; the second one never became a password.
    expect(await client.signIn(email, 'barley-wine-winter')).toBe(true);
    expect(await new TestClient().signIn(email, 'another-long-password')).toBe(false);
  });

  it('gives two members signing up at once with the same name each an account with their own handle', async () => {
    const name = `Racing Brewer ${Date.now()}`;
    const [a, b] = await Promise.all(
      [0, 1].map(() =>
        new TestClient().post('/api/accounts', { name, email: uniqueEmail('race'), password: 'barley-wine-winter' }),
      ),
    );
    expect([a.status, b.status]).toEqual([201, 201]);
    const rows = await db.select({ handle: users.handle }).from(users).where(eq(users.name, name));
    expect(rows).toHaveLength(2);
    expect(new Set(rows.map((r) => r.handle)).size).toBe(2);
  });

  it('keeps one account when the same address signs up twice at once, and answers both alike', async () => {
    const email = uniqueEmail('double');
    const answers = await Promise.all(
      [0, 1].map(() =>
        new TestClient().post('/api/accounts', { name: 'Double Click', email, password: 'barley-wine-winter' }),
      ),
    );
    expect(answers.map((r) => r.status)).toEqual([201, 201]);
    expect(answers[0].body).toEqual(answers[1].body);
    expect(await db.select({ id: users.id }).from(users).where(eq(users.email, email))).toHaveLength(1);
  });

  it('never writes a password hash or a query parameter into the server log', () => {
    const log = appLog();
    expect(log).not.toMatch(/\$2[aby]\$\d\d\$/);
    expect(log).not.toMatch(/params:/);
  });

  it('refuses a short password, a common password and a malformed e-mail with a message per field, creating nothing', async () => {
    const before = await userCount();
    const client = new TestClient();
    const res = await client.post<ApiError>('/api/accounts', { name: 'X', email: 'not-an-address', password: 'short' });
    expect(res.status).toBe(400);
    const paths = res.body.error.fields.map((f) => f.path).sort();
    expect(paths).toEqual(['email', 'name', 'password']);
    expect(res.body.error.fields.find((f) => f.path === 'password')?.message).toMatch(/at least 12 characters/);
    const common = await client.post<ApiError>('/api/accounts', {
      name: 'Common Pat',
      email: uniqueEmail(),
      password: 'password1234',
    });
    expect(common.status).toBe(400);
    expect(common.body.error.fields[0].message).toMatch(/most common/);
    expect(await userCount()).toBe(before);
  });

  it('answers malformed JSON with 400 and a message, never a 500', async () => {
    const client = new TestClient();
    const res = await client.json<ApiError>('POST', '/api/accounts', '{"name": "Bad', {
      'content-type': 'application/json',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/not valid JSON/);
  });

  it('refuses a state change sent from another site', async () => {
    const client = new TestClient();
    const res = await client.json(
      'POST',
      '/api/accounts',
      { name: 'Cross Site', email: uniqueEmail(), password: 'barley-wine-winter' },
      {
        origin: 'https://elsewhere.example',
      },
    );
    expect(res.status).toBe(403);
  });
});
