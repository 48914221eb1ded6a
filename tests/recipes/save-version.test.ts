import { asc, eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { recipeVersions, recipes } from '@/db/schema';
import { computeStats, recipeDocumentSchema } from '@/lib/brewing';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import type { FieldIssue } from '@/lib/errors';

describe('saving versions', () => {
  it('numbers versions 1, 2, 3 and moves the head, storing the numbers the engine computes', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    expect(created.version.number).toBe(1);
    const kveik = paleAle();
    kveik.yeasts = [{ name: 'Kveik, farmhouse', kind: 'kveik', attenuationPct: 75, tempMinC: 29, tempMaxC: 35 }];
    const v2 = await saveVia(client, created.recipe.id, created.version.id, kveik, 'Swapped to a kveik strain');
    expect(v2.status).toBe(201);
    expect(v2.body.version.number).toBe(2);
    const hotter = structuredClone(kveik);
    hotter.mash.steps[0].tempC = 68;
    const v3 = await saveVia(client, created.recipe.id, v2.body.version.id, hotter, 'Mashed 2 °C hotter');
    expect(v3.body.version.number).toBe(3);

    const [recipe] = await db.select().from(recipes).where(eq(recipes.id, created.recipe.id));
    expect(recipe.headVersionId).toBe(v3.body.version.id);
    expect(recipe.headNumber).toBe(3);
    const rows = await db
      .select()
      .from(recipeVersions)
      .where(eq(recipeVersions.recipeId, created.recipe.id))
      .orderBy(asc(recipeVersions.number));
    expect(rows.map((r) => r.number)).toEqual([1, 2, 3]);
    expect(rows[2].parentVersionId).toBe(rows[1].id);
    for (const row of rows) {
      const expected = computeStats(recipeDocumentSchema.parse(row.document));
      expect(row.stats).toEqual(JSON.parse(JSON.stringify(expected)));
      expect(row.og).toBeCloseTo(expected.og, 5);
      expect(row.ibu).toBeCloseTo(expected.ibu, 3);
    }
    // A hotter mash leaves more unfermentable sugar: FG up, ABV down (common practice).
    expect(rows[2].fg).toBeGreaterThan(rows[1].fg);
    expect(rows[2].abv).toBeLessThan(rows[1].abv);
  });

  it('refuses a save based on an old head with 409, naming the newer head, and writes nothing', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    const v2 = await saveVia(client, created.recipe.id, created.version.id, paleAle({ notes: 'from tab one' }));
    expect(v2.status).toBe(201);
    const stale = await saveVia(client, created.recipe.id, created.version.id, paleAle({ notes: 'from tab two' }));
    expect(stale.status).toBe(409);
    expect(stale.body.error?.code).toBe('conflict');
    expect(stale.body.error?.details?.head).toMatchObject({ id: v2.body.version.id, number: 2 });
    const count = await db
      .select({ n: sql<number>`count(*)::int` })
      .from(recipeVersions)
      .where(eq(recipeVersions.recipeId, created.recipe.id));
    expect(count[0].n).toBe(2);
  });

  it('lets exactly one of 20 concurrent saves on the same head through; the rest get 409 and nothing is lost', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        saveVia(client, created.recipe.id, created.version.id, paleAle({ notes: `attempt ${i}` }), `attempt ${i}`),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    const rows = await db
      .select()
      .from(recipeVersions)
      .where(eq(recipeVersions.recipeId, created.recipe.id))
      .orderBy(asc(recipeVersions.number));
    expect(rows.map((r) => r.number)).toEqual([1, 2]);
    const winner = results.find((r) => r.status === 201)!;
    expect(rows[1].id).toBe(winner.body.version.id);
  });

  it('answers a bad document with 400 and a message per field, and saves nothing', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    const bad = paleAle();
    bad.hops[0].alphaPct = 45;
    bad.batch.volumeL = 0;
    (bad.fermentables[0] as { amountKg: unknown }).amountKg = 'lots';
    const res = await saveVia(client, created.recipe.id, created.version.id, bad, '');
    expect(res.status).toBe(400);
    const fields = (res.body as unknown as { error: { fields: FieldIssue[] } }).error.fields;
    const byPath = Object.fromEntries(fields.map((f) => [f.path, f.message]));
    expect(byPath['document.hops.0.alphaPct']).toMatch(/at most 30%/);
    expect(byPath['document.batch.volumeL']).toMatch(/at least 0.1 L/);
    expect(byPath['document.fermentables.0.amountKg']).toMatch(/must be a number/);
    expect(byPath.message).toMatch(/what changed/);
    const [recipe] = await db.select().from(recipes).where(eq(recipes.id, created.recipe.id));
    expect(recipe.headNumber).toBe(1);
  });

  it('restores an old version as a new version with that document', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    const v2 = await saveVia(client, created.recipe.id, created.version.id, paleAle({ notes: 'changed my mind' }));
    const restored = await client.post<{ version: { id: string; number: number } }>(
      `/api/recipes/${created.recipe.id}/restore`,
      {
        versionId: created.version.id,
        baseVersionId: v2.body.version.id,
      },
    );
    expect(restored.status).toBe(201);
    expect(restored.body.version.number).toBe(3);
    const [v1, v3] = await Promise.all(
      [created.version.id, restored.body.version.id].map(
        async (id) => (await db.select().from(recipeVersions).where(eq(recipeVersions.id, id)))[0],
      ),
    );
    expect(v3.document).toEqual(v1.document);
    expect(v3.message).toBe('Restored version 1');
  });

  it('the database refuses to change or delete a saved version', async () => {
    const { client } = await signedInClient();
    const created = await createRecipeVia(client);
    await expect(
      db.update(recipeVersions).set({ message: 'rewritten' }).where(eq(recipeVersions.id, created.version.id)),
    ).rejects.toThrow();
    await expect(db.delete(recipeVersions).where(eq(recipeVersions.id, created.version.id))).rejects.toThrow();
  });
});
