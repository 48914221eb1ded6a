import { describe, expect, it } from 'vitest';
import { BASE_URL } from '../helpers/env';
import { TestClient } from '../helpers/http';
import { waitForMail } from '../helpers/mail';
import { createUser, uniqueEmail } from '../helpers/users';

function linkIn(text: string): string {
  const match = text.match(/https?:\/\/\S+\/api\/auth\/callback\/email\S+/);
  if (!match) throw new Error(`no sign-in link in: ${text}`);
  return match[0];
}

describe('sign-in by e-mail link', () => {
  it('delivers a link through SMTP that signs in once; a second use is refused', async () => {
    const user = await createUser();
    const client = new TestClient();
    expect(await client.requestMagicLink(user.email)).toBe(200);
    const mail = await waitForMail(user.email, (m) => /sign-in link/.test(m.subject));
    const link = linkIn(mail.text);
    expect(link.startsWith(BASE_URL)).toBe(true);

    const first = await client.fetch(link.slice(BASE_URL.length));
    expect(first.status).toBe(302);
    expect((await client.me())?.id).toBe(user.id);

    const other = new TestClient();
    const second = await other.fetch(link.slice(BASE_URL.length));
    expect(second.headers.get('location')).toMatch(/error=Verification/);
    expect(await other.isSignedIn()).toBe(false);
  });

  it('answers the same for an address with no account, and mails it a sign-up note instead of a link', async () => {
    const email = uniqueEmail('nobody');
    expect(await new TestClient().requestMagicLink(email)).toBe(200);
    const mail = await waitForMail(email);
    expect(mail.text).toMatch(/no account yet/);
    expect(mail.text).not.toMatch(/callback\/email/);
  });
});
