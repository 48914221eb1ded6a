import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { scaleRecipe } from './scale';
import { recipeDocumentSchema, type RecipeDocument } from './schema';
import { computeStats } from './stats';
import { collectNumbers, examplePaleAle, recipeInputArb } from './test-fixtures';

/** Generated documents, parsed: the generator stays inside the schema's bounds, so every one must pass. */
function validRecipeArb(options?: Parameters<typeof recipeInputArb>[0]): fc.Arbitrary<RecipeDocument> {
  return recipeInputArb(options).map((input) => {
    const parsed = recipeDocumentSchema.safeParse(input);
    if (!parsed.success) throw new Error(`generator left the schema: ${parsed.error.message}`);
    return parsed.data;
  });
}

const RUNS = { numRuns: 300 };

describe('engine properties', () => {
  it('never returns NaN or Infinity for a schema-valid document', () => {
    fc.assert(
      fc.property(validRecipeArb(), (doc) => {
        for (const { path, value } of collectNumbers(computeStats(doc))) {
          if (!Number.isFinite(value)) throw new Error(`${path} is ${value}`);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('never lowers OG when grain is added', () => {
    fc.assert(
      fc.property(validRecipeArb(), fc.nat(), fc.double({ min: 0, max: 10, noNaN: true }), (doc, pick, extraKg) => {
        const index = pick % doc.fermentables.length;
        const more = structuredClone(doc);
        more.fermentables[index].amountKg += extraKg;
        expect(computeStats(more).og).toBeGreaterThanOrEqual(computeStats(doc).og);
      }),
      RUNS,
    );
  });

  it('never lowers IBU when hops are added', () => {
    fc.assert(
      fc.property(validRecipeArb(), fc.nat(), fc.double({ min: 0, max: 500, noNaN: true }), (doc, pick, extraG) => {
        fc.pre(doc.hops.length > 0);
        const index = pick % doc.hops.length;
        const more = structuredClone(doc);
        more.hops[index].amountG += extraG;
        expect(computeStats(more).ibu).toBeGreaterThanOrEqual(computeStats(doc).ibu);
      }),
      RUNS,
    );
  });

  it("never lowers a boil addition's IBU when it boils longer", () => {
    fc.assert(
      fc.property(validRecipeArb(), fc.nat(), fc.double({ min: 0, max: 120, noNaN: true }), (doc, pick, extraMin) => {
        const boilIndexes = doc.hops.flatMap((hop, i) => (hop.use === 'boil' ? [i] : []));
        fc.pre(boilIndexes.length > 0);
        const index = boilIndexes[pick % boilIndexes.length];
        const longer = structuredClone(doc);
        longer.hops[index].timeMin += extraMin;
        longer.batch.boilTimeMin = Math.max(longer.batch.boilTimeMin, longer.hops[index].timeMin);
        expect(computeStats(longer).hops[index].ibu).toBeGreaterThanOrEqual(computeStats(doc).hops[index].ibu);
      }),
      RUNS,
    );
  });

  it('returns the recipe, within rounding, when scaled and scaled back', () => {
    const ratio = fc.double({ min: 0.25, max: 4, noNaN: true });
    // null: the same brewhouse efficiency, so the fit is one ratio for every malt and must undo itself.
    // Another efficiency splits base and specialty malt to keep colour, and falls back to one ratio
    // where that split would be wild, so the way there and the way back may split differently: only
    // the gravity is promised then.
    const efficiency = fc.option(fc.double({ min: 40, max: 95, noNaN: true }), { nil: null });
    fc.assert(
      fc.property(validRecipeArb({ minKgShare: 0.05 }), ratio, efficiency, (doc, volumeRatio, newEfficiency) => {
        // Every malt and mashed adjunct gives extract (even the darkest roasted malts give over 20 ppg;
        // common practice): a mashed grist of no extract has no gravity to keep, so any weight of it
        // would fit and the way back need not find the same one.
        fc.pre(
          doc.batch.volumeL >= 5 &&
            doc.hops.every((hop) => hop.amountG >= 1) &&
            doc.fermentables.every((f) => (f.kind !== 'grain' && f.kind !== 'adjunct') || f.potentialPpg >= 20),
        );
        const efficiencyPct = newEfficiency ?? doc.batch.efficiencyPct;
        const there = scaleRecipe(doc, { volumeL: doc.batch.volumeL * volumeRatio, efficiencyPct });
        const back = scaleRecipe(there, { volumeL: doc.batch.volumeL, efficiencyPct: doc.batch.efficiencyPct });
        expect(back.batch).toEqual(doc.batch);
        const statsBefore = computeStats(doc);
        const statsAfter = computeStats(back);
        expect(Math.abs(statsAfter.og - statsBefore.og)).toBeLessThan(0.001);
        if (newEfficiency !== null) return;
        back.fermentables.forEach((fermentable, i) => {
          // Two roundings to 1 g: the first is magnified on the way back by 1 / ratio.
          const tolerance = 0.0005 / volumeRatio + 0.0005 + 1e-9;
          expect(Math.abs(fermentable.amountKg - doc.fermentables[i].amountKg)).toBeLessThanOrEqual(tolerance);
        });
        back.hops.forEach((hop, i) => {
          // Two roundings to 0.1 g, and the IBU correction for the gravity drift those grist roundings cause.
          const tolerance = 0.05 / volumeRatio + 0.05 + doc.hops[i].amountG * 0.01;
          expect(Math.abs(hop.amountG - doc.hops[i].amountG)).toBeLessThanOrEqual(tolerance);
        });
      }),
      { ...RUNS, maxSkipsPerRun: 1000 },
    );
  });

  // Fitting a recipe to another brewhouse keeps what the recipe page shows: OG to 0.001, IBU to a
  // whole unit, colour to 0.5 SRM (display precision); grain weighed to 1 g, hops to 0.1 g.
  it('keeps OG, IBU and colour within display precision when fitted to another brewhouse', () => {
    const doc = examplePaleAle();
    const before = computeStats(doc);
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 200, noNaN: true }),
        fc.double({ min: 50, max: 95, noNaN: true }),
        (volumeL, efficiencyPct) => {
          const after = computeStats(scaleRecipe(doc, { volumeL, efficiencyPct }));
          expect(Math.abs(after.og - before.og)).toBeLessThan(0.0005);
          expect(Math.abs(after.ibu - before.ibu)).toBeLessThan(0.5);
          expect(Math.abs(after.srm - before.srm)).toBeLessThan(0.25);
        },
      ),
      RUNS,
    );
  });
});
