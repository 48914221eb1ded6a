import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { TEST_PASSWORD, createUser } from '../helpers/users';

describe('sign-in with a password', () => {
  it('signs in with the right password and sets an HttpOnly, SameSite=Lax session cookie', async () => {
    const user = await createUser();
    const client = new TestClient();
    const csrf = await client.get<{ csrfToken: string }>('/api/auth/csrf');
    const res = await client.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        email: user.email,
        password: TEST_PASSWORD,
        csrfToken: csrf.body.csrfToken,
        json: 'true',
      }).toString(),
    });
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('next-auth.session-token='));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect((await client.me())?.id).toBe(user.id);
  });

  it('gives the same answer for a wrong password and for no such account', async () => {
    const user = await createUser();
    const wrong = new TestClient();
    const nobody = new TestClient();
    expect(await wrong.signIn(user.email, 'not-the-right-password')).toBe(false);
    expect(await nobody.signIn('nobody-here@kettlefork.test', 'not-the-right-password')).toBe(false);
    expect(wrong.hasCookie('next-auth.session-token')).toBe(false);
    expect(nobody.hasCookie('next-auth.session-token')).toBe(false);
  });

  it('refuses a suspended member even with the right password', async () => {
    const user = await createUser({ suspended: true });
    expect(await new TestClient().signIn(user.email, TEST_PASSWORD)).toBe(false);
  });

  it('gives each sign-in its own session, and signing out ends it on the server', async () => {
    const user = await createUser();
    const a = new TestClient();
    const b = new TestClient();
    await a.signIn(user.email, TEST_PASSWORD);
    await b.signIn(user.email, TEST_PASSWORD);
    expect(a.cookieHeader()).not.toBe(b.cookieHeader());
    const stolen = new TestClient();
    // Replay a's cookie after a signs out: the server must no longer accept it.
    const replayCookie = a.cookieHeader();
    await a.signOut();
    expect(await a.isSignedIn()).toBe(false);
    const replay = await stolen.fetch('/api/me', { headers: { cookie: replayCookie } });
    expect(((await replay.json()) as { viewer: unknown }).viewer).toBeNull();
    expect(await b.isSignedIn()).toBe(true);
  });

  it('limits attempts per account: after ten failures even the right password is refused for a while', async () => {
    const user = await createUser();
    for (let i = 0; i < 10; i++) {
      // A different address each time, so only the per-account limit applies.
      expect(await new TestClient().signIn(user.email, `wrong-password-${i}-xx`)).toBe(false);
    }
    expect(await new TestClient().signIn(user.email, TEST_PASSWORD)).toBe(false);
  });

  // 32 sign-ins, each a bcrypt compare on the server.
  it('limits attempts per address across accounts', { timeout: 120_000 }, async () => {
    const address = `10.250.${process.pid % 250}.1`;
    for (let i = 0; i < 30; i++) {
      await new TestClient(address).signIn(`nobody-${i}@kettlefork.test`, 'wrong-password-xx');
    }
    const user = await createUser();
    expect(await new TestClient(address).signIn(user.email, TEST_PASSWORD)).toBe(false);
    expect(await new TestClient().signIn(user.email, TEST_PASSWORD)).toBe(true);
  });
});
