import type { FermentableKind, YeastKind } from './schema';

/**
 * A starter catalogue of generic ingredients (Kettlefork's own data): malt
 * types, long-public hop varieties and yeast kinds with typical values. Each
 * entry names where its numbers come from; "common practice" marks values
 * the trade uses without one printed source.
 */

const PALMER_TABLE_9 = 'Palmer, How to Brew, Table 9 (maximum ppg)';
const PALMER_TABLE_9_AND_CH_12 = 'Palmer, How to Brew, Table 9 (ppg) and ch. 12 (colour)';
const PPG_PALMER_COLOUR_COMMON = 'Palmer, How to Brew, Table 9 (ppg); colour common practice, from memory';
const COMMON_PRACTICE = 'common practice, from memory';
const HOP_RANGE_SOURCE = 'typical range in growers’ variety descriptions; common practice, from memory';

export interface CatalogueFermentable {
  id: string;
  name: string;
  kind: FermentableKind;
  potentialPpg: number;
  colorLovibond: number;
  source: string;
}

export interface CatalogueHop {
  id: string;
  name: string;
  alphaPctMin: number;
  alphaPctMax: number;
  source: string;
}

export interface CatalogueYeastKind {
  id: string;
  name: string;
  kind: YeastKind;
  attenuationPctMin: number;
  attenuationPctMax: number;
  tempMinC: number;
  tempMaxC: number;
  note: string;
  source: string;
}

export const CATALOGUE_FERMENTABLES: readonly CatalogueFermentable[] = [
  {
    id: 'pilsner-malt',
    name: 'Pilsner (lager) malt, 2-row',
    kind: 'grain',
    potentialPpg: 37,
    colorLovibond: 2,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'six-row-malt',
    name: 'Pale malt, 6-row',
    kind: 'grain',
    potentialPpg: 35,
    colorLovibond: 2,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'pale-ale-malt',
    name: 'Pale ale malt, 2-row',
    kind: 'grain',
    potentialPpg: 38,
    colorLovibond: 3,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'vienna-malt',
    name: 'Vienna malt',
    kind: 'grain',
    potentialPpg: 35,
    colorLovibond: 4,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'munich-malt',
    name: 'Munich malt',
    kind: 'grain',
    potentialPpg: 35,
    colorLovibond: 10,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'wheat-malt',
    name: 'Wheat malt',
    kind: 'grain',
    potentialPpg: 37,
    colorLovibond: 3,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'rye-malt',
    name: 'Rye malt',
    kind: 'grain',
    potentialPpg: 29,
    colorLovibond: 3,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'crystal-10',
    name: 'Crystal malt 10 °L',
    kind: 'grain',
    potentialPpg: 35,
    colorLovibond: 10,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'crystal-40',
    name: 'Crystal malt 40 °L',
    kind: 'grain',
    potentialPpg: 34,
    colorLovibond: 40,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'crystal-60',
    name: 'Crystal malt 60 °L',
    kind: 'grain',
    potentialPpg: 34,
    colorLovibond: 60,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'crystal-120',
    name: 'Crystal malt 120 °L',
    kind: 'grain',
    potentialPpg: 33,
    colorLovibond: 120,
    source: PALMER_TABLE_9_AND_CH_12,
  },
  {
    id: 'chocolate-malt',
    name: 'Chocolate malt',
    kind: 'grain',
    potentialPpg: 28,
    colorLovibond: 350,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'roast-barley',
    name: 'Roast barley',
    kind: 'grain',
    potentialPpg: 25,
    colorLovibond: 300,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'black-malt',
    name: 'Black malt',
    kind: 'grain',
    potentialPpg: 25,
    colorLovibond: 500,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'flaked-oats',
    name: 'Flaked oats',
    kind: 'adjunct',
    potentialPpg: 32,
    colorLovibond: 1,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'flaked-barley',
    name: 'Flaked barley',
    kind: 'adjunct',
    potentialPpg: 32,
    colorLovibond: 2,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'flaked-corn',
    name: 'Flaked corn (maize)',
    kind: 'adjunct',
    potentialPpg: 39,
    colorLovibond: 1,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'flaked-rice',
    name: 'Flaked rice',
    kind: 'adjunct',
    potentialPpg: 38,
    colorLovibond: 1,
    source: PPG_PALMER_COLOUR_COMMON,
  },
  {
    id: 'table-sugar',
    name: 'Table sugar (sucrose)',
    kind: 'sugar',
    potentialPpg: 46,
    colorLovibond: 0,
    source: PALMER_TABLE_9,
  },
  {
    id: 'dextrose',
    name: 'Dextrose (corn sugar)',
    kind: 'sugar',
    potentialPpg: 42,
    colorLovibond: 0,
    source: COMMON_PRACTICE,
  },
  {
    id: 'dried-malt-extract',
    name: 'Dried malt extract, light',
    kind: 'extract',
    potentialPpg: 44,
    colorLovibond: 4,
    source: COMMON_PRACTICE,
  },
  {
    id: 'liquid-malt-extract',
    name: 'Liquid malt extract, light',
    kind: 'extract',
    potentialPpg: 36,
    colorLovibond: 4,
    source: COMMON_PRACTICE,
  },
];

