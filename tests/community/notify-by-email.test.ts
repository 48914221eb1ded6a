import { and, eq, isNull } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { notificationEmails } from '@/db/schema';
import { EMAIL_DIGEST_INTERVAL_MIN, flushEmailNotifications } from '@/lib/notifications/email';
import { notify } from '@/lib/notifications/notify';
import { unsubscribeToken } from '@/lib/notifications/unsubscribe-token';
import { sendMail } from '@/lib/mail';
import { MAIL_OUTBOX_URL } from '../helpers/env';
import { TestClient } from '../helpers/http';
import { waitForMail } from '../helpers/mail';
import { createRecipeVia } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';
import type { StoredMessage } from '@/lib/mail/fake/server';
import { commentVia } from './helpers';

async function mailsTo(to: string): Promise<StoredMessage[]> {
  const res = await fetch(`${MAIL_OUTBOX_URL}/messages?to=${encodeURIComponent(to)}`);
  return ((await res.json()) as { messages: StoredMessage[] }).messages;
}

async function pending(userId: string) {
  return db
    .select()
    .from(notificationEmails)
    .where(and(eq(notificationEmails.userId, userId), isNull(notificationEmails.sentAt)));
}

const later = (minutes: number) => new Date(Date.now() + minutes * 60_000);

describe('notifications in the site', () => {
  it('counts unread notifications for the bell and marks them read', async () => {
    const { client: owner } = await signedInClient();
    const { client: reader } = await signedInClient();
    const recipe = await createRecipeVia(owner);
    await commentVia(reader, recipe.recipe.id, 'Lovely colour.');
    await reader.put(`/api/recipes/${recipe.recipe.id}/star`);
    expect((await owner.get('/api/notifications/unread')).body).toEqual({ unread: 2 });
    const list = await owner.get<{ items: { text: string; url: string; read: boolean }[] }>('/api/notifications');
    expect(list.body.items.map((i) => i.text)).toEqual([
      expect.stringMatching(/starred/),
      expect.stringMatching(/commented on/),
    ]);
    expect(list.body.items[1].url).toMatch(new RegExp(`^/recipes/${recipe.recipe.slug}#comment-`));
    expect((await owner.post('/api/notifications/read', {})).status).toBe(200);
    expect((await owner.get('/api/notifications/unread')).body).toEqual({ unread: 0 });
    expect((await reader.get('/api/notifications/unread')).body).toEqual({ unread: 0 });
    expect((await new TestClient().get('/api/notifications')).status).toBe(401);
  });
});

