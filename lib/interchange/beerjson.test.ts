import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema } from '@/lib/brewing';
import { demoRecipes } from '@/db/seed/recipes';
import { parseBeerJson } from './beerjson/read';
import { toBeerJson } from './beerjson/write';
import { checkBeerJsonSchema } from './beerjson/schema';
import { parseRecipeFile } from './index';
import { example, examplePaleAle } from './test-helpers';
import { InterchangeError } from './types';

function refusal(run: () => unknown): InterchangeError {
  try {
    run();
  } catch (err) {
    if (err instanceof InterchangeError) return err;
    throw err;
  }
  throw new Error('expected the file to be refused');
}

describe('BeerJSON round trip', () => {
  it('writes files that satisfy the published BeerJSON 1.0 schema', () => {
    for (const demo of demoRecipes)
      expect(checkBeerJsonSchema(toBeerJson(recipeDocumentSchema.parse(demo.document))), demo.key).toBeNull();
  });

  it('exports and imports the example pale ale to the same document and numbers', () => {
    const doc = examplePaleAle();
    doc.hops.unshift({ name: 'Chinook', amountG: 10, alphaPct: 13, use: 'first_wort', timeMin: 60, form: 'pellet' });
    doc.batch.grainAbsorptionLPerKg = 0.8;
    doc.fermentation.steps.push({ tempC: 0, days: 2.5 });
    const [back] = parseBeerJson(JSON.stringify(toBeerJson(doc))).recipes;
    expect(back.document).toEqual(doc);
    expect(computeStats(back.document)).toEqual(computeStats(doc));
    expect(back.dropped).toEqual([]);
    expect(back.guessed).toEqual([]);
  });

  it('round-trips every demo recipe', () => {
    for (const demo of demoRecipes) {
      const doc = recipeDocumentSchema.parse(demo.document);
      const [back] = parseBeerJson(JSON.stringify(toBeerJson(doc))).recipes;
      expect(back.document, demo.key).toEqual(doc);
      expect(computeStats(back.document).og).toBeCloseTo(computeStats(doc).og, 4);
    }
  });
});

// BeerJSON 1.0 specification: a recipe written by hand after its examples, in US units (examples/beerjson-spec-pale-ale.json).
describe('BeerJSON 1.0 specification — example recipe', () => {
  const { format, recipes } = parseRecipeFile(example('beerjson-spec-pale-ale.json'));
  const [recipe] = recipes;
  const doc = recipe.document;

  it('is detected as BeerJSON and converts each explicit unit', () => {
    expect(format).toBe('beerjson');
    // US gallon = 3.785411784 L (common practice); 5.5 gal.
    expect(doc.batch.volumeL).toBeCloseTo(20.8198, 3);
    // 10 lb = 4.5359237 kg; fine grind 80% of sucrose's 46.214 ppg (common practice).
    expect(doc.fermentables[0]).toMatchObject({ colorLovibond: 2, kind: 'grain' });
    expect(doc.fermentables[0].amountKg).toBeCloseTo(4.5359237, 7);
    expect(doc.fermentables[0].potentialPpg).toBeCloseTo(0.8 * 46.214, 6);
    // 12 oz; potential 1.034 = 34 ppg; 105 EBC → 53.3 SRM → 39.9 °L (EBC = 1.97 SRM; SRM = 1.3546 °L − 0.76).
    expect(doc.fermentables[1].amountKg).toBeCloseTo(0.340194, 5);
    expect(doc.fermentables[1].potentialPpg).toBe(34);
    expect(doc.fermentables[1].colorLovibond).toBeCloseTo((105 / 1.97 + 0.76) / 1.3546, 2);
    // 1 oz = 28.349523125 g.
    expect(doc.hops[0]).toMatchObject({ use: 'boil', timeMin: 60, form: 'pellet' });
    expect(doc.hops[0].amountG).toBeCloseTo(28.349523125, 6);
    expect(doc.hops[1]).toMatchObject({ use: 'dry_hop', timeMin: 4 * 1440, form: 'leaf' });
    expect(doc.yeasts[0]).toMatchObject({ kind: 'ale', attenuationPct: 76 });
    // 152 °F and 66 °F.
    expect(doc.mash.steps[0].tempC).toBeCloseTo(66.67, 2);
    expect(doc.fermentation.steps[0].tempC).toBeCloseTo((66 - 32) / 1.8, 6);
    expect(doc.fermentation.steps[0].days).toBe(14);
    // 1.5 qt/lb = 3.13 L/kg.
    expect(doc.batch.mashWaterLPerKg).toBeCloseTo(3.1295, 2);
    expect(doc.water?.salts).toEqual([{ salt: 'gypsum', grams: 5 }]);
    expect(doc.water?.volumeL).toBeCloseTo(30.283, 3);
    expect(doc.style).toEqual({ code: '18B', name: 'American Pale Ale' });
    expect(doc.carbonation?.volumesCO2).toBe(2.4);
  });

  it('keeps the unmodelled parts in the notes and lists them', () => {
    expect(doc.notes).toContain('Kettle fining tablet (fining): 1 each');
    expect(doc.notes).toContain('dry hop added 3 days into fermentation');
    expect(recipe.dropped.join('\n')).toMatch(
      /miscellaneous_additions\[1\] \(Kettle fining tablet\): fining ingredients are not modelled/,
    );
    expect(recipe.guessed.join('\n')).toMatch(/Serving temperature/);
  });
});

