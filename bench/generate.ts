// Generated recipes for the benchmarks and the load run: invented, varied by a counter so rows differ.
import { sql } from 'drizzle-orm';
import type { db as Database } from '../db';
import * as schema from '../db/schema';
import * as brewing from '../lib/brewing';

/** A 20-ingredient invented recipe, varied by n so rows differ. */
export function twentyIngredientDocument(n: number) {
  const malts = [
    'Pale ale malt',
    'Munich malt',
    'Vienna malt',
    'Wheat malt',
    'Crystal malt 40 °L',
    'Crystal malt 60 °L',
    'Flaked oats',
    'Rye malt',
  ];
  const hops = [
    'Cascade',
    'Centennial',
    'Chinook',
    'Willamette',
    'Saaz',
    'Fuggle',
    'Magnum',
    'Nugget',
    'Tettnang',
    'Perle',
  ];
  return {
    title: `Bench recipe ${n}`,
    batch: { volumeL: 20, boilTimeMin: 60, efficiencyPct: 70 + (n % 10) },
    fermentables: malts.map((name, i) => ({
      name,
      amountKg: 0.2 + ((n + i) % 7) * 0.1 + (i === 0 ? 3 : 0),
      potentialPpg: 35,
      colorLovibond: 2 + i * 5,
      kind: 'grain' as const,
    })),
    hops: hops.map((name, i) => ({
      name,
      amountG: 10 + ((n + i) % 5) * 5,
      alphaPct: 4 + (i % 8),
      use: i < 8 ? ('boil' as const) : ('dry_hop' as const),
      timeMin: i < 8 ? 60 - i * 7 : 4320,
      form: 'pellet' as const,
    })),
    yeasts: [
      { name: 'Clean ale yeast', kind: 'ale' as const, attenuationPct: 74 + (n % 6) },
      { name: 'Kveik, farmhouse', kind: 'kveik' as const, attenuationPct: 75 },
    ],
    mash: { steps: [{ tempC: 64 + (n % 5), timeMin: 60 }] },
    fermentation: { steps: [{ tempC: 18, days: 14 }] },
    style: { code: '18B', name: 'American Pale Ale' },
    notes: `Notes for bench recipe ${n}: bright, bitter, ${n % 2 ? 'dry' : 'round'} finish.`,
  };
}

export type GeneratedHead = { recipeId: string; headId: string; slug: string };

/**
 * Inserts `recipes` public recipes of `versionsPerRecipe` versions each for one owner, straight into
 * the tables in batches of 500 (the triggers on versions forbid only updates and deletes), and
 * points every recipe at its last version. Returns each recipe's head.
 */
export async function bulkLoadRecipes(
  db: typeof Database,
  opts: { ownerId: string; recipes: number; versionsPerRecipe: number; slugPrefix?: string },
): Promise<GeneratedHead[]> {
  const { ownerId, recipes, versionsPerRecipe, slugPrefix = 'bench' } = opts;
  const heads: GeneratedHead[] = [];
  for (let start = 0; start < recipes; start += 500) {
    const batch = Array.from({ length: Math.min(500, recipes - start) }, (_, i) => start + i);
    const recipeRows = await db
      .insert(schema.recipes)
      .values(
        batch.map((n) => ({
          slug: `${slugPrefix}-${n}`,
          ownerId,
          title: `Bench recipe ${n}`,
          headNumber: versionsPerRecipe,
        })),
      )
      .returning({ id: schema.recipes.id, slug: schema.recipes.slug });
    const versionRows = recipeRows.flatMap((r, i) =>
      Array.from({ length: versionsPerRecipe }, (_, v) => {
        const doc = brewing.recipeDocumentSchema.parse(twentyIngredientDocument(batch[i] + v));
        const stats = brewing.computeStats(doc);
        return {
          recipeId: r.id,
          number: v + 1,
          authorId: ownerId,
          message: `v${v + 1}`,
          document: doc,
          stats,
          og: stats.og,
          fg: stats.fg,
          abv: stats.abv,
          ibu: stats.ibu,
          srm: stats.srm,
          styleCode: '18B',
          engineVersion: brewing.ENGINE_VERSION,
        };
      }),
    );
    const inserted = await db.insert(schema.recipeVersions).values(versionRows).returning({
      id: schema.recipeVersions.id,
      recipeId: schema.recipeVersions.recipeId,
      number: schema.recipeVersions.number,
    });
    for (const r of recipeRows) {
      const head = inserted.find((v) => v.recipeId === r.id && v.number === versionsPerRecipe)!;
      heads.push({ recipeId: r.id, headId: head.id, slug: r.slug });
    }
  }
  await db.execute(
    sql`update recipes r set head_version_id = v.id from recipe_versions v where v.recipe_id = r.id and v.number = r.head_number and r.head_version_id is null`,
  );
  return heads;
}
