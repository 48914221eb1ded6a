import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { moderationActions } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { createUser, reloadUser, signedInClient, TEST_PASSWORD } from '../helpers/users';

describe('role guards', () => {
  it('refuses a member a moderator action with 403 and allows a moderator, who is logged', async () => {
    const target = await createUser();
    const { client: member } = await signedInClient('member');
    const refused = await member.put(`/api/users/${target.id}/suspension`, { suspended: true, reason: 'spam' });
    expect(refused.status).toBe(403);
    expect((await reloadUser(target.id)).suspendedAt).toBeNull();

    const { client: moderator, user: mod } = await signedInClient('moderator');
    const allowed = await moderator.put(`/api/users/${target.id}/suspension`, { suspended: true, reason: 'spam' });
    expect(allowed.status).toBe(200);
    expect((await reloadUser(target.id)).suspendedAt).not.toBeNull();
    const log = await db
      .select()
      .from(moderationActions)
      .where(and(eq(moderationActions.targetId, target.id), eq(moderationActions.actorId, mod.id)));
    expect(log.map((l) => l.action)).toEqual(['suspend_user']);
  });

  it('signed-out requests get 401, not 403', async () => {
    const target = await createUser();
    const res = await new TestClient().put(`/api/users/${target.id}/suspension`, { suspended: true });
    expect(res.status).toBe(401);
  });

  it('a suspension ends the member’s open sessions at once', async () => {
    const { client: victim, user } = await signedInClient('member');
    const { client: moderator } = await signedInClient('moderator');
    expect(await victim.isSignedIn()).toBe(true);
    await moderator.put(`/api/users/${user.id}/suspension`, { suspended: true, reason: 'abuse' });
    expect(await victim.isSignedIn()).toBe(false);
    expect(await new TestClient().signIn(user.email, TEST_PASSWORD)).toBe(false);
  });

  it('a moderator cannot suspend another moderator or an admin, and cannot change roles', async () => {
    const { client: moderator, user: mod } = await signedInClient('moderator');
    const otherMod = await createUser({ role: 'moderator' });
    const admin = await createUser({ role: 'admin' });
    expect((await moderator.put(`/api/users/${otherMod.id}/suspension`, { suspended: true })).status).toBe(403);
    expect((await moderator.put(`/api/users/${admin.id}/suspension`, { suspended: true })).status).toBe(403);
    expect((await moderator.put(`/api/admin/users/${mod.id}/role`, { role: 'admin' })).status).toBe(403);
    expect((await reloadUser(mod.id)).role).toBe('moderator');
  });

  it('an admin changes a role, which applies to the member’s next request; nobody changes their own', async () => {
    const { client: admin, user: adminUser } = await signedInClient('admin');
    const { client: member, user } = await signedInClient('member');
    const res = await admin.put(`/api/admin/users/${user.id}/role`, { role: 'moderator' });
    expect(res.status).toBe(200);
    expect((await member.me())?.role).toBe('moderator');
    expect((await admin.put(`/api/admin/users/${adminUser.id}/role`, { role: 'member' })).status).toBe(403);
    const bad = await admin.put<{ error: { fields: { path: string }[] } }>(`/api/admin/users/${user.id}/role`, {
      role: 'overlord',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('role');
  });

  it('a role sent by the client is ignored', async () => {
    const client = new TestClient();
    const user = await createUser();
    await client.signIn(user.email, TEST_PASSWORD);
    const res = await client.fetch('/api/me', { headers: { 'x-role': 'admin' } });
    expect(((await res.json()) as { viewer: { role: string } }).viewer.role).toBe('member');
  });
});
