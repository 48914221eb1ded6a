import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { brewDays, notificationEmails, notifications, proposals, recipeVersions } from '@/db/schema';
import { flushEmailNotifications } from '@/lib/notifications/email';
import type { ProposalView } from '@/lib/proposals/proposals';
import { TestClient } from '../helpers/http';
import { waitForMail } from '../helpers/mail';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { forkVia, kveikChange, proposalTo, proposeVia, type ApiError } from './helpers';

async function viewOf(client: TestClient, id: string): Promise<ProposalView> {
  const res = await client.get<{ proposal: ProposalView }>(`/api/proposals/${id}`);
  if (res.status !== 200) throw new Error(`proposal: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.proposal;
}

function textOf(html: string): string {
  return html
    .replace(/<script[\s\S]*?<\/script>/g, ' ')
    .replace(/<[^>]+>/g, '')
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ');
}

describe('proposing a fork’s version back to its source', () => {
  it('opens a proposal, tells the owner in the site and by e-mail, and shows the compare, brew days and discussion', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);

    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, owner.user.id), eq(notifications.kind, 'proposal')));
    expect(told).toHaveLength(1);
    expect(told[0].url).toBe(`/proposals/${p.id}`);
    const queued = await db
      .select()
      .from(notificationEmails)
      .where(and(eq(notificationEmails.userId, owner.user.id), eq(notificationEmails.kind, 'proposal')));
    expect(queued).toHaveLength(1);
    await flushEmailNotifications();
    const mail = await waitForMail(owner.user.email, (m) => /proposed a change/.test(m.text));
    expect(mail.text).toContain(`/proposals/${p.id}`);

    // A brew of the proposed version, with its measured gravities.
    const brew = await p.proposer.client.post('/api/brew-days', {
      versionId: p.proposedVersion.id,
      brewedOn: '2026-03-01',
      og: { method: 'hydrometer', value: 1.05 },
      fg: { method: 'hydrometer', value: 1.009 },
    });
    expect(brew.status).toBe(201);
    expect(
      (await p.proposer.client.post(`/api/proposals/${p.id}/comments`, { body: 'Try it at **32 °C**.' })).status,
    ).toBe(201);

    const view = await viewOf(owner.client, p.id);
    expect(view.proposal.status).toBe('open');
    expect(view.headMoved).toBe(false);
    expect(view.conflicts).toEqual([]);
    expect(view.can).toMatchObject({ accept: true, decide: true, update: false, withdraw: false });
    const yeasts = view.comparison!.sections.find((s) => s.section === 'yeasts')!;
    // The yeast swap reads as one change.
    expect(yeasts.items.map((i) => [i.status, i.kind])).toEqual([['changed', 'swap']]);
    expect(yeasts.items[0].summary).toMatch(/^Yeast: Clean ale yeast → Kveik/);
    // The fork's own title is not part of what is proposed.
    expect(view.comparison!.sections[0].items[0].changes.map((c) => c.field)).not.toContain('title');
    expect(view.comparison!.stats.find((s) => s.stat === 'fg')!.delta).toBeLessThan(0);
    expect(view.brewDays).toHaveLength(1);
    expect(view.brewDays[0].versionNumber).toBe(p.proposedVersion.number);
    expect(view.brewDays[0].og).toBeCloseTo(1.05, 3);
    expect(view.brewDays[0].fg).toBeCloseTo(1.009, 3);
    expect(view.comments.map((c) => c.body)).toEqual(['Try it at **32 °C**.']);

    const page = await owner.client.fetch(`/proposals/${p.id}`);
    expect(page.status).toBe(200);
    const text = textOf(await page.text());
    expect(text).toContain('Kveik at 32 °C');
    expect(text).toContain('Brews of the proposed version (1)');
    expect(text).toContain('Accept and save a new version');
    expect(text).toContain('Discussion (1)');
    expect(text).toContain('OG 1.050');
    // What accepting does to the numbers, credited to the change that does it.
    expect(text).toMatch(/Accepting this changes FG by −0\.\d{3}: (the yeast swap|−0\.\d{3} from the yeast swap)/);

    // Listed for both members and on both recipes.
    const mine = await owner.client.get<{ incoming: { id: string }[]; outgoing: { id: string }[] }>('/api/proposals');
    expect(mine.body.incoming.map((i) => i.id)).toContain(p.id);
    const theirs = await p.proposer.client.get<{ incoming: { id: string }[]; outgoing: { id: string }[] }>(
      '/api/proposals?direction=outgoing',
    );
    expect(theirs.body.outgoing.map((i) => i.id)).toEqual([p.id]);
    expect(theirs.body.incoming).toEqual([]);
    expect(textOf(await (await new TestClient().fetch(`/recipes/${p.source.recipe.slug}`)).text())).toContain(
      'Proposals (1 open)',
    );
    expect(textOf(await (await new TestClient().fetch(`/recipes/${p.fork.recipe.slug}`)).text())).toContain(
      'Offered from this fork',
    );
    expect(textOf(await (await owner.client.fetch('/proposals')).text())).toContain('To your recipes (1)');
  });

  it('accepts in one step: a new version with the proposed document, the proposer credited, the proposal closed and the proposer told', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const res = await owner.client.post<{ version: { id: string; number: number } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(res.status).toBe(201);
    expect(res.body.version.number).toBe(2);

    const [version] = await db.select().from(recipeVersions).where(eq(recipeVersions.id, res.body.version.id));
    const proposerUser = (await p.proposer.client.me())!;
    expect(version.coAuthorId).toBe(proposerUser.id);
    expect(version.authorId).toBe(owner.user.id);
    const doc = version.document as ReturnType<typeof paleAle>;
    expect(doc.yeasts.map((y) => y.name)).toEqual(['Kveik']);
    expect(doc.title).toBe(paleAle().title);

    const [row] = await db.select().from(proposals).where(eq(proposals.id, p.id));
    expect(row).toMatchObject({ status: 'accepted', acceptedVersionId: version.id, decidedById: owner.user.id });
    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, proposerUser.id), eq(notifications.kind, 'proposal_decision')));
    expect(told.map((n) => n.excerpt)).toEqual([expect.stringContaining('Accepted as version 2')]);

    const history = textOf(await (await new TestClient().fetch(`/recipes/${p.source.recipe.slug}/history`)).text());
    expect(history).toMatch(/with Test member \d+/);
    const page = textOf(await (await p.proposer.client.fetch(`/proposals/${p.id}`)).text());
    expect(page).toContain('Accepted as version 2');
  });

  it('declines with a comment the proposer reads', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const res = await owner.client.post(`/api/proposals/${p.id}/decision`, {
      decision: 'declined',
      comment: 'I like the clean yeast here.',
    });
    expect(res.status).toBe(201);
    const view = await viewOf(p.proposer.client, p.id);
    expect(view.proposal).toMatchObject({ status: 'declined', decisionComment: 'I like the clean yeast here.' });
    expect(view.can.withdraw).toBe(false);
    const proposerUser = (await p.proposer.client.me())!;
    const told = await db
      .select()
      .from(notifications)
      .where(and(eq(notifications.userId, proposerUser.id), eq(notifications.kind, 'proposal_decision')));
    expect(told.map((n) => n.excerpt)).toEqual(['Declined: I like the clean yeast here.']);
  });

  it('asks for changes; the proposer offers a newer version of the fork, and that is what gets accepted', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    expect(
      (
        await owner.client.post(`/api/proposals/${p.id}/decision`, {
          decision: 'changes_requested',
          comment: 'Could you keep the dry hop?',
        })
      ).status,
    ).toBe(201);
    expect((await viewOf(p.proposer.client, p.id)).proposal.status).toBe('changes_requested');

    const newer = await saveVia(
      p.proposer.client,
      p.fork.recipe.id,
      p.proposedVersion.id,
      { ...kveikChange(), notes: 'Kveik, dry hop kept.' },
      'Notes for the owner',
    );
    expect(newer.status).toBe(201);
    const proposerView = await viewOf(p.proposer.client, p.id);
    expect(proposerView.newerVersions.map((v) => v.number)).toEqual([newer.body.version.number]);
    expect((await p.proposer.client.patch(`/api/proposals/${p.id}`, { versionId: newer.body.version.id })).status).toBe(
      200,
    );
    const view = await viewOf(owner.client, p.id);
    expect(view.proposal.status).toBe('open');
    expect(view.proposed!.number).toBe(newer.body.version.number);

    const res = await owner.client.post<{ version: { id: string } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(res.status).toBe(201);
    const [version] = await db.select().from(recipeVersions).where(eq(recipeVersions.id, res.body.version.id));
    expect((version.document as { notes: string }).notes).toBe('Kveik, dry hop kept.');
  });

  it('lets the proposer withdraw, after which nobody can accept it', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    expect((await p.proposer.client.post(`/api/proposals/${p.id}/withdraw`)).status).toBe(201);
    const res = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/already withdrawn/);
  });

  it('proposes to a grandparent: the base is the grandparent’s version the line of forks came from', async () => {
    const owner = await signedInClient();
    const source = await createRecipeVia(owner.client);
    const middle = await signedInClient();
    const middleFork = await forkVia(middle.client, source.version.id, { title: 'Middle' });
    const proposer = await signedInClient();
    const fork = await forkVia(proposer.client, middleFork.version.id, { title: 'Grandchild' });
    const saved = await saveVia(proposer.client, fork.recipe.id, fork.version.id, kveikChange(), 'Kveik');
    const res = await proposeVia(proposer.client, saved.body.version.id, { sourceRecipeId: source.recipe.id });
    expect(res.status).toBe(201);
    const [row] = await db.select().from(proposals).where(eq(proposals.id, res.body.id));
    expect(row).toMatchObject({
      sourceRecipeId: source.recipe.id,
      baseVersionId: source.version.id,
      forkRecipeId: fork.recipe.id,
    });
    // Left out, the target is the recipe the fork came from directly.
    const direct = await proposeVia(proposer.client, saved.body.version.id);
    expect(direct.status).toBe(201);
    const [directRow] = await db.select().from(proposals).where(eq(proposals.id, direct.body.id));
    expect(directRow.sourceRecipeId).toBe(middleFork.recipe.id);
  });

  it('keeps brew days of other versions of the fork out of the proposal page', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    await p.proposer.client.post('/api/brew-days', { versionId: p.fork.version.id, brewedOn: '2026-02-01' });
    const all = await db.select().from(brewDays).where(eq(brewDays.recipeId, p.fork.recipe.id));
    expect(all).toHaveLength(1);
    expect((await viewOf(owner.client, p.id)).brewDays).toEqual([]);
  });
});
