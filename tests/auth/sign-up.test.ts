import { count, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { users } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { uniqueEmail } from '../helpers/users';

type ApiError = { error: { code: string; message: string; fields: { path: string; message: string }[] } };

async function userCount(): Promise<number> {
  const [{ n }] = await db.select({ n: count() }).from(users);
  return n;
}

describe('sign-up', () => {
  it('creates a member with a bcrypt-hashed password and signs in with it', async () => {
    const client = new TestClient();
    const email = uniqueEmail('signup');
    const res = await client.post<{ user: { handle: string } }>('/api/accounts', {
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

  it('stores e-mail addresses in lower case, so the same address cannot sign up twice in another case', async () => {
    const client = new TestClient();
    const email = uniqueEmail('case');
    expect(
      (await client.post('/api/accounts', { name: 'Case One', email, password: 'barley-wine-winter' })).status,
    ).toBe(201);
    const again = await client.post<ApiError>('/api/accounts', {
      name: 'Case Two',
      email: email.toUpperCase(),
      password: 'barley-wine-winter',
    });
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toEqual([{ path: 'email', message: expect.stringMatching(/already exists/) }]);
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