export const CATALOGUE_HOPS: readonly CatalogueHop[] = [
  { id: 'cascade', name: 'Cascade', alphaPctMin: 4.5, alphaPctMax: 7, source: HOP_RANGE_SOURCE },
  { id: 'centennial', name: 'Centennial', alphaPctMin: 9.5, alphaPctMax: 11.5, source: HOP_RANGE_SOURCE },
  { id: 'chinook', name: 'Chinook', alphaPctMin: 12, alphaPctMax: 14, source: HOP_RANGE_SOURCE },
  { id: 'cluster', name: 'Cluster', alphaPctMin: 5.5, alphaPctMax: 8.5, source: HOP_RANGE_SOURCE },
  { id: 'columbus', name: 'Columbus', alphaPctMin: 14, alphaPctMax: 18, source: HOP_RANGE_SOURCE },
  { id: 'fuggle', name: 'Fuggle', alphaPctMin: 3.5, alphaPctMax: 5.5, source: HOP_RANGE_SOURCE },
  { id: 'east-kent-golding', name: 'East Kent Golding', alphaPctMin: 4, alphaPctMax: 6, source: HOP_RANGE_SOURCE },
  {
    id: 'hallertau-mittelfrueh',
    name: 'Hallertau Mittelfrüh',
    alphaPctMin: 3,
    alphaPctMax: 5.5,
    source: HOP_RANGE_SOURCE,
  },
  { id: 'saaz', name: 'Saaz', alphaPctMin: 2.5, alphaPctMax: 4.5, source: HOP_RANGE_SOURCE },
  { id: 'tettnang', name: 'Tettnang', alphaPctMin: 3.5, alphaPctMax: 5.5, source: HOP_RANGE_SOURCE },
  { id: 'northern-brewer', name: 'Northern Brewer', alphaPctMin: 7, alphaPctMax: 10, source: HOP_RANGE_SOURCE },
  { id: 'nugget', name: 'Nugget', alphaPctMin: 12, alphaPctMax: 15, source: HOP_RANGE_SOURCE },
  { id: 'willamette', name: 'Willamette', alphaPctMin: 4, alphaPctMax: 6, source: HOP_RANGE_SOURCE },
  { id: 'magnum', name: 'Magnum', alphaPctMin: 12, alphaPctMax: 14, source: HOP_RANGE_SOURCE },
  { id: 'perle', name: 'Perle', alphaPctMin: 6, alphaPctMax: 9, source: HOP_RANGE_SOURCE },
  { id: 'galena', name: 'Galena', alphaPctMin: 11, alphaPctMax: 13.5, source: HOP_RANGE_SOURCE },
];

export const CATALOGUE_YEAST_KINDS: readonly CatalogueYeastKind[] = [
  {
    id: 'clean-ale',
    name: 'Clean ale yeast',
    kind: 'ale',
    attenuationPctMin: 73,
    attenuationPctMax: 80,
    tempMinC: 15,
    tempMaxC: 22,
    note: 'Neutral; lets malt and hops speak.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'english-ale',
    name: 'English ale yeast',
    kind: 'ale',
    attenuationPctMin: 65,
    attenuationPctMax: 72,
    tempMinC: 17,
    tempMaxC: 21,
    note: 'Flocculent, leaves some sweetness and light fruity esters.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'belgian-ale',
    name: 'Belgian ale yeast',
    kind: 'ale',
    attenuationPctMin: 74,
    attenuationPctMax: 85,
    tempMinC: 18,
    tempMaxC: 26,
    note: 'Spicy phenols and fruity esters that grow with temperature.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'wheat-beer',
    name: 'Hefeweizen-style wheat yeast',
    kind: 'wheat',
    attenuationPctMin: 72,
    attenuationPctMax: 77,
    tempMinC: 17,
    tempMaxC: 24,
    note: 'Banana and clove; cooler favours clove, warmer banana.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'lager',
    name: 'Lager yeast',
    kind: 'lager',
    attenuationPctMin: 72,
    attenuationPctMax: 80,
    tempMinC: 8,
    tempMaxC: 14,
    note: 'Bottom-fermenting; wants a cool ferment and a cold conditioning.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'kveik',
    name: 'Kveik (Norwegian farmhouse) yeast',
    kind: 'kveik',
    attenuationPctMin: 75,
    attenuationPctMax: 82,
    tempMinC: 29,
    tempMaxC: 35,
    note: 'Ferments fast and clean when hot; may stall when kept cool.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'saison',
    name: 'Saison-style farmhouse yeast',
    kind: 'ale',
    attenuationPctMin: 80,
    attenuationPctMax: 90,
    tempMinC: 20,
    tempMaxC: 32,
    note: 'Very dry, peppery; often let rise in temperature late in fermentation.',
    source: COMMON_PRACTICE,
  },
  {
    id: 'wild-brett',
    name: 'Wild yeast (Brettanomyces)',
    kind: 'wild',
    attenuationPctMin: 80,
    attenuationPctMax: 95,
    tempMinC: 18,
    tempMaxC: 28,
    note: 'Slow; keeps drying a beer out over months.',
    source: COMMON_PRACTICE,
  },
];

export function findCatalogueFermentable(id: string): CatalogueFermentable | undefined {
  return CATALOGUE_FERMENTABLES.find((entry) => entry.id === id);
}

export function findCatalogueHop(id: string): CatalogueHop | undefined {
  return CATALOGUE_HOPS.find((entry) => entry.id === id);
}

export function findCatalogueYeastKind(id: string): CatalogueYeastKind | undefined {
  return CATALOGUE_YEAST_KINDS.find((entry) => entry.id === id);
}
