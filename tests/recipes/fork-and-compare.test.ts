import { describe, expect, it } from 'vitest';
import type { DocumentComparison } from '@/lib/recipes/compare';
import type { LineageRecipe } from '@/lib/recipes/lineage';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia, type Saved } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

async function fork(client: TestClient, versionId: string, title: string, visibility = 'public') {
  const res = await client.post<Saved>(`/api/versions/${versionId}/fork`, { title, visibility });
  expect(res.status).toBe(201);
  return res.body;
}

describe('forks, lineage and compare', () => {
  it('keeps the full lineage through a fork of a fork, and counts forks on the source', async () => {
    const { client: a } = await signedInClient();
    const { client: b } = await signedInClient();
    const { client: c } = await signedInClient();
    const source = await createRecipeVia(a);
    const v2 = await saveVia(a, source.recipe.id, source.version.id, paleAle({ notes: 'second' }));
    const child = await fork(b, v2.body.version.id, 'Hillside, kveik take');
    const grandchild = await fork(c, child.version.id, 'Hillside, kveik take, hotter');

    const lineage = await new TestClient().get<{ recipes: LineageRecipe[] }>(
      `/api/recipes/${grandchild.recipe.id}/lineage`,
    );
    expect(lineage.status).toBe(200);
    const byId = new Map(lineage.body.recipes.map((r) => [r.id, r]));
    expect(byId.get(source.recipe.id)?.depth).toBe(0);
    expect(byId.get(child.recipe.id)?.depth).toBe(1);
    expect(byId.get(child.recipe.id)?.forkedFromVersionId).toBe(v2.body.version.id);
    expect(byId.get(grandchild.recipe.id)?.depth).toBe(2);
    expect(byId.get(grandchild.recipe.id)?.forkedFromVersionId).toBe(child.version.id);
    expect(byId.get(source.recipe.id)?.versions.map((v) => v.number)).toEqual([1, 2]);

    const src = await new TestClient().get<{ recipe: { forkCount: number } }>(`/api/recipes/${source.recipe.id}`);
    expect(src.body.recipe.forkCount).toBe(1);
    const firstOfFork = await new TestClient().get<{ version: { parentVersionId: string } }>(
      `/api/versions/${child.version.id}`,
    );
    expect(firstOfFork.body.version.parentVersionId).toBe(v2.body.version.id);
  });

  it('saves a fork fitted to a brewhouse as its second version, or nothing when the fitted copy is refused', async () => {
    const { client: a } = await signedInClient();
    const { client: b, user } = await signedInClient();
    const source = await createRecipeVia(a);
    const base = paleAle();
    const bigger = { ...base, batch: { ...base.batch, volumeL: 40 } };
    const res = await b.post<Saved>(`/api/versions/${source.version.id}/fork`, {
      title: 'Hillside, forty litres',
      visibility: 'public',
      fitted: bigger,
    });
    expect(res.status).toBe(201);
    expect(res.body.version.number).toBe(2);
    const second = await b.get<{
      version: { message: string; document: { title: string; batch: { volumeL: number } } };
    }>(`/api/versions/${res.body.version.id}`);
    expect(second.body.version.message).toBe('Fitted to my brewhouse');
    expect(second.body.version.document).toMatchObject({ title: 'Hillside, forty litres', batch: { volumeL: 40 } });

    const refused = await b.post<{ error: { fields: { path: string }[] } }>(`/api/versions/${source.version.id}/fork`, {
      title: 'Never saved',
      visibility: 'public',
      fitted: { ...base, batch: { ...base.batch, volumeL: -1 } },
    });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.map((f) => f.path)).toContain('fitted.batch.volumeL');
    const listing = await new TestClient().get<{ recipes: { title: string }[] }>(`/api/recipes?owner=${user.handle}`);
    expect(listing.body.recipes.map((r) => r.title)).toEqual(['Hillside, forty litres']);
  });

  it('leaves a private fork out of the lineage others see', async () => {
    const { client: a } = await signedInClient();
    const { client: b } = await signedInClient();
    const source = await createRecipeVia(a);
    const secret = await fork(b, source.version.id, 'Quiet experiment', 'private');
    const seen = await new TestClient().get<{ recipes: LineageRecipe[] }>(`/api/recipes/${source.recipe.id}/lineage`);
    expect(seen.body.recipes.map((r) => r.id)).not.toContain(secret.recipe.id);
    const mine = await b.get<{ recipes: LineageRecipe[] }>(`/api/recipes/${source.recipe.id}/lineage`);
    expect(mine.body.recipes.map((r) => r.id)).toContain(secret.recipe.id);
  });

  it('compares a fork with its source: changed yeast and mash, stat deltas and a word diff of the notes', async () => {
    const { client: a } = await signedInClient();
    const { client: b } = await signedInClient();
    const source = await createRecipeVia(a);
    const forked = await fork(b, source.version.id, 'Hillside Kveik');
    const changed = paleAle({ title: 'Hillside Kveik', notes: 'A bright, bitter pale ale fermented hot.' });
    changed.yeasts = [{ name: 'Kveik, farmhouse', kind: 'kveik', attenuationPct: 75, tempMinC: 29, tempMaxC: 35 }];
    changed.mash.steps[0].tempC = 68;
    changed.hops.push({ name: 'Cascade, late', amountG: 10, alphaPct: 6, use: 'boil', timeMin: 5, form: 'pellet' });
    const v2 = await saveVia(b, forked.recipe.id, forked.version.id, changed, 'Kveik, hotter mash');

    const res = await new TestClient().get<{ comparison: DocumentComparison }>(
      `/api/compare?a=${source.version.id}&b=${v2.body.version.id}`,
    );
    expect(res.status).toBe(200);
    const { sections, stats, notes, attribution } = res.body.comparison;
    const yeasts = sections.find((s) => s.section === 'yeasts')!.items;
    // The swap reads as one change, in brewers' words.
    expect(yeasts.map((y) => [y.summary.split(' (')[0], y.status, y.kind])).toEqual([
      ['Yeast: Clean ale yeast → Kveik, farmhouse', 'changed', 'swap'],
    ]);
    const mash = sections.find((s) => s.section === 'mash')!.items[0];
    expect(mash.status).toBe('changed');
    expect(mash.changes).toEqual([
      { field: 'tempC', label: 'Temperature', before: '66 °C', after: '68 °C', delta: '+2 °C' },
    ]);
    const hops = sections.find((s) => s.section === 'hops')!.items;
    expect(hops.filter((h) => h.status === 'added').map((h) => h.label)).toEqual(['Cascade, late (boil, 5 min)']);
    // Why FG moved: the yeast swap and the hotter mash, each named.
    const fgWhy = attribution.find((x) => x.stat === 'fg')!;
    expect(fgWhy.parts.map((p) => p.cause)).toEqual(expect.arrayContaining(['the yeast swap', 'the 2 °C hotter mash']));
    expect(fgWhy.sentence).toMatch(/^FG 1\.\d{3} → 1\.\d{3}: /);
    expect(hops.filter((h) => h.status === 'same')).toHaveLength(4);
    const fg = stats.find((s) => s.stat === 'fg')!;
    expect(fg.delta).toBeCloseTo(fg.after! - fg.before!, 10);
    expect(fg.delta).toBeGreaterThan(0);
    expect(notes.some((p) => p.added && p.value.includes('fermented'))).toBe(true);
    expect(notes.some((p) => p.removed && p.value.includes('everyday'))).toBe(true);
  });

  it('refuses a fork without a title with a field message', async () => {
    const { client: a } = await signedInClient();
    const source = await createRecipeVia(a);
    const res = await a.post<{ error: { fields: { path: string }[] } }>(`/api/versions/${source.version.id}/fork`, {
      title: '  ',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields[0].path).toBe('title');
  });
});