describe('BeerJSON files we refuse', () => {
  const base = () => JSON.parse(example('beerjson-spec-pale-ale.json'));

  it('refuses text that is not JSON', () => {
    expect(refusal(() => parseBeerJson('{"beerjson": ')).kind).toBe('malformed');
  });

  it('refuses a file that fails the schema, naming the path', () => {
    const file = base();
    delete file.beerjson.recipes[0].batch_size;
    expect(refusal(() => parseBeerJson(JSON.stringify(file))).message).toBe(
      'beerjson.recipes[0].batch_size: is required by the BeerJSON 1.0 schema',
    );
  });

  it('refuses an unknown unit, naming the element and the units allowed', () => {
    const file = base();
    file.beerjson.recipes[0].ingredients.hop_additions[0].amount.unit = 'stone';
    const err = refusal(() => parseBeerJson(JSON.stringify(file)));
    expect(err.message).toMatch(
      /^beerjson\.recipes\[0\]\.ingredients\.hop_additions\[0\]\.amount\.unit: "stone" is not allowed; use one of: .*gal.*kg/,
    );
  });

  it('refuses a negative amount, which the schema itself allows', () => {
    const file = base();
    file.beerjson.recipes[0].ingredients.fermentable_additions[1].amount.value = -12;
    expect(refusal(() => parseBeerJson(JSON.stringify(file))).message).toBe(
      'beerjson.recipes[0] (Sample Pale Ale).ingredients.fermentable_additions[1] (Crystal 40).amount: must not be negative (got -12 oz)',
    );
  });

  it('leaves out a fermentable measured by volume, listing it, and refuses a file left with none', () => {
    const file = base();
    file.beerjson.recipes[0].ingredients.fermentable_additions[0].amount = { unit: 'l', value: 2 };
    const [recipe] = parseBeerJson(JSON.stringify(file)).recipes;
    expect(recipe.document.fermentables.map((f) => f.name)).toEqual(['Crystal 40']);
    expect(recipe.dropped.join('\n')).toMatch(/fermentable_additions\[0\] \(Pale 2-row\): measured by volume \(2 l\)/);
    expect(recipe.document.notes).toContain('Pale 2-row: 2 l (left out: measured by volume)');
    file.beerjson.recipes[0].ingredients.fermentable_additions[1].amount = { unit: 'l', value: 1 };
    expect(refusal(() => parseBeerJson(JSON.stringify(file))).message).toMatch(
      /fermentable_additions: Fermentables need at least one entry/,
    );
  });

  it('refuses a file with no recipe', () => {
    expect(refusal(() => parseBeerJson('{"beerjson": {"version": 1}}')).message).toMatch(/holds no recipe/);
  });

  it('refuses text that is neither format', () => {
    expect(refusal(() => parseRecipeFile('Name: my beer')).kind).toBe('malformed');
  });
});
