import { describe, expect, it } from 'vitest';
import {
  CATALOGUE_FERMENTABLES,
  CATALOGUE_HOPS,
  CATALOGUE_YEAST_KINDS,
  findCatalogueFermentable,
  findCatalogueHop,
  findCatalogueYeastKind,
} from './catalogue';
import { recipeDocumentSchema } from './schema';
import { minimalInput } from './test-fixtures';

describe('ingredient catalogue', () => {
  it('marks every entry with its source and has unique ids', () => {
    for (const list of [CATALOGUE_FERMENTABLES, CATALOGUE_HOPS, CATALOGUE_YEAST_KINDS]) {
      const ids = list.map((entry) => entry.id);
      expect(new Set(ids).size).toBe(ids.length);
      for (const entry of list) expect(entry.source.length).toBeGreaterThan(0);
    }
  });

  // John Palmer, How to Brew (3rd ed., 2006; edition and year from memory), Table 9 (maximum ppg) and ch. 12 (colours), as printed.
  it.each([
    ['pilsner-malt', 37, 2],
    ['pale-ale-malt', 38, 3],
    ['vienna-malt', 35, 4],
    ['munich-malt', 35, 10],
    ['wheat-malt', 37, 3],
    ['rye-malt', 29, 3],
    ['crystal-10', 35, 10],
    ['crystal-40', 34, 40],
    ['crystal-60', 34, 60],
    ['crystal-120', 33, 120],
  ])('%s has %s ppg and %s °L', (id, ppg, lovibond) => {
    expect(findCatalogueFermentable(id)).toMatchObject({ potentialPpg: ppg, colorLovibond: lovibond });
  });

  // Palmer, How to Brew (2006), Table 9, as printed: chocolate 28, roast barley and black 25, flaked oats/barley 32,
  // flaked corn 39, flaked rice 38, sugar 46.
  it.each([
    ['chocolate-malt', 28],
    ['roast-barley', 25],
    ['black-malt', 25],
    ['flaked-oats', 32],
    ['flaked-barley', 32],
    ['flaked-corn', 39],
    ['flaked-rice', 38],
    ['table-sugar', 46],
  ])('%s has %s ppg', (id, ppg) => {
    expect(findCatalogueFermentable(id)?.potentialPpg).toBe(ppg);
  });

  it('gives entries the schema accepts', () => {
    const input = minimalInput();
    const fermentables = CATALOGUE_FERMENTABLES.map(({ name, kind, potentialPpg, colorLovibond }) => ({
      name,
      kind,
      potentialPpg,
      colorLovibond,
      amountKg: 0.1,
    }));
    const yeasts = CATALOGUE_YEAST_KINDS.slice(0, 8).map((y) => ({
      name: y.name,
      kind: y.kind,
      attenuationPct: (y.attenuationPctMin + y.attenuationPctMax) / 2,
      tempMinC: y.tempMinC,
      tempMaxC: y.tempMaxC,
    }));
    expect(recipeDocumentSchema.safeParse({ ...input, fermentables, yeasts }).success).toBe(true);
    for (const hop of CATALOGUE_HOPS) {
      expect(hop.alphaPctMin).toBeGreaterThan(0);
      expect(hop.alphaPctMax).toBeLessThanOrEqual(30);
      expect(hop.alphaPctMin).toBeLessThan(hop.alphaPctMax);
    }
  });

  it('lists the long-public hop varieties by name', () => {
    for (const id of ['cascade', 'saaz', 'east-kent-golding', 'hallertau-mittelfrueh', 'magnum']) {
      expect(findCatalogueHop(id)).toBeDefined();
    }
  });

  // Common practice: kveik ferments well hot, around 29–35 °C, and may stall when kept cool.
  it('gives kveik a hot fermentation range', () => {
    const kveik = findCatalogueYeastKind('kveik');
    expect(kveik?.kind).toBe('kveik');
    expect(kveik?.tempMinC).toBeGreaterThanOrEqual(29);
    expect(kveik?.tempMaxC).toBeGreaterThanOrEqual(35);
    const lager = findCatalogueYeastKind('lager');
    expect(lager?.tempMaxC).toBeLessThan(kveik?.tempMinC ?? 0);
  });

  it('covers the usual yeast kinds', () => {
    expect(CATALOGUE_YEAST_KINDS.map((y) => y.id)).toEqual([
      'clean-ale',
      'english-ale',
      'belgian-ale',
      'wheat-beer',
      'lager',
      'kveik',
      'saison',
      'wild-brett',
    ]);
  });
});