describe('notifications by e-mail', () => {
  it('delivers a comment notice to the SMTP fake with a one-click unsubscribe link that works without signing in', async () => {
    const { client: owner, user: ownerUser } = await signedInClient();
    const { client: reader } = await signedInClient();
    const recipe = await createRecipeVia(owner);
    await commentVia(reader, recipe.recipe.id, 'What yeast did you use?');
    await flushEmailNotifications();
    const mail = await waitForMail(ownerUser.email, (m) => m.subject.includes('commented on'));
    expect(mail.text).toContain('What yeast did you use?');
    expect(mail.text).toContain(`/recipes/${recipe.recipe.slug}#comment-`);
    // The fake keeps the parsed List-* headers together under `list`.
    const headers = JSON.stringify(mail.headers);
    expect(headers).toContain(`/api/unsubscribe?token=${ownerUser.id}.comment.`);
    expect(headers).toContain('List-Unsubscribe=One-Click');
    const link = mail.text.match(/Stop e-mails like this[^:]*: (\S+)/)![1];

    const anonymous = new TestClient();
    const res = await anonymous.fetch(new URL(link).pathname + new URL(link).search);
    expect(res.status).toBe(303);
    const landing = await anonymous.fetch(res.headers.get('location')!.replace(/^https?:\/\/[^/]+/, ''));
    expect(landing.status).toBe(200);
    expect(await landing.text()).toContain('You are unsubscribed');
    const settings = await owner.get<{ settings: { emailChoices: Record<string, boolean> } }>('/api/me/settings');
    expect(settings.body.settings.emailChoices).toMatchObject({ comment: false, star: true });

    // Comments no longer queue e-mails; stars still do.
    await commentVia(reader, recipe.recipe.id, 'Another question');
    await reader.put(`/api/recipes/${recipe.recipe.id}/star`);
    expect((await pending(ownerUser.id)).map((p) => p.kind)).toEqual(['star']);
  });

  it('takes the mail client’s one-click POST, refuses a forged token and lets the member undo', async () => {
    const user = await createUser();
    const client = new TestClient();
    const good = unsubscribeToken(user.id, 'star');
    const forged = unsubscribeToken(user.id, 'star').replace(/.$/, (c) => (c === 'A' ? 'B' : 'A'));
    const otherKind = good.replace('.star.', '.fork.');
    expect((await client.post(`/api/unsubscribe?token=${encodeURIComponent(forged)}`)).status).toBe(400);
    expect((await client.post(`/api/unsubscribe?token=${encodeURIComponent(otherKind)}`)).status).toBe(400);
    const oneClick = await client.fetch(`/api/unsubscribe?token=${encodeURIComponent(good)}`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'List-Unsubscribe=One-Click',
    });
    expect(oneClick.status).toBe(200);
    expect(await oneClick.json()).toMatchObject({ scope: 'star', email: false });
    const undo = await client.post(`/api/unsubscribe?token=${encodeURIComponent(good)}&resubscribe=1`);
    expect(undo.body).toMatchObject({ email: true });
  });

  it('gathers a member’s notices into one message at most every few minutes', async () => {
    const { client: ownerClient, user: owner } = await signedInClient();
    const actor = await createUser({ name: 'Busy Brewer' });
    const recipe = await createRecipeVia(ownerClient);
    await db.transaction(async (tx) => {
      for (const kind of ['comment', 'brewed', 'fork'] as const) {
        await notify(tx, {
          userId: owner.id,
          kind,
          actorId: actor.id,
          recipeId: recipe.recipe.id,
          url: `/recipes/${recipe.recipe.slug}`,
        });
      }
    });
    await flushEmailNotifications();
    const digest = await waitForMail(owner.email, (m) => m.subject === '3 new things on Kettlefork');
    expect(digest.text).toContain('Busy Brewer brewed');
    expect(digest.text).toContain('Busy Brewer forked your recipe');
    expect(JSON.stringify(digest.headers)).toContain(`/api/unsubscribe?token=${owner.id}.all.`);

    await db.transaction((tx) =>
      notify(tx, { userId: owner.id, kind: 'brewed', actorId: actor.id, recipeId: recipe.recipe.id, url: '/' }),
    );
    await flushEmailNotifications();
    expect(await pending(owner.id)).toHaveLength(1);
    expect(await mailsTo(owner.email)).toHaveLength(1);
    await flushEmailNotifications({ now: later(EMAIL_DIGEST_INTERVAL_MIN + 1) });
    await waitForMail(owner.email, (m) => m.id !== digest.id);
    expect(await pending(owner.id)).toHaveLength(0);
  });

  it('keeps notices queued while the SMTP server is down and delivers them when it is back', async () => {
    const owner = await createUser();
    const actor = await createUser({ name: 'Patient Brewer' });
    await db.transaction((tx) => notify(tx, { userId: owner.id, kind: 'brewed', actorId: actor.id, url: '/' }));
    const down = await flushEmailNotifications({
      send: async () => {
        throw new Error('connect ECONNREFUSED 127.0.0.1:25');
      },
    });
    expect(down.failed).toBeGreaterThanOrEqual(1);
    const [row] = await pending(owner.id);
    expect(row).toMatchObject({ attempts: 1, lastError: expect.stringContaining('ECONNREFUSED') });
    await flushEmailNotifications({ send: sendMail });
    await waitForMail(owner.email, (m) => m.subject.includes('Patient Brewer brewed'));
    // The failed attempt sent nothing, so the notice arrives exactly once.
    expect(await mailsTo(owner.email)).toHaveLength(1);
    expect(await pending(owner.id)).toHaveLength(0);
  });
});
