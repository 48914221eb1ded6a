import {
  findCatalogueFermentable,
  findCatalogueHop,
  findCatalogueYeastKind,
  findStyle,
  type RecipeDocumentInput,
} from '@/lib/brewing';

// The demo club's recipes: invented titles and notes, generic ingredients from our catalogue.
type HopUse = 'boil' | 'whirlpool' | 'dry_hop' | 'first_wort';

export function malt(id: string, amountKg: number) {
  const f = findCatalogueFermentable(id);
  if (!f) throw new Error(`unknown malt ${id}`);
  return { name: f.name, amountKg, potentialPpg: f.potentialPpg, colorLovibond: f.colorLovibond, kind: f.kind };
}

export function hop(id: string, amountG: number, use: HopUse, timeMin: number) {
  const h = findCatalogueHop(id);
  if (!h) throw new Error(`unknown hop ${id}`);
  return { name: h.name, amountG, alphaPct: Math.round(((h.alphaPctMin + h.alphaPctMax) / 2) * 10) / 10, use, timeMin, form: 'pellet' as const };
}

export function yeast(id: string) {
  const y = findCatalogueYeastKind(id);
  if (!y) throw new Error(`unknown yeast ${id}`);
  return {
    name: y.name,
    kind: y.kind,
    attenuationPct: Math.round((y.attenuationPctMin + y.attenuationPctMax) / 2),
    tempMinC: y.tempMinC,
    tempMaxC: y.tempMaxC,
  };
}

function style(code: string) {
  const s = findStyle(code);
  if (!s) throw new Error(`unknown style ${code}`);
  return { code: s.code, name: s.name };
}

export interface DemoRecipe {
  key: string;
  owner: string;
  visibility?: 'public' | 'unlisted' | 'private';
  document: RecipeDocumentInput;
  /** Later versions: each a change to the previous document, with its message. */
  versions?: { message: string; change: (doc: RecipeDocumentInput) => void }[];
}

const batch = (volumeL = 20, efficiencyPct = 72) => ({ volumeL, boilTimeMin: 60, efficiencyPct });
const singleInfusion = (tempC = 66) => ({ steps: [{ name: 'Saccharification', tempC, timeMin: 60 }] });
const ferment = (tempC: number, days = 14) => ({ steps: [{ tempC, days }] });
const softWater = (volumeL: number, salts: { salt: 'gypsum' | 'epsom' | 'table_salt' | 'calcium_chloride' | 'baking_soda'; grams: number }[]) => ({
  volumeL,
  source: { calcium: 18, magnesium: 4, sodium: 9, chloride: 14, sulfate: 16, bicarbonate: 45 },
  salts,
});

