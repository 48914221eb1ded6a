import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import { recipeInputArb } from '@/lib/brewing/test-fixtures';
import { parseBeerJson } from './beerjson/read';
import { checkBeerJsonSchema } from './beerjson/schema';
import { toBeerJson } from './beerjson/write';
import { parseBeerXml } from './beerxml/read';
import { toBeerXml } from './beerxml/write';
import { parseRecipeFile } from './index';
import { example, seededDocuments } from './test-helpers';

/**
 * Export → import in both open formats keeps the numbers and the ingredients, and every BeerJSON
 * export satisfies the published BeerJSON 1.0 schema (checked with ajv against the files of
 * @beerjson/beerjson 1.0.2).
 */

const seeded = seededDocuments();

/** BeerJSON 1.0 writes every time as a whole number of a unit, the finest being the second. */
function toWholeSeconds(doc: RecipeDocument): RecipeDocument {
  const sec = (min: number) => Math.round(min * 60) / 60;
  const copy = structuredClone(doc);
  copy.batch.boilTimeMin = sec(copy.batch.boilTimeMin);
  // Rounding is monotone, so a hop inside the boil stays inside it.
  for (const h of copy.hops) h.timeMin = sec(h.timeMin);
  for (const s of copy.mash.steps) s.timeMin = Math.max(sec(s.timeMin), 1 / 60);
  for (const s of copy.fermentation.steps) s.days = Math.max(Math.round(s.days * 86400), 1) / 86400;
  return recipeDocumentSchema.parse(copy);
}

const generated = recipeInputArb().map((input) => recipeDocumentSchema.parse(input));
const generatedWholeSeconds = generated.map(toWholeSeconds);

function beerJsonTrip(doc: RecipeDocument): RecipeDocument {
  const [back] = parseBeerJson(JSON.stringify(toBeerJson(doc))).recipes;
  return back.document;
}

function beerXmlTrip(doc: RecipeDocument): RecipeDocument {
  const [back] = parseBeerXml(toBeerXml(doc)).recipes;
  return back.document;
}

const close = (a: number, b: number, within: number) => Math.abs(a - b) <= within + 1e-12;

/** The tolerances a trip must keep: OG and FG 0.0005, ABV 0.01 %, IBU and SRM 0.05. */
function expectSameNumbers(back: RecipeDocument, doc: RecipeDocument, label: string): void {
  const a = computeStats(doc);
  const b = computeStats(back);
  const report = `${label}: ${JSON.stringify({ og: [a.og, b.og], fg: [a.fg, b.fg], abv: [a.abv, b.abv], ibu: [a.ibu, b.ibu], srm: [a.srm, b.srm] })}`;
  expect(close(a.og, b.og, 0.0005), report).toBe(true);
  expect(close(a.fg, b.fg, 0.0005), report).toBe(true);
  expect(close(a.abv, b.abv, 0.01), report).toBe(true);
  expect(close(a.ibu, b.ibu, 0.05), report).toBe(true);
  expect(close(a.srm, b.srm, 0.05), report).toBe(true);
}

/** Equal to 9 significant digits; `floor` is an absolute allowance (a potential travels as a gravity, 1 + ppg/1000). */
const sameAmount = (a: number, b: number, floor = 1e-12) =>
  Math.abs(a - b) <= Math.max(Math.abs(a), Math.abs(b)) * 1e-9 + floor;

