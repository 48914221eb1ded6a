import { Jimp } from 'jimp';
import type { Viewer } from '@/lib/auth/session';
import { addReading, addTasting, createBrewDay } from '@/lib/brew-days/brew-days';
import { uploadPhoto } from '@/lib/brew-days/photos';
import { createBrewDaySchema, readingSchema, tastingSchema } from '@/lib/brew-days/schemas';
import { srmToHex } from '@/lib/brewing';
import { getRecipe, getVersionByNumber } from '@/lib/recipes/versions';
import type { SeedContext } from './context';
import { dayAfter } from './timeline';

// The demo club's brew days: a few per popular recipe, with readings, tastings and a photo or two
// drawn here (a glass of beer in the recipe's colour), never downloaded.

interface DemoBrew {
  recipe: string;
  version?: number;
  brewer: string;
  /** Days after the brewed version was saved. */
  daysAfterVersion: number;
  /** Measured OG and FG as differences from the prediction, in gravity points. */
  ogOffset: number;
  fgOffset: number;
  fermentC: number;
  packaging: 'keg' | 'bottles';
  notes: string;
  tasters: { handle: string; rating: number; overall: string; aroma: string }[];
  photos: number;
}

const demoBrews: DemoBrew[] = [
  {
    recipe: 'millrace-pale',
    brewer: 'wren',
    daysAfterVersion: 12,
    ogOffset: -3,
    fgOffset: 1,
    fermentC: 19,
    packaging: 'keg',
    notes: 'First brew on the new false bottom. Sparge ran slow; **stirred once** and it cleared up.',
    tasters: [
      {
        handle: 'kofi',
        rating: 4,
        overall: 'Clean and bright; could take more late hops.',
        aroma: 'Orange peel, bread crust',
      },
    ],
    photos: 2,
  },
  {
    recipe: 'millrace-pale',
    brewer: 'dov',
    daysAfterVersion: 75,
    ogOffset: 2,
    fgOffset: 0,
    fermentC: 18,
    packaging: 'bottles',
    notes: 'Brewed with softened tap water and a little gypsum. Hit the numbers.',
    tasters: [{ handle: 'wren', rating: 5, overall: 'Better than mine.', aroma: 'Grapefruit, light caramel' }],
    photos: 1,
  },
  {
    recipe: 'orchard-ipa',
    brewer: 'kofi',
    daysAfterVersion: 20,
    ogOffset: -5,
    fgOffset: 2,
    fermentC: 20,
    packaging: 'keg',
    notes: 'Whirlpool at 80 °C for 20 minutes. Dry hop on day 4.',
    tasters: [{ handle: 'bastian', rating: 4, overall: 'Juicy, a touch sweet.', aroma: 'Pine and peach' }],
    photos: 2,
  },
  {
    recipe: 'orchard-ipa',
    brewer: 'ilse',
    daysAfterVersion: 120,
    ogOffset: 1,
    fgOffset: -1,
    fermentC: 19,
    packaging: 'bottles',
    notes: 'Lost about a litre to hop trub.',
    tasters: [],
    photos: 1,
  },
  {
    recipe: 'lantern-stout',
    brewer: 'tamsin',
    daysAfterVersion: 45,
    ogOffset: -2,
    fgOffset: 2,
    fermentC: 18,
    packaging: 'keg',
    notes: 'Oats stuck together in the mash; stir them in slowly next time.',
    tasters: [
      { handle: 'juniper', rating: 5, overall: 'Silky, roasty, dangerous.', aroma: 'Coffee, dark chocolate' },
      { handle: 'hollis', rating: 4, overall: 'Lovely on nitro.', aroma: 'Roast' },
    ],
    photos: 2,
  },
  {
    recipe: 'garage-kveik',
    brewer: 'bastian',
    daysAfterVersion: 100,
    ogOffset: 0,
    fgOffset: -1,
    fermentC: 34,
    packaging: 'keg',
    notes: 'Pitched at 35 °C in the garage. Done in three days.',
    tasters: [{ handle: 'dov', rating: 4, overall: 'Fast and clean.', aroma: 'Orange, tropical' }],
    photos: 1,
  },
  {
    recipe: 'weir-pils',
    brewer: 'agnieszka',
    daysAfterVersion: 150,
    ogOffset: -1,
    fgOffset: 1,
    fermentC: 10,
    packaging: 'keg',
    notes: 'Lagered six weeks in the cold cellar.',
    tasters: [{ handle: 'ottoline', rating: 5, overall: 'Crisp. Proper.', aroma: 'Floral, spicy hops' }],
    photos: 1,
  },
];

