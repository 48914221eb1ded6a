import {
  findCatalogueFermentable,
  findCatalogueHop,
  findCatalogueYeastKind,
  findStyle,
  type RecipeDocumentInput,
} from '@/lib/brewing';

// The demo club's recipes: invented titles and notes, generic ingredients from our catalogue.
type HopUse = 'boil' | 'whirlpool' | 'dry_hop' | 'first_wort';

function malt(id: string, amountKg: number) {
  const f = findCatalogueFermentable(id);
  if (!f) throw new Error(`unknown malt ${id}`);
  return { name: f.name, amountKg, potentialPpg: f.potentialPpg, colorLovibond: f.colorLovibond, kind: f.kind };
}

function hop(id: string, amountG: number, use: HopUse, timeMin: number) {
  const h = findCatalogueHop(id);
  if (!h) throw new Error(`unknown hop ${id}`);
  return {
    name: h.name,
    amountG,
    alphaPct: Math.round(((h.alphaPctMin + h.alphaPctMax) / 2) * 10) / 10,
    use,
    timeMin,
    form: 'pellet' as const,
  };
}

function yeast(id: string) {
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
const softWater = (
  volumeL: number,
  salts: { salt: 'gypsum' | 'epsom' | 'table_salt' | 'calcium_chloride' | 'baking_soda'; grams: number }[],
) => ({
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
      hops: [
        hop('magnum', 14, 'boil', 60),
        hop('cascade', 25, 'boil', 10),
        hop('centennial', 30, 'whirlpool', 20),
        hop('cascade', 50, 'dry_hop', 4320),
      ],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(66),
      fermentation: ferment(18),
      water: softWater(30, [
        { salt: 'gypsum', grams: 5 },
        { salt: 'calcium_chloride', grams: 2 },
      ]),
      carbonation: { volumesCO2: 2.4, servingTempC: 4 },
      style: style('18B'),
      notes:
        'Our shed pale ale. Grapefruit from the dry hop, a firm but clean bitterness.\n\n- Chill to 18 °C before pitching.\n- Dry hop on day 4.',
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
      hops: [
        hop('columbus', 18, 'boil', 60),
        hop('centennial', 30, 'boil', 15),
        hop('chinook', 40, 'whirlpool', 20),
        hop('cascade', 60, 'dry_hop', 5760),
        hop('centennial', 40, 'dry_hop', 5760),
      ],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(65),
      fermentation: ferment(19),
      water: softWater(32, [
        { salt: 'gypsum', grams: 8 },
        { salt: 'epsom', grams: 2 },
      ]),
      carbonation: { volumesCO2: 2.5, servingTempC: 4 },
      style: style('21A'),
      notes: 'Piney and resinous. Keep the crystal low; let the hops talk.',
    },
    versions: [
      {
        message: 'Added a first-wort charge of Chinook',
        change: (d) => void d.hops.unshift(hop('chinook', 15, 'first_wort', 60)),
      },
    ],
  },
  {
    key: 'lantern-stout',
    owner: 'tamsin',
    document: {
      title: 'Lantern Oatmeal Stout',
      batch: batch(),
      fermentables: [
        malt('pale-ale-malt', 3.8),
        malt('flaked-oats', 0.6),
        malt('chocolate-malt', 0.35),
        malt('roast-barley', 0.3),
        malt('crystal-60', 0.3),
      ],
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
      hops: [
        hop('hallertau-mittelfrueh', 30, 'boil', 60),
        hop('saaz', 30, 'boil', 20),
        hop('saaz', 30, 'whirlpool', 10),
      ],
      yeasts: [yeast('lager')],
      mash: {
        steps: [
          { name: 'Protein rest', tempC: 52, timeMin: 10 },
          { name: 'Saccharification', tempC: 64, timeMin: 60 },
          { name: 'Mash-out', tempC: 76, timeMin: 10 },
        ],
      },
      fermentation: {
        steps: [
          { tempC: 10, days: 14 },
          { tempC: 16, days: 3 },
          { tempC: 1, days: 28 },
        ],
      },
      water: {
        volumeL: 34,
        source: { calcium: 8, magnesium: 2, sodium: 4, chloride: 6, sulfate: 5, bicarbonate: 15 },
        salts: [{ salt: 'calcium_chloride', grams: 2 }],
      },
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
      fermentation: {
        steps: [
          { tempC: 22, days: 3 },
          { tempC: 27, days: 11 },
        ],
      },
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
      fermentables: [
        malt('pilsner-malt', 4.4),
        malt('munich-malt', 0.6),
        malt('crystal-120', 0.2),
        malt('table-sugar', 0.5),
      ],
      hops: [hop('tettnang', 30, 'boil', 60)],
      yeasts: [yeast('belgian-ale')],
      mash: singleInfusion(66),
      fermentation: {
        steps: [
          { tempC: 19, days: 4 },
          { tempC: 23, days: 10 },
        ],
      },
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
      fermentables: [
        malt('pale-ale-malt', 4.0),
        malt('munich-malt', 0.5),
        malt('chocolate-malt', 0.35),
        malt('crystal-60', 0.35),
        malt('black-malt', 0.1),
      ],
      hops: [hop('northern-brewer', 25, 'boil', 60), hop('willamette', 25, 'boil', 15)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(67),
      fermentation: ferment(18),
      water: softWater(30, [
        { salt: 'calcium_chloride', grams: 4 },
        { salt: 'baking_soda', grams: 2 },
      ]),
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
      fermentation: {
        steps: [
          { tempC: 10, days: 14 },
          { tempC: 1, days: 30 },
        ],
      },
      carbonation: { volumesCO2: 2.5, servingTempC: 4 },
      style: style('4A'),
      notes: 'Bready, soft, a whisper of hops.',
    },
  },
  {
    key: 'golden-hour-blonde',
    owner: 'hollis',
    document: {
      title: 'Golden Hour Blonde',
      batch: batch(19),
      fermentables: [malt('pale-ale-malt', 3.1), malt('vienna-malt', 0.5), malt('crystal-10', 0.15)],
      hops: [hop('willamette', 20, 'boil', 60), hop('cascade', 15, 'boil', 10)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(66),
      fermentation: ferment(18, 10),
      carbonation: { volumesCO2: 2.5, servingTempC: 5 },
      style: style('18A'),
      notes:
        'A porch beer for people who say they do not like beer. Bright, soft, a little honeyed from the Vienna malt.',
    },
    versions: [
      { message: 'Dropped the crystal; it was too sweet', change: (d) => void d.fermentables.splice(2, 1) },
      { message: 'A touch more late Cascade', change: (d) => void (d.hops[1].amountG = 25) },
    ],
  },
  {
    key: 'ridge-double-ipa',
    owner: 'kofi',
    document: {
      title: 'Ridgeline Double IPA',
      batch: batch(20, 70),
      fermentables: [malt('pale-ale-malt', 6.3), malt('table-sugar', 0.5), malt('crystal-10', 0.2)],
      hops: [
        hop('columbus', 40, 'boil', 60),
        hop('centennial', 40, 'boil', 10),
        hop('chinook', 60, 'whirlpool', 20),
        hop('cascade', 80, 'dry_hop', 4320),
        hop('centennial', 60, 'dry_hop', 4320),
      ],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(63),
      fermentation: ferment(19),
      water: softWater(34, [
        { salt: 'gypsum', grams: 10 },
        { salt: 'calcium_chloride', grams: 2 },
      ]),
      carbonation: { volumesCO2: 2.5, servingTempC: 4 },
      style: style('22A'),
      notes:
        'Big, resinous and dangerously drinkable. Sugar keeps it dry; dry hop on day 5 while the yeast is still awake to limit hop creep.',
    },
    versions: [
      { message: 'Whirlpool at a cooler 77 °C for softer bitterness', change: (d) => void (d.hops[2].tempC = 77) },
      {
        message: 'Shortened the dry hop to two days: grassy at three',
        change: (d) => void d.hops.filter((h) => h.use === 'dry_hop').forEach((h) => (h.timeMin = 2880)),
      },
    ],
  },
  {
    key: 'towpath-english-ipa',
    owner: 'hollis',
    document: {
      title: 'Towpath English IPA',
      batch: batch(19),
      fermentables: [malt('pale-ale-malt', 4.5), malt('crystal-60', 0.3), malt('table-sugar', 0.2)],
      hops: [
        hop('northern-brewer', 30, 'boil', 60),
        hop('east-kent-golding', 40, 'boil', 15),
        hop('fuggle', 30, 'boil', 5),
        hop('east-kent-golding', 30, 'dry_hop', 4320),
      ],
      yeasts: [{ ...yeast('english-ale'), name: 'English ale yeast, drier strain', attenuationPct: 74 }],
      mash: singleInfusion(64),
      fermentation: ferment(19),
      water: softWater(30, [{ salt: 'gypsum', grams: 9 }]),
      carbonation: { volumesCO2: 2.1, servingTempC: 10 },
      style: style('12C'),
      notes: 'Earthy, marmalade and a firm, mineral bitterness from the gypsum.',
    },
    versions: [
      {
        message: 'Swapped the flame-out Fuggle for more Golding',
        change: (d) => void (d.hops[2] = hop('east-kent-golding', 30, 'boil', 5)),
      },
    ],
  },
  {
    key: 'chapel-irish-stout',
    owner: 'tamsin',
    document: {
      title: 'Chapel Lane Dry Stout',
      batch: batch(20),
      fermentables: [malt('pale-ale-malt', 2.8), malt('flaked-barley', 0.6), malt('roast-barley', 0.5)],
      hops: [hop('east-kent-golding', 45, 'boil', 60)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(65),
      fermentation: ferment(19, 10),
      water: softWater(28, [
        { salt: 'calcium_chloride', grams: 2 },
        { salt: 'baking_soda', grams: 1 },
      ]),
      carbonation: { volumesCO2: 1.9, servingTempC: 8 },
      style: style('15B'),
      notes: 'Roasty, dry, light in body. A pint you can drink all evening.',
    },
    versions: [
      {
        message: 'A little more roast barley for a darker head',
        change: (d) => void (d.fermentables[2].amountKg = 0.55),
      },
      { message: 'Mashed cooler for a drier finish', change: (d) => void (d.mash.steps[0].tempC = 64) },
    ],
  },
  {
    key: 'foundry-american-stout',
    owner: 'dov',
    document: {
      title: 'Foundry Yard American Stout',
      batch: batch(20),
      fermentables: [
        malt('pale-ale-malt', 4.5),
        malt('munich-malt', 0.4),
        malt('chocolate-malt', 0.4),
        malt('roast-barley', 0.35),
        malt('crystal-60', 0.3),
      ],
      hops: [hop('chinook', 25, 'boil', 60), hop('cascade', 30, 'boil', 10), hop('cascade', 30, 'whirlpool', 15)],
      yeasts: [yeast('clean-ale')],
      mash: singleInfusion(67),
      fermentation: ferment(18),
      water: softWater(32, [
        { salt: 'calcium_chloride', grams: 3 },
        { salt: 'gypsum', grams: 2 },
        { salt: 'baking_soda', grams: 2 },
      ]),
      carbonation: { volumesCO2: 2.3, servingTempC: 7 },
      style: style('20B'),
      notes:
        'Coffee-dark with a citrus edge from the American hops. Baking soda keeps the roast smooth in our soft water.',
    },
    versions: [{ message: 'More whirlpool Cascade', change: (d) => void (d.hops[2].amountG = 45) }],
  },
  {
    key: 'maypole-koelsch',
    owner: 'agnieszka',
    document: {
      title: 'Maypole Kölsch-style Ale',
      batch: batch(22, 75),
      fermentables: [malt('pilsner-malt', 3.9), malt('wheat-malt', 0.3), malt('munich-malt', 0.2)],
      hops: [hop('hallertau-mittelfrueh', 36, 'boil', 60), hop('tettnang', 15, 'boil', 10)],
      yeasts: [{ ...yeast('clean-ale'), name: 'Clean ale yeast, cool-fermented' }],
      mash: singleInfusion(65),
      fermentation: {
        steps: [
          { tempC: 15, days: 10 },
          { tempC: 2, days: 21 },
        ],
      },
      water: {
        volumeL: 32,
        source: { calcium: 8, magnesium: 2, sodium: 4, chloride: 6, sulfate: 5, bicarbonate: 15 },
        salts: [
          { salt: 'calcium_chloride', grams: 2 },
          { salt: 'gypsum', grams: 1 },
        ],
      },
      carbonation: { volumesCO2: 2.6, servingTempC: 5 },
      style: style('5B'),
      notes: 'An ale brewed like a lager: cool and then a long cold rest. Crisp, faintly fruity.',
    },
  },
  {
    key: 'harvest-maerzen',
    owner: 'ottoline',
    document: {
      title: 'Harvest Supper Märzen',
      batch: batch(22, 74),
      fermentables: [
        malt('munich-malt', 2.8),
        malt('vienna-malt', 2.0),
        malt('pilsner-malt', 1.0),
        malt('crystal-40', 0.2),
      ],
      hops: [hop('hallertau-mittelfrueh', 35, 'boil', 60), hop('tettnang', 15, 'boil', 20)],
      yeasts: [yeast('lager')],
      mash: {
        steps: [
          { name: 'Beta rest', tempC: 63, timeMin: 40 },
          { name: 'Alpha rest', tempC: 70, timeMin: 30 },
          { name: 'Mash-out', tempC: 76, timeMin: 10 },
        ],
      },
      fermentation: {
        steps: [
          { tempC: 10, days: 14 },
          { tempC: 15, days: 3 },
          { tempC: 1, days: 42 },
        ],
      },
      carbonation: { volumesCO2: 2.5, servingTempC: 6 },
      style: style('6A'),
      notes: 'Toasty and clean. Brewed in spring, tapped when the leaves turn.',
    },
    versions: [{ message: 'Longer beta rest for a drier finish', change: (d) => void (d.mash.steps[0].timeMin = 50) }],
  },
  {
    key: 'cellar-dunkel',
    owner: 'ottoline',
    document: {
      title: 'Cellar Steps Dunkel',
      batch: batch(22, 74),
      fermentables: [
        malt('munich-malt', 4.4),
        malt('pilsner-malt', 0.5),
        malt('chocolate-malt', 0.12),
        malt('crystal-60', 0.2),
      ],
      hops: [hop('hallertau-mittelfrueh', 42, 'boil', 60)],
      yeasts: [yeast('lager')],
      mash: singleInfusion(67),
      fermentation: {
        steps: [
          { tempC: 10, days: 14 },
          { tempC: 2, days: 35 },
        ],
      },
      carbonation: { volumesCO2: 2.4, servingTempC: 7 },
      style: style('8A'),
      notes: 'Bread crust and a whisper of cocoa. Munich malt does nearly all the work.',
    },
  },
  {
    key: 'lamplighter-doppelbock',
    owner: 'agnieszka',
    document: {
      title: 'Lamplighter Doppelbock',
      batch: batch(19, 68),
      fermentables: [
        malt('munich-malt', 5.2),
        malt('pilsner-malt', 2.2),
        malt('crystal-60', 0.3),
        malt('chocolate-malt', 0.05),
      ],
      hops: [hop('hallertau-mittelfrueh', 45, 'boil', 60)],
      yeasts: [yeast('lager')],
      mash: singleInfusion(67),
      fermentation: {
        steps: [
          { tempC: 10, days: 21 },
          { tempC: 14, days: 3 },
          { tempC: 0, days: 60 },
        ],
      },
      carbonation: { volumesCO2: 2.3, servingTempC: 8 },
      style: style('9A'),
      notes: 'Rich, malty, warming. Pitch plenty of healthy lager yeast and give it months.',
    },
    versions: [
      {
        message: 'Less crystal, more Munich',
        change: (d) => void ((d.fermentables[2].amountKg = 0.15), (d.fermentables[0].amountKg = 5.4)),
      },
    ],
  },
  {
    key: 'dusk-dunkelweizen',
    owner: 'ilse',
    document: {
      title: 'Dusk Dunkelweizen',
      batch: batch(20),
      fermentables: [
        malt('wheat-malt', 2.6),
        malt('munich-malt', 1.6),
        malt('crystal-60', 0.2),
        malt('chocolate-malt', 0.08),
      ],
      hops: [hop('hallertau-mittelfrueh', 20, 'boil', 60)],
      yeasts: [yeast('wheat-beer')],
      mash: singleInfusion(66),
      fermentation: ferment(18, 10),
      carbonation: { volumesCO2: 3.3, servingTempC: 7 },
      style: style('10B'),
      notes: 'Banana bread and clove. Heavy bottles only at this carbonation.',
    },
  },
  {
    key: 'moonmill-wit',
    owner: 'ilse',
    document: {
      title: 'Moon Mill Wit',
      batch: batch(20),
      fermentables: [malt('pilsner-malt', 2.2), malt('flaked-oats', 0.5), malt('wheat-malt', 1.5)],
      hops: [hop('saaz', 25, 'boil', 60)],
      yeasts: [{ ...yeast('belgian-ale'), name: 'Belgian wit-style ale yeast' }],
      mash: singleInfusion(66),
      fermentation: ferment(20, 10),
      carbonation: { volumesCO2: 2.7, servingTempC: 5 },
      style: style('24A'),
      notes:
        'Add 12 g crushed coriander seed and 15 g sweet orange peel for the last 5 minutes of the boil (spices are not part of the numbers).',
    },
    versions: [{ message: 'More oats for a silkier haze', change: (d) => void (d.fermentables[1].amountKg = 0.7) }],
  },
  {
    key: 'cloister-tripel',
    owner: 'marisol',
    document: {
      title: 'Cloister Garden Tripel',
      batch: batch(19, 70),
      fermentables: [malt('pilsner-malt', 5.2), malt('table-sugar', 1.0), malt('munich-malt', 0.25)],
      hops: [hop('saaz', 60, 'boil', 60), hop('saaz', 30, 'boil', 15)],
      yeasts: [yeast('belgian-ale')],
      mash: singleInfusion(62),
      fermentation: {
        steps: [
          { tempC: 19, days: 3 },
          { tempC: 24, days: 11 },
        ],
      },
      carbonation: { volumesCO2: 3.0, servingTempC: 8 },
      style: style('26C'),
      notes: 'Pale, dry and deceptively strong. Start cool, let it climb.',
    },
    versions: [
      { message: 'Pitched cooler; fusel notes last time', change: (d) => void (d.fermentation.steps[0].tempC = 18) },
    ],
  },
  {
    key: 'nightjar-dark-strong',
    owner: 'marisol',
    document: {
      title: 'Nightjar Dark Strong',
      batch: batch(19, 70),
      fermentables: [
        malt('pilsner-malt', 5.0),
        malt('munich-malt', 1.2),
        malt('crystal-120', 0.3),
        malt('chocolate-malt', 0.1),
        malt('table-sugar', 1.1),
      ],
      hops: [hop('tettnang', 60, 'boil', 60)],
      yeasts: [yeast('belgian-ale')],
      mash: singleInfusion(66),
      fermentation: {
        steps: [
          { tempC: 19, days: 4 },
          { tempC: 24, days: 14 },
        ],
      },
      carbonation: { volumesCO2: 2.8, servingTempC: 12 },
      style: style('26D'),
      notes: 'Plum, fig and caramel. Better after six months.',
    },
  },
  {
    key: 'meadow-sour',
    owner: 'ilse',
    document: {
      title: 'Meadow Gate Tart Wheat',
      batch: batch(20),
      fermentables: [malt('wheat-malt', 1.1), malt('pilsner-malt', 1.6)],
      hops: [hop('hallertau-mittelfrueh', 15, 'boil', 15)],
      yeasts: [yeast('clean-ale'), yeast('wild-brett')],
      mash: singleInfusion(65),
      fermentation: {
        steps: [
          { tempC: 20, days: 14 },
          { tempC: 20, days: 60 },
        ],
      },
      carbonation: { volumesCO2: 3.0, servingTempC: 5 },
      style: style('23A'),
      notes:
        'Kettle-soured with lactic bacteria to about pH 3.4 before a short boil; the souring is not part of the numbers. Keep separate plastic for wild beers.',
    },
    versions: [
      {
        message: 'Shorter boil after souring',
        change: (d) => void ((d.batch.boilTimeMin = 30), (d.hops[0].timeMin = 15)),
      },
    ],
  },
  {
    key: 'winter-hearth',
    owner: 'rufus',
    document: {
      title: 'Winter Hearth Spiced Ale',
      batch: batch(19),
      fermentables: [
        malt('pale-ale-malt', 4.6),
        malt('crystal-60', 0.4),
        malt('munich-malt', 0.5),
        malt('chocolate-malt', 0.08),
      ],
      hops: [hop('east-kent-golding', 35, 'boil', 60)],
      yeasts: [yeast('english-ale')],
      mash: singleInfusion(68),
      fermentation: ferment(19),
      carbonation: { volumesCO2: 2.2, servingTempC: 12 },
      notes:
        'A specialty winter ale: one cinnamon stick, 3 g grated nutmeg and the zest of an orange for the last 5 minutes of the boil. No style; it is its own thing.',
    },
    versions: [
      {
        message: 'Halved the nutmeg in the notes; it dominated',
        change: (d) => void (d.notes = (d.notes ?? '').replace('3 g', '1.5 g')),
      },
    ],
  },
  {
    key: 'porch-brown',
    owner: 'hollis',
    document: {
      title: 'Back Porch Brown',
      batch: batch(19),
      fermentables: [
        malt('pale-ale-malt', 3.4),
        malt('crystal-60', 0.3),
        malt('chocolate-malt', 0.15),
        malt('munich-malt', 0.3),
      ],
      hops: [hop('fuggle', 35, 'boil', 60), hop('east-kent-golding', 15, 'boil', 10)],
      yeasts: [{ ...yeast('english-ale'), attenuationPct: 72 }],
      mash: singleInfusion(64),
      fermentation: ferment(19, 10),
      carbonation: { volumesCO2: 2.0, servingTempC: 11 },
      style: style('13B'),
      notes: 'Nutty, toffee, easy. The chocolate malt is for colour more than flavour.',
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
    versions: [
      { message: 'Half a kilo of rye for spice', change: (d) => void d.fermentables.push(malt('rye-malt', 0.5)) },
    ],
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
  {
    key: 'ridge-dipa-kveik',
    from: 'ridge-double-ipa',
    fromVersion: 2,
    owner: 'bastian',
    title: 'Ridgeline, kveik in the garage',
    versions: [
      {
        message: 'Kveik at 33 °C, done in four days',
        change: (d) => {
          d.yeasts = [yeast('kveik')];
          d.fermentation = ferment(33, 4);
        },
      },
    ],
  },
  {
    key: 'ridge-dipa-kveik-lite',
    from: 'ridge-dipa-kveik',
    fromVersion: 2,
    owner: 'juniper',
    title: 'Ridgeline Kveik, session strength',
    versions: [
      {
        message: 'Less malt and no sugar for an IPA I can have two of',
        change: (d) => {
          d.fermentables = [malt('pale-ale-malt', 5.2), malt('crystal-40', 0.25)];
          d.hops[0].amountG = 22;
          d.hops = d.hops.map((h) => (h.use === 'dry_hop' ? { ...h, amountG: Math.round(h.amountG * 0.6) } : h));
          d.style = style('21A');
        },
      },
      { message: 'My efficiency is lower', change: (d) => void (d.batch!.efficiencyPct = 66) },
    ],
  },
  {
    key: 'lantern-coffee',
    from: 'lantern-milk-free',
    fromVersion: 2,
    owner: 'dov',
    title: 'Lantern Stout with cold-brew coffee',
    versions: [
      {
        message: 'Noted the coffee addition at packaging',
        change: (d) => void (d.notes = `${d.notes ?? ''}\n\nAdd 300 mL of cold-brew coffee at packaging.`),
      },
    ],
  },
  {
    key: 'tripel-honey',
    from: 'cloister-tripel',
    fromVersion: 2,
    owner: 'rufus',
    title: 'Cloister Tripel with wildflower honey',
    versions: [
      {
        message: 'Half the sugar swapped for honey',
        change: (d) => {
          d.fermentables[1].amountKg = 0.5;
          d.fermentables.push({
            name: 'Wildflower honey',
            amountKg: 0.6,
            potentialPpg: 35,
            colorLovibond: 1,
            kind: 'sugar',
          });
        },
      },
    ],
  },
  {
    key: 'riverbank-dunkel',
    from: 'riverbank-weizen',
    fromVersion: 1,
    owner: 'wren',
    title: 'Riverbank Weizen, darker',
    versions: [
      {
        message: 'Munich and a pinch of chocolate malt: a dunkelweizen now',
        change: (d) => {
          d.fermentables.push(malt('munich-malt', 0.4), malt('chocolate-malt', 0.15));
          d.hops[0].amountG = 24;
          d.style = style('10B');
        },
      },
    ],
  },
];