/** Every fermentable, hop and yeast comes back, in order, with its name, kind, use and amounts. */
function expectSameIngredients(back: RecipeDocument, doc: RecipeDocument, label: string): void {
  const fermentables = (d: RecipeDocument) => d.fermentables.map((f) => [f.name, f.kind]);
  const hops = (d: RecipeDocument) =>
    d.hops.map((h) => [h.name, h.use, h.form, h.use === 'whirlpool' && h.tempC !== undefined]);
  const yeasts = (d: RecipeDocument) => d.yeasts.map((y) => [y.name, y.kind]);
  expect(fermentables(back), label).toEqual(fermentables(doc));
  expect(hops(back), label).toEqual(hops(doc));
  expect(yeasts(back), label).toEqual(yeasts(doc));
  doc.fermentables.forEach((f, i) => {
    const g = back.fermentables[i];
    for (const key of ['amountKg', 'potentialPpg', 'colorLovibond'] as const)
      expect(
        sameAmount(g[key], f[key], key === 'potentialPpg' ? 1e-7 : 1e-12),
        `${label} fermentable ${i} ${key}: ${f[key]} → ${g[key]}`,
      ).toBe(true);
  });
  doc.hops.forEach((h, i) => {
    const g = back.hops[i];
    for (const key of ['amountG', 'alphaPct'] as const)
      expect(sameAmount(g[key], h[key]), `${label} hop ${i} ${key}: ${h[key]} → ${g[key]}`).toBe(true);
    if (h.use === 'whirlpool' && h.tempC !== undefined)
      expect(Math.abs(g.tempC! - h.tempC) <= 1e-9 * Math.max(1, h.tempC), `${label} hop ${i} stand temperature`).toBe(
        true,
      );
    expect(Math.abs(g.timeMin - h.timeMin) <= 1 / 120, `${label} hop ${i} time: ${h.timeMin} → ${g.timeMin}`).toBe(
      true,
    );
  });
  doc.yeasts.forEach((y, i) => {
    const g = back.yeasts[i];
    expect(sameAmount(g.attenuationPct, y.attenuationPct), `${label} yeast ${i} attenuation`).toBe(true);
  });
}

describe('BeerJSON exports satisfy the BeerJSON 1.0 schema', () => {
  it('for every document the demo seed saves', () => {
    expect(seeded.length).toBeGreaterThan(30);
    for (const { key, document } of seeded) expect(checkBeerJsonSchema(toBeerJson(document)), key).toBeNull();
  });

  it('for an extract brew with no mash steps and a recipe with no fermentation steps (no empty step lists)', () => {
    const doc = structuredClone(seeded[0].document);
    doc.mash.steps = [];
    doc.fermentation.steps = [];
    const file = toBeerJson(doc) as { beerjson: { recipes: Record<string, unknown>[] } };
    expect(checkBeerJsonSchema(file)).toBeNull();
    expect(file.beerjson.recipes[0].mash).toBeUndefined();
    expect(file.beerjson.recipes[0].fermentation).toBeUndefined();
    expect(beerJsonTrip(doc).mash.steps).toEqual([]);
  });

  it('for generated documents across the whole schema', () => {
    fc.assert(
      fc.property(generated, (doc) => {
        expect(checkBeerJsonSchema(toBeerJson(doc))).toBeNull();
      }),
      { numRuns: 300 },
    );
  });
});

describe('Export → import keeps the numbers and the ingredient list', () => {
  it('for every document the demo seed saves, in both formats', () => {
    for (const { key, document } of seeded) {
      for (const [format, trip] of [
        ['BeerJSON', beerJsonTrip],
        ['BeerXML', beerXmlTrip],
      ] as const) {
        const back = trip(document);
        expectSameNumbers(back, document, `${key} ${format}`);
        expectSameIngredients(back, document, `${key} ${format}`);
      }
    }
  });

  it('for the recipes read from the specification examples, in both formats', () => {
    for (const name of ['beerxml-spec-dry-stout.xml', 'beerjson-spec-pale-ale.json']) {
      const [imported] = parseRecipeFile(example(name)).recipes;
      for (const trip of [beerJsonTrip, beerXmlTrip]) {
        const back = trip(imported.document);
        expectSameNumbers(back, imported.document, name);
        expectSameIngredients(back, imported.document, name);
      }
    }
  });

  it('for generated documents through BeerXML', () => {
    fc.assert(
      fc.property(generated, (doc) => {
        const back = beerXmlTrip(doc);
        expectSameNumbers(back, doc, 'BeerXML');
        expectSameIngredients(back, doc, 'BeerXML');
      }),
      { numRuns: 300 },
    );
  });

  it('for generated documents (times in whole seconds) through BeerJSON', () => {
    fc.assert(
      fc.property(generatedWholeSeconds, (doc) => {
        const back = beerJsonTrip(doc);
        expectSameNumbers(back, doc, 'BeerJSON');
        expectSameIngredients(back, doc, 'BeerJSON');
      }),
      { numRuns: 300 },
    );
  });

  it('and a recipe read back is read the same a second time (the trip is stable)', () => {
    fc.assert(
      fc.property(generatedWholeSeconds, (doc) => {
        const once = beerJsonTrip(doc);
        expect(beerJsonTrip(once)).toEqual(once);
        const onceXml = beerXmlTrip(doc);
        expect(beerXmlTrip(onceXml)).toEqual(onceXml);
      }),
      { numRuns: 100 },
    );
  });
});