/** A simple picture: a glass of beer in the recipe's colour with a foam head, on a plank. */
async function drawGlass(hex: string, seed: number): Promise<Buffer> {
  const width = 960;
  const height = 720;
  const image = new Jimp({ width, height, color: 0xf3ece0ff });
  const beer = Number.parseInt(hex.slice(1), 16);
  const [br, bg, bb] = [(beer >> 16) & 255, (beer >> 8) & 255, beer & 255];
  const data = image.bitmap.data;
  const set = (x: number, y: number, r: number, g: number, b: number) => {
    const i = (y * width + x) * 4;
    data[i] = r;
    data[i + 1] = g;
    data[i + 2] = b;
    data[i + 3] = 255;
  };
  const centre = width / 2 + ((seed * 37) % 120) - 60;
  for (let y = 0; y < height; y += 1) {
    for (let x = 0; x < width; x += 1) {
      if (y > 560) {
        const grain = 20 * Math.sin(x / 23 + y / 7 + seed);
        set(x, y, 150 + grain, 104 + grain, 62 + grain / 2);
        continue;
      }
      // The glass narrows toward its foot: a pint shape from y 120 to 560.
      const t = (y - 120) / 440;
      const half = 150 - 40 * t;
      const dx = Math.abs(x - centre);
      if (y < 120 || dx > half + 6) continue;
      if (dx > half) {
        set(x, y, 210, 214, 220);
        continue;
      }
      if (y < 190) {
        const bubble = (x * 13 + y * 7 + seed) % 17 === 0 ? -18 : 0;
        set(x, y, 250 + bubble / 2, 246 + bubble, 232 + bubble);
        continue;
      }
      const light = 1 + 0.25 * Math.cos((dx / half) * Math.PI * 0.5) - 0.1;
      set(x, y, Math.min(255, br * light), Math.min(255, bg * light), Math.min(255, bb * light));
    }
  }
  return image.getBuffer('image/jpeg', { quality: 90 });
}

function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

export async function seedBrewDays(ctx: SeedContext): Promise<void> {
  const member = (handle: string): Viewer => {
    const viewer = ctx.people.get(handle);
    if (!viewer) throw new Error(`no demo member ${handle}`);
    return viewer;
  };
  let count = 0;
  for (const [index, brew] of demoBrews.entries()) {
    const recipeId = ctx.recipes.get(brew.recipe);
    if (!recipeId) continue;
    const brewer = member(brew.brewer);
    const recipe = await getRecipe(brewer, { id: recipeId });
    const { version } = await getVersionByNumber(brewer, recipe.id, brew.version ?? recipe.headNumber);
    const savedAt = ctx.versionDates.get(brew.recipe)?.[version.number - 1];
    if (!savedAt) throw new Error(`no date planned for ${brew.recipe} version ${version.number}`);
    const brewedOn = dayAfter(savedAt, brew.daysAfterVersion);
    const og = Math.round((version.stats.og + brew.ogOffset / 1000) * 1000) / 1000;
    const fg = Math.round((version.stats.fg + brew.fgOffset / 1000) * 1000) / 1000;
    const packagedOn = addDays(brewedOn, 16);
    const { id } = await createBrewDay(
      brewer,
      createBrewDaySchema.parse({
        versionId: version.id,
        brewedOn,
        strikeTempC: 73 + (index % 3),
        mashTempC: 66 + (index % 2) * 0.5,
        mashPh: 5.3 + (index % 3) * 0.05,
        preBoilVolumeL: version.document.batch.volumeL * 1.3,
        postBoilVolumeL: version.document.batch.volumeL * 1.1,
        fermenterVolumeL: version.document.batch.volumeL - (index % 2),
        og: { method: 'hydrometer', value: og },
        pitchTempC: brew.fermentC,
        fg: { method: 'hydrometer', value: fg },
        packagedOn,
        packaging: brew.packaging,
        kegPressureKPa: brew.packaging === 'keg' ? 85 + index * 3 : null,
        primingSugarG: brew.packaging === 'bottles' ? 110 : null,
        notes: brew.notes,
      }),
    );
    // Gravity falls roughly exponentially toward FG over the first week or so (an invented curve).
    for (const day of [1, 2, 3, 5, 8, 12]) {
      const gravity = fg + (og - fg) * Math.exp(-day / 2.2);
      await addReading(
        brewer,
        id,
        readingSchema.parse({
          takenOn: addDays(brewedOn, day),
          method: 'hydrometer',
          value: Math.round(gravity * 1000) / 1000,
          beerTempC: brew.fermentC + (day < 4 ? 1 : 0),
          note: day === 1 ? 'Krausen up' : '',
        }),
      );
    }
    for (const t of brew.tasters) {
      await addTasting(
        member(t.handle),
        id,
        tastingSchema.parse({
          tastedOn: addDays(packagedOn, 10),
          appearance: 'Clear, good head',
          aroma: t.aroma,
          flavour: '',
          mouthfeel: 'Medium body',
          overall: t.overall,
          rating: t.rating,
        }),
      );
    }
    for (let p = 0; p < brew.photos; p += 1) {
      await uploadPhoto(
        brewer,
        id,
        await drawGlass(srmToHex(version.stats.srm), index * 10 + p),
        p === 0 ? 'Poured on tasting day' : 'A second glass, later',
      );
    }
    count += 1;
  }
  console.log(`seed: ${count} brew days`);
}
