import fc from 'fast-check';
import { XMLParser } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { preBoilVolumeL, recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import { recipeInputArb } from '@/lib/brewing/test-fixtures';
import { toBeerXml } from './beerxml/write';
import { seededDocuments } from './test-helpers';

/**
 * Every record a BeerXML export writes carries the fields the BeerXML 1.0 specification marks
 * required, with the values its tables allow, in its units (Smith, Avis, Taylor, Perron and
 * Johnson, "BeerXML: An XML Standard for Beer Brewing Data", version 1.0, 2004; the record
 * tables of RECIPE, HOP, FERMENTABLE, YEAST, MISC, WATER, STYLE, EQUIPMENT, MASH and MASH_STEP).
 */

const REQUIRED: Record<string, string[]> = {
  RECIPE: [
    'NAME',
    'VERSION',
    'TYPE',
    'STYLE',
    'BREWER',
    'BATCH_SIZE',
    'BOIL_SIZE',
    'BOIL_TIME',
    'EFFICIENCY',
    'HOPS',
    'FERMENTABLES',
    'MISCS',
    'YEASTS',
    'WATERS',
    'MASH',
  ],
  HOP: ['NAME', 'VERSION', 'ALPHA', 'AMOUNT', 'USE', 'TIME'],
  FERMENTABLE: ['NAME', 'VERSION', 'TYPE', 'AMOUNT', 'YIELD', 'COLOR'],
  YEAST: ['NAME', 'VERSION', 'TYPE', 'FORM', 'AMOUNT'],
  MISC: ['NAME', 'VERSION', 'TYPE', 'USE', 'TIME', 'AMOUNT'],
  WATER: ['NAME', 'VERSION', 'AMOUNT', 'CALCIUM', 'BICARBONATE', 'SULFATE', 'CHLORIDE', 'SODIUM', 'MAGNESIUM'],
  STYLE: [
    'NAME',
    'CATEGORY',
    'VERSION',
    'CATEGORY_NUMBER',
    'STYLE_LETTER',
    'STYLE_GUIDE',
    'TYPE',
    'OG_MIN',
    'OG_MAX',
    'FG_MIN',
    'FG_MAX',
    'IBU_MIN',
    'IBU_MAX',
    'COLOR_MIN',
    'COLOR_MAX',
  ],
  EQUIPMENT: ['NAME', 'VERSION', 'BOIL_SIZE', 'BATCH_SIZE'],
  MASH: ['NAME', 'VERSION', 'GRAIN_TEMP', 'MASH_STEPS'],
  MASH_STEP: ['NAME', 'VERSION', 'TYPE', 'STEP_TEMP', 'STEP_TIME'],
};

/** The specification's lists of allowed values. */
const CHOICES: Record<string, Record<string, string[]>> = {
  RECIPE: { TYPE: ['Extract', 'Partial Mash', 'All Grain'] },
  HOP: { USE: ['Boil', 'Dry Hop', 'Mash', 'First Wort', 'Aroma'], FORM: ['Pellet', 'Plug', 'Leaf'] },
  FERMENTABLE: { TYPE: ['Grain', 'Sugar', 'Extract', 'Dry Extract', 'Adjunct'] },
  YEAST: {
    TYPE: ['Ale', 'Lager', 'Wheat', 'Wine', 'Champagne'],
    FORM: ['Liquid', 'Dry', 'Slant', 'Culture'],
  },
  MISC: {
    TYPE: ['Spice', 'Fining', 'Water Agent', 'Herb', 'Flavor', 'Other'],
    USE: ['Boil', 'Mash', 'Primary', 'Secondary', 'Bottling'],
  },
  STYLE: { TYPE: ['Lager', 'Ale', 'Mead', 'Wheat', 'Mixed', 'Cider'] },
  MASH_STEP: { TYPE: ['Infusion', 'Temperature', 'Decoction'] },
};

/** Fields the specification gives as numbers (floating point or integer). */
const NUMBERS = new Set([
  'VERSION',
  'BATCH_SIZE',
  'BOIL_SIZE',
  'BOIL_TIME',
  'EFFICIENCY',
  'ALPHA',
  'AMOUNT',
  'TIME',
  'YIELD',
  'COLOR',
  'CALCIUM',
  'BICARBONATE',
  'SULFATE',
  'CHLORIDE',
  'SODIUM',
  'MAGNESIUM',
  'OG_MIN',
  'OG_MAX',
  'FG_MIN',
  'FG_MAX',
  'IBU_MIN',
  'IBU_MAX',
  'COLOR_MIN',
  'COLOR_MAX',
  'GRAIN_TEMP',
  'STEP_TEMP',
  'STEP_TIME',
  'INFUSE_AMOUNT',
]);

const RECORDS = Object.keys(REQUIRED);
const GROUPS = ['HOPS', 'FERMENTABLES', 'MISCS', 'YEASTS', 'WATERS', 'MASH_STEPS'];

const parser = new XMLParser({ parseTagValue: false, isArray: (name) => RECORDS.includes(name) });

type XmlNode = Record<string, unknown>;

/** Every record in the file, by tag, with the path that reached it. */
function records(node: unknown, path: string, found: { tag: string; path: string; node: XmlNode }[] = []) {
  if (node === null || typeof node !== 'object') return found;
  for (const [tag, value] of Object.entries(node as XmlNode)) {
    const items = Array.isArray(value) ? value : [value];
    items.forEach((item, i) => {
      if (RECORDS.includes(tag)) found.push({ tag, path: `${path}/${tag}[${i}]`, node: item as XmlNode });
      records(item, `${path}/${tag}`, found);
    });
  }
  return found;
}

function expectRequiredFields(xml: string, label: string): void {
  const parsed = parser.parse(xml) as XmlNode;
  const found = records(parsed, '');
  expect(
    found.filter((r) => r.tag === 'RECIPE'),
    label,
  ).toHaveLength(1);
  for (const { tag, path, node } of found) {
    const where = `${label} ${path}`;
    const required = [...REQUIRED[tag]];
    if (tag === 'MASH_STEP' && node.TYPE === 'Infusion') required.push('INFUSE_AMOUNT');
    for (const field of required) {
      const value = node[field];
      expect(value, `${where} › ${field}`).toBeDefined();
      // A record set may be empty (no hops); every other required field has a value.
      if (!GROUPS.includes(field) && field !== 'STYLE' && field !== 'MASH')
        expect(String(value).trim(), `${where} › ${field}`).not.toBe('');
    }
    expect(node.VERSION, `${where} › VERSION`).toBe('1');
    for (const [field, allowed] of Object.entries(CHOICES[tag] ?? {}))
      if (node[field] !== undefined) expect(allowed, `${where} › ${field}`).toContain(node[field]);
    for (const [field, value] of Object.entries(node))
      if (NUMBERS.has(field)) expect(String(value), `${where} › ${field}`).toMatch(/^-?\d+(\.\d+)?$/);
  }
}

/** The values land in the specification's units: kg, L, minutes, °C and percent. */
function expectSpecUnits(xml: string, doc: RecipeDocument, label: string): void {
  const recipe = (parser.parse(xml) as { RECIPES: { RECIPE: XmlNode[] } }).RECIPES.RECIPE[0];
  const num = (node: XmlNode, tag: string) => Number(node[tag]);
  const near = (a: number, b: number) => Math.abs(a - b) <= Math.abs(b) * 1e-9 + 1e-12;
  expect(near(num(recipe, 'BATCH_SIZE'), doc.batch.volumeL), `${label} BATCH_SIZE in L`).toBe(true);
  expect(near(num(recipe, 'BOIL_SIZE'), preBoilVolumeL(doc.batch)), `${label} BOIL_SIZE in L`).toBe(true);
  expect(near(num(recipe, 'BOIL_TIME'), doc.batch.boilTimeMin), `${label} BOIL_TIME in min`).toBe(true);
  expect(near(num(recipe, 'EFFICIENCY'), doc.batch.efficiencyPct), `${label} EFFICIENCY in %`).toBe(true);
  const inGroup = (holder: XmlNode, tag: string, item: string): XmlNode[] => {
    const held = holder[tag];
    return held && typeof held === 'object' ? ((held as XmlNode)[item] as XmlNode[]) : [];
  };
  const hops = inGroup(recipe, 'HOPS', 'HOP');
  doc.hops.forEach((h, i) => {
    expect(near(num(hops[i], 'AMOUNT'), h.amountG / 1000), `${label} HOP ${i} AMOUNT in kg`).toBe(true);
    expect(near(num(hops[i], 'TIME'), h.timeMin), `${label} HOP ${i} TIME in min`).toBe(true);
    expect(near(num(hops[i], 'ALPHA'), h.alphaPct), `${label} HOP ${i} ALPHA in %`).toBe(true);
  });
  const fermentables = inGroup(recipe, 'FERMENTABLES', 'FERMENTABLE');
  doc.fermentables.forEach((f, i) =>
    expect(near(num(fermentables[i], 'AMOUNT'), f.amountKg), `${label} FERMENTABLE ${i} AMOUNT in kg`).toBe(true),
  );
  const steps = inGroup((recipe.MASH as XmlNode[])[0], 'MASH_STEPS', 'MASH_STEP');
  doc.mash.steps.forEach((s, i) => {
    expect(near(num(steps[i], 'STEP_TEMP'), s.tempC), `${label} MASH_STEP ${i} STEP_TEMP in °C`).toBe(true);
    expect(near(num(steps[i], 'STEP_TIME'), s.timeMin), `${label} MASH_STEP ${i} STEP_TIME in min`).toBe(true);
  });
  const salts = inGroup(recipe, 'MISCS', 'MISC');
  (doc.water?.salts ?? []).forEach((s, i) =>
    expect(near(num(salts[i], 'AMOUNT'), s.grams / 1000), `${label} MISC ${i} AMOUNT in kg`).toBe(true),
  );
}

describe('BeerXML exports carry every field BeerXML 1.0 requires, in its units', () => {
  it('for every document the demo seed saves, with and without a named brewer', () => {
    for (const { key, document } of seededDocuments()) {
      for (const brewer of ['Orla Finch', undefined]) {
        const xml = toBeerXml(document, { brewer });
        expectRequiredFields(xml, key);
        expectSpecUnits(xml, document, key);
      }
    }
  });

  it('for a recipe with no style, no water, no hops and unnamed mash steps', () => {
    const doc = structuredClone(seededDocuments()[0].document);
    doc.style = undefined;
    doc.water = undefined;
    doc.hops = [];
    doc.mash.steps = [
      { tempC: 52, timeMin: 15 },
      { tempC: 67, timeMin: 60 },
    ];
    const xml = toBeerXml(doc);
    expectRequiredFields(xml, 'bare');
    expect(xml).toContain('<NAME>Step 1</NAME>');
    expect(xml).toContain('<BREWER>Kettlefork brewer</BREWER>');
  });

  it('for generated documents across the whole schema', () => {
    fc.assert(
      fc.property(
        recipeInputArb().map((input) => recipeDocumentSchema.parse(input)),
        (doc) => {
          const xml = toBeerXml(doc);
          expectRequiredFields(xml, 'generated');
          expectSpecUnits(xml, doc, 'generated');
        },
      ),
      { numRuns: 100 },
    );
  });
});
