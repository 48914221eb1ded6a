import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';

describe('pages and errors', () => {
  it('answers an unknown page with a designed 404', async () => {
    const res = await new TestClient().fetch('/no-such-shelf');
    expect(res.status).toBe(404);
    expect(await res.text()).toContain('Nothing on this shelf');
  });

  it('sends the security headers on every page', async () => {
    const res = await new TestClient().fetch('/');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
  });

  it('sends signed-out visitors of admin pages to sign-in, and shows members a 404', async () => {
    const anon = await new TestClient().fetch('/admin/users');
    expect([302, 307]).toContain(anon.status);
    expect(anon.headers.get('location')).toMatch(/\/sign-in\?callbackUrl=%2Fadmin%2Fusers/);
    const { client } = await signedInClient('member');
    expect((await client.fetch('/admin/users')).status).toBe(404);
    const { client: admin } = await signedInClient('admin');
    const page = await admin.fetch('/admin/users');
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Members and roles');
  });
});