export const demoRecipes: DemoRecipe[] = [
  {
    key: 'millrace-pale',
    owner: 'wren',
    document: {
      title: 'Millrace Pale Ale',
      batch: batch(),
      fermentables: [malt('pale-ale-malt', 4.3), malt('munich-malt', 0.4), malt('crystal-40', 0.25)],
      hops: [hop('magnum', 14, 'boil', 60), hop('cascade', 25, 'boil', 10), hop('centennial', 30, 'whirlpool', 20), hop('cascade', 50, 'dry_hop', 4320)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(66),
      fermentation: ferment(18),
      water: softWater(30, [{ salt: 'gypsum', grams: 5 }, { salt: 'calcium_chloride', grams: 2 }]),
      carbonation: { volumesCO2: 2.4, servingTempC: 4 },
      style: style('18B'),
      notes: 'Our shed pale ale. Grapefruit from the dry hop, a firm but clean bitterness.\n\n- Chill to 18 °C before pitching.\n- Dry hop on day 4.',
    },
    versions: [
      { message: 'More whirlpool Centennial for a fuller aroma', change: (d) => void (d.hops[2].amountG = 45) },
      { message: 'Mashed 1 °C cooler for a drier finish', change: (d) => void (d.mash.steps[0].tempC = 65) },
    ],
  },
  {
    key: 'orchard-ipa',
    owner: 'kofi',
    document: {
      title: 'Orchard Gate IPA',
      batch: batch(21),
      fermentables: [malt('pale-ale-malt', 5.6), malt('wheat-malt', 0.4), malt('crystal-10', 0.3)],
      hops: [hop('columbus', 18, 'boil', 60), hop('centennial', 30, 'boil', 15), hop('chinook', 40, 'whirlpool', 20), hop('cascade', 60, 'dry_hop', 5760), hop('centennial', 40, 'dry_hop', 5760)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(65),
      fermentation: ferment(19),
      water: softWater(32, [{ salt: 'gypsum', grams: 8 }, { salt: 'epsom', grams: 2 }]),
      carbonation: { volumesCO2: 2.5, servingTempC: 4 },
      style: style('21A'),
      notes: 'Piney and resinous. Keep the crystal low; let the hops talk.',
    },
    versions: [{ message: 'Added a first-wort charge of Chinook', change: (d) => void d.hops.unshift(hop('chinook', 15, 'first_wort', 60)) }],
  },
  {
    key: 'lantern-stout',
    owner: 'tamsin',
    document: {
      title: 'Lantern Oatmeal Stout',
      batch: batch(),
      fermentables: [malt('pale-ale-malt', 3.8), malt('flaked-oats', 0.6), malt('chocolate-malt', 0.35), malt('roast-barley', 0.3), malt('crystal-60', 0.3)],
      hops: [hop('east-kent-golding', 40, 'boil', 60), hop('fuggle', 20, 'boil', 15)],
      yeasts: [yeast('english-ale')],
      mash: singleInfusion(68),
      fermentation: ferment(19),
      carbonation: { volumesCO2: 2.0, servingTempC: 10 },
      style: style('16B'),
      notes: 'Silky, coffee and cocoa. Serve a little warmer than a lager.',
    },
    versions: [
      { message: 'More oats for a rounder body', change: (d) => void (d.fermentables[1].amountKg = 0.8) },
      { message: 'Cut roast barley; it was a touch acrid', change: (d) => void (d.fermentables[3].amountKg = 0.22) },
    ],
  },
  {
    key: 'weir-pils',
    owner: 'agnieszka',
    document: {
      title: 'Weir House Pils',
      batch: batch(23, 75),
      fermentables: [malt('pilsner-malt', 4.6)],
      hops: [hop('hallertau-mittelfrueh', 30, 'boil', 60), hop('saaz', 30, 'boil', 20), hop('saaz', 30, 'whirlpool', 10)],
      yeasts: [yeast('lager')],
      mash: { steps: [{ name: 'Protein rest', tempC: 52, timeMin: 10 }, { name: 'Saccharification', tempC: 64, timeMin: 60 }, { name: 'Mash-out', tempC: 76, timeMin: 10 }] },
      fermentation: { steps: [{ tempC: 10, days: 14 }, { tempC: 16, days: 3 }, { tempC: 1, days: 28 }] },
      water: { volumeL: 34, source: { calcium: 8, magnesium: 2, sodium: 4, chloride: 6, sulfate: 5, bicarbonate: 15 }, salts: [{ salt: 'calcium_chloride', grams: 2 }] },
      carbonation: { volumesCO2: 2.6, servingTempC: 4 },
      style: style('5D'),
      notes: 'Crisp, floral, patient. The long cold rest is the recipe.',
    },
  },
  {
    key: 'riverbank-weizen',
    owner: 'ilse',
    document: {
      title: 'Riverbank Weizen',
      batch: batch(),
      fermentables: [malt('wheat-malt', 2.6), malt('pilsner-malt', 1.9)],
      hops: [hop('hallertau-mittelfrueh', 20, 'boil', 60)],
      yeasts: [yeast('wheat-beer')],
      mash: singleInfusion(66),
      fermentation: ferment(19, 10),
      carbonation: { volumesCO2: 3.3, servingTempC: 6 },
      style: style('10A'),
      notes: 'Banana and clove. Bottle with plenty of sparkle, in bottles rated for it.',
    },
  },
  {
    key: 'porch-bitter',
    owner: 'hollis',
    document: {
      title: 'Porch Light Best Bitter',
      batch: batch(19),
      fermentables: [malt('pale-ale-malt', 3.3), malt('crystal-60', 0.25), malt('table-sugar', 0.2)],
      hops: [hop('east-kent-golding', 35, 'boil', 60), hop('fuggle', 25, 'boil', 10)],
      yeasts: [yeast('english-ale')],
      mash: singleInfusion(67),
      fermentation: ferment(19, 10),
      carbonation: { volumesCO2: 1.8, servingTempC: 11 },
      style: style('11B'),
      notes: 'Low carbonation, biscuit and marmalade. A session beer for long evenings.',
    },
  },
  {
    key: 'farmhouse-saison',
    owner: 'rufus',
    document: {
      title: 'Hayloft Saison',
      batch: batch(),
      fermentables: [malt('pilsner-malt', 3.8), malt('wheat-malt', 0.5), malt('dextrose', 0.3)],
      hops: [hop('saaz', 30, 'boil', 60), hop('saaz', 25, 'boil', 5)],
      yeasts: [yeast('saison')],
      mash: singleInfusion(64),
      fermentation: { steps: [{ tempC: 22, days: 3 }, { tempC: 27, days: 11 }] },
      carbonation: { volumesCO2: 3.0, servingTempC: 8 },
      style: style('25B'),
      notes: 'Let it free-rise. Peppery, dry, thirst-quenching.',
    },
  },
  {
    key: 'brother-dubbel',
    owner: 'marisol',
    document: {
      title: 'Stovetop Dubbel',
      batch: batch(19),
      fermentables: [malt('pilsner-malt', 4.4), malt('munich-malt', 0.6), malt('crystal-120', 0.2), malt('table-sugar', 0.5)],
      hops: [hop('tettnang', 30, 'boil', 60)],
      yeasts: [yeast('belgian-ale')],
      mash: singleInfusion(66),
      fermentation: { steps: [{ tempC: 19, days: 4 }, { tempC: 23, days: 10 }] },
      carbonation: { volumesCO2: 2.8, servingTempC: 10 },
      style: style('26B'),
      notes: 'Dark fruit and caramel. Sugar goes in at flame-out.',
    },
  },
  {
    key: 'smokehouse-porter',
    owner: 'dov',
    document: {
      title: 'Signal Box Porter',
      batch: batch(),
      fermentables: [malt('pale-ale-malt', 4.0), malt('munich-malt', 0.5), malt('chocolate-malt', 0.35), malt('crystal-60', 0.35), malt('black-malt', 0.1)],
      hops: [hop('northern-brewer', 25, 'boil', 60), hop('willamette', 25, 'boil', 15)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(67),
      fermentation: ferment(18),
      water: softWater(30, [{ salt: 'calcium_chloride', grams: 4 }, { salt: 'baking_soda', grams: 2 }]),
      carbonation: { volumesCO2: 2.2, servingTempC: 8 },
      style: style('20A'),
      notes: 'A little baking soda keeps the dark malts from tasting sharp in our soft water.',
    },
  },
  {
    key: 'garage-kveik',
    owner: 'bastian',
    document: {
      title: 'Garage Heat Kveik Pale',
      batch: batch(),
      fermentables: [malt('pale-ale-malt', 4.2), malt('flaked-oats', 0.4)],
      hops: [hop('chinook', 15, 'boil', 60), hop('cascade', 50, 'whirlpool', 20)],
      yeasts: [yeast('kveik')],
      mash: singleInfusion(67),
      fermentation: ferment(32, 5),
      carbonation: { volumesCO2: 2.4, servingTempC: 4 },
      style: style('18B'),
      notes: 'Pitched at 32 °C in a warm garage; done in three days. Orange-peel esters.',
    },
  },
  {
    key: 'amber-lantern',
    owner: 'juniper',
    document: {
      title: 'First Try Amber',
      batch: batch(19, 68),
      fermentables: [malt('pale-ale-malt', 4.0), malt('crystal-60', 0.4), malt('munich-malt', 0.3)],
      hops: [hop('cascade', 25, 'boil', 60), hop('cascade', 20, 'boil', 10)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(67),
      fermentation: ferment(18),
      style: style('19A'),
      notes: 'My first all-grain brew. Advice welcome!',
    },
  },
  {
    key: 'ottoline-helles',
    owner: 'ottoline',
    document: {
      title: 'Chest Freezer Helles',
      batch: batch(22, 74),
      fermentables: [malt('pilsner-malt', 4.2), malt('munich-malt', 0.2)],
      hops: [hop('hallertau-mittelfrueh', 25, 'boil', 60), hop('tettnang', 15, 'boil', 15)],
      yeasts: [yeast('lager')],
      mash: singleInfusion(65),
      fermentation: { steps: [{ tempC: 10, days: 14 }, { tempC: 1, days: 30 }] },
      carbonation: { volumesCO2: 2.5, servingTempC: 4 },
      style: style('4A'),
      notes: 'Bready, soft, a whisper of hops.',
    },
  },
  {
    key: 'spam',
    owner: 'spamly',
    document: {
      title: 'BEST CHEAP WATCHES visit now',
      batch: batch(),
      fermentables: [malt('pale-ale-malt', 4)],
      hops: [],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(66),
      fermentation: ferment(18),
      notes: 'Great deals on watches!!! [click here](https://deals.example/watches)',
    },
  },
];

/** Forks of the demo recipes: who forked which version, and what they changed. */
export interface DemoFork {
  key: string;
  from: string;
  fromVersion: number;
  owner: string;
  title: string;
  versions: { message: string; change: (doc: RecipeDocumentInput) => void }[];
}

export const demoForks: DemoFork[] = [
  {
    key: 'millrace-kveik',
    from: 'millrace-pale',
    fromVersion: 2,
    owner: 'bastian',
    title: 'Millrace Pale, kveik take',
    versions: [
      {
        message: 'Swapped to a kveik strain, fermented at 32 °C',
        change: (d) => {
          d.yeasts = [yeast('kveik')];
          d.fermentation = ferment(32, 5);
        },
      },
      { message: 'Mashed 2 °C hotter for more body', change: (d) => void (d.mash.steps[0].tempC = 68) },
    ],
  },
  {
    key: 'millrace-kveik-rye',
    from: 'millrace-kveik',
    fromVersion: 2,
    owner: 'dov',
    title: 'Millrace Kveik Rye',
    versions: [{ message: 'Half a kilo of rye for spice', change: (d) => void d.fermentables.push(malt('rye-malt', 0.5)) }],
  },
  {
    key: 'lantern-milk-free',
    from: 'lantern-stout',
    fromVersion: 3,
    owner: 'juniper',
    title: 'Lantern Stout, my first go',
    versions: [{ message: 'Lower efficiency on my kit', change: (d) => void (d.batch!.efficiencyPct = 65) }],
  },
  {
    key: 'orchard-session',
    from: 'orchard-ipa',
    fromVersion: 2,
    owner: 'wren',
    title: 'Orchard Gate Session',
    versions: [
      {
        message: 'Less grain for a 4% version',
        change: (d) => {
          d.fermentables[0].amountKg = 3.4;
          d.style = style('18B');
        },
      },
    ],
  },
];
