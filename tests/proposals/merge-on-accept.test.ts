import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { proposals, recipeVersions, users } from '@/db/schema';
import type { RecipeDocumentInput } from '@/lib/brewing';
import type { ProposalView } from '@/lib/proposals/proposals';
import { paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { proposalTo, type ApiError } from './helpers';

async function viewOf(client: Parameters<typeof proposalTo>[0], id: string): Promise<ProposalView> {
  return (await client.get<{ proposal: ProposalView }>(`/api/proposals/${id}`)).body.proposal;
}

/** The owner saves a change on top of the version the fork came from, so the head moves. */
async function moveHead(
  client: Parameters<typeof proposalTo>[0],
  p: Awaited<ReturnType<typeof proposalTo>>,
  change: (d: RecipeDocumentInput) => void,
) {
  const doc = paleAle();
  change(doc);
  const saved = await saveVia(client, p.source.recipe.id, p.source.version.id, doc, 'Owner’s own change');
  expect(saved.status).toBe(201);
  return saved.body.version;
}

async function documentOf(versionId: string) {
  const [v] = await db.select().from(recipeVersions).where(eq(recipeVersions.id, versionId));
  return v.document as RecipeDocumentInput;
}

describe('accepting after the source moved on (three-way merge)', () => {
  it('merges fields changed on one side only without asking, and shows the owner the picture', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const head = await moveHead(owner.client, p, (d) => void (d.mash.steps[0].tempC = 65));
    const view = await viewOf(owner.client, p.id);
    expect(view.headMoved).toBe(true);
    expect(view.conflicts).toEqual([]);
    expect(view.fromTheirs).toEqual(expect.arrayContaining(['yeasts[kveik]', 'fermentation.steps[0].tempC']));
    const page = await (await owner.client.fetch(`/proposals/${p.id}`)).text();
    expect(page).toContain('has moved on since the fork');

    // Reviewed against the old head: refused like any save, nothing written.
    const stale = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: p.source.version.id,
    });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/Version 2 .* was saved after the one you reviewed/);
    expect(stale.body.error.details?.head?.number).toBe(2);
    const [still] = await db.select().from(proposals).where(eq(proposals.id, p.id));
    expect(still.status).toBe('open');

    const res = await owner.client.post<{ version: { id: string; number: number } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
    });
    expect(res.status).toBe(201);
    expect(res.body.version.number).toBe(3);
    const doc = await documentOf(res.body.version.id);
    expect(doc.mash.steps[0].tempC).toBe(65);
    expect(doc.yeasts.map((y) => y.name)).toEqual(['Kveik']);
    expect(doc.fermentation.steps[0].tempC).toBe(32);
  });

  it('lists fields changed on both sides and needs one pick for each; a missing pick or a pick for a non-conflict is refused by name', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    const head = await moveHead(owner.client, p, (d) => {
      d.fermentation = { steps: [{ tempC: 19, days: 12 }] };
      d.notes = 'Owner’s notes.';
    });
    const view = await viewOf(owner.client, p.id);
    expect(view.conflicts.map((c) => c.path).sort()).toEqual([
      'fermentation.steps[0].days',
      'fermentation.steps[0].tempC',
    ]);
    expect(view.conflicts.find((c) => c.path === 'fermentation.steps[0].tempC')).toEqual({
      path: 'fermentation.steps[0].tempC',
      base: 18,
      ours: 19,
      theirs: 32,
    });
    // The fork removed the second fermentation step, the owner too: no conflict there.
    // The page labels the fields as compare does, with values in the owner's units.
    const page = await (await owner.client.fetch(`/proposals/${p.id}`)).text();
    expect(page).toContain('Fermentation step 1 · Temperature');
    expect(page).toContain('Fermentation step 1 · Days');
    for (const value of ['18 °C', '19 °C', '32 °C', '12 days']) expect(page).toContain(value);
    const visible = page.replace(/<script[\s\S]*?<\/script>/g, ' ').replace(/<[^>]+>/g, ' ');
    expect(visible).not.toMatch(/tempC|\bdays\b ·|· days\b/);
    await db.update(users).set({ units: 'us' }).where(eq(users.id, owner.user.id));
    const usPage = await (await owner.client.fetch(`/proposals/${p.id}`)).text();
    for (const value of ['64 °F', '66 °F', '90 °F']) expect(usPage).toContain(value);

    const missing = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
      picks: { 'fermentation.steps[0].tempC': 'theirs' },
    });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toEqual([
      { path: 'picks.fermentation.steps[0].days', message: expect.stringContaining('Choose which side') },
    ]);

    const stray = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
      picks: {
        'fermentation.steps[0].tempC': 'theirs',
        'fermentation.steps[0].days': 'theirs',
        'batch.volumeL': 'ours',
      },
    });
    expect(stray.status).toBe(400);
    expect(stray.body.error.fields).toEqual([
      { path: 'picks.batch.volumeL', message: expect.stringContaining('not a conflict') },
    ]);

    const badSide = await owner.client.post<ApiError>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
      picks: { notes: 'both' },
    });
    expect(badSide.status).toBe(400);
    expect(badSide.body.error.fields?.[0].path).toBe('picks.notes');

    const [untouched] = await db.select().from(proposals).where(eq(proposals.id, p.id));
    expect(untouched.status).toBe('open');
    const versions = await db
      .select({ id: recipeVersions.id })
      .from(recipeVersions)
      .where(eq(recipeVersions.recipeId, p.source.recipe.id));
    expect(versions).toHaveLength(2);

    const res = await owner.client.post<{ version: { id: string } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
      picks: { 'fermentation.steps[0].tempC': 'theirs', 'fermentation.steps[0].days': 'ours' },
    });
    expect(res.status).toBe(201);
    const doc = await documentOf(res.body.version.id);
    expect(doc.fermentation.steps).toEqual([{ tempC: 32, days: 12 }]);
    expect(doc.notes).toBe('Owner’s notes.');
    expect(doc.yeasts.map((y) => y.name)).toEqual(['Kveik']);
  });

  it('treats an ingredient removed by the owner and changed by the fork as a conflict about the whole ingredient', async () => {
    const owner = await signedInClient();
    const p = await proposalTo(owner.client);
    // The owner drops the Munich malt; the fork then uses more of it.
    const head = await moveHead(owner.client, p, (d) => {
      d.fermentables = d.fermentables.filter((f) => f.name !== 'Munich malt');
    });
    const proposerDoc = { ...(await documentOf(p.proposedVersion.id)) };
    proposerDoc.fermentables = proposerDoc.fermentables.map((f) =>
      f.name === 'Munich malt' ? { ...f, amountKg: 0.6 } : f,
    );
    const newer = await saveVia(p.proposer.client, p.fork.recipe.id, p.proposedVersion.id, proposerDoc, 'More Munich');
    expect((await p.proposer.client.patch(`/api/proposals/${p.id}`, { versionId: newer.body.version.id })).status).toBe(
      200,
    );
    const view = await viewOf(owner.client, p.id);
    expect(view.conflicts.map((c) => c.path)).toEqual(['fermentables[munich malt]']);
    const res = await owner.client.post<{ version: { id: string } }>(`/api/proposals/${p.id}/accept`, {
      sourceHeadVersionId: head.id,
      picks: { 'fermentables[munich malt]': 'theirs' },
    });
    expect(res.status).toBe(201);
    const doc = await documentOf(res.body.version.id);
    expect(doc.fermentables.find((f) => f.name === 'Munich malt')?.amountKg).toBe(0.6);
  });
});
