import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema } from '@/lib/brewing';
import { demoForks, demoRecipes } from '@/db/seed/recipes';
import { parseBeerXml } from './beerxml/read';
import { toBeerXml } from './beerxml/write';
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

describe('BeerXML round trip', () => {
  it('exports and imports the example pale ale to the same document and numbers', () => {
    const doc = examplePaleAle();
    const [back] = parseBeerXml(toBeerXml(doc)).recipes;
    expect(back.document).toEqual(doc);
    expect(computeStats(back.document)).toEqual(computeStats(doc));
  });

  it('round-trips every demo recipe with the same numbers (within rounding)', () => {
    for (const demo of demoRecipes) {
      const doc = recipeDocumentSchema.parse(demo.document);
      const [back] = parseBeerXml(toBeerXml(doc)).recipes;
      expect(back.document, demo.key).toEqual(doc);
      const a = computeStats(doc);
      const b = computeStats(back.document);
      expect(b.og).toBeCloseTo(a.og, 4);
      expect(b.ibu).toBeCloseTo(a.ibu, 2);
      expect(b.srm).toBeCloseTo(a.srm, 2);
    }
    expect(demoForks.length).toBeGreaterThan(0);
  });

  it('keeps kveik and wild yeasts, extract colour and hop-stand temperatures across the trip', () => {
    const doc = examplePaleAle();
    doc.yeasts = [
      { name: 'Kveik (Norwegian farmhouse) yeast', kind: 'kveik', attenuationPct: 80, tempMinC: 29, tempMaxC: 35 },
    ];
    doc.fermentables.push({
      name: 'Liquid malt extract, light',
      amountKg: 0.5,
      potentialPpg: 36,
      colorLovibond: 4,
      kind: 'extract',
    });
    doc.hops[2].tempC = 72;
    const [back] = parseBeerXml(toBeerXml(doc)).recipes;
    expect(back.document).toEqual(doc);
  });

  it('writes a fourth fermentation step into the notes (BeerXML 1.0 has three stages)', () => {
    const doc = examplePaleAle();
    doc.fermentation.steps = [
      { tempC: 10, days: 10 },
      { tempC: 14, days: 3 },
      { tempC: 2, days: 20 },
      { tempC: 0, days: 14 },
    ];
    const [back] = parseBeerXml(toBeerXml(doc)).recipes;
    expect(back.document.fermentation.steps).toHaveLength(3);
    expect(back.document.notes).toContain('Step 4: 14 days at 0 °C');
  });
});

// BeerXML 1.0 specification, 2004: the example dry stout, written by hand (examples/beerxml-spec-dry-stout.xml).
describe('BeerXML 1.0 specification, 2004 — example recipe', () => {
  const [recipe] = parseBeerXml(example('beerxml-spec-dry-stout.xml')).recipes;
  const doc = recipe.document;

  it('maps the batch, converting kg to g for hops and yield % to points per pound per gallon', () => {
    expect(doc.title).toBe('Dry Stout');
    expect(doc.batch.volumeL).toBe(18.93);
    expect(doc.batch.efficiencyPct).toBe(72);
    expect(doc.hops[0]).toMatchObject({
      name: 'Goldings, East Kent',
      amountG: 63.8,
      alphaPct: 4.5,
      use: 'boil',
      timeMin: 60,
    });
    // Yield is % of sucrose's extract, 46.214 ppg (common practice): 78% → 36.047 ppg.
    expect(doc.fermentables[0]).toMatchObject({
      name: 'Pale Malt (2 row) UK',
      amountKg: 2.27,
      colorLovibond: 3,
      kind: 'grain',
    });
    expect(doc.fermentables[0].potentialPpg).toBeCloseTo(0.78 * 46.214, 6);
    expect(doc.fermentables[1].kind).toBe('adjunct');
    expect(doc.fermentables[2].colorLovibond).toBe(500);
    // 10 L of strike water on 3.63 kg of grist.
    expect(doc.batch.mashWaterLPerKg).toBeCloseTo(10 / 3.63, 3);
    expect(doc.mash.steps).toEqual([{ name: 'Conversion Step, 68C', tempC: 68, timeMin: 60 }]);
    expect(doc.fermentation.steps).toEqual([{ tempC: 18, days: 7 }]);
    expect(doc.carbonation).toEqual({ volumesCO2: 2.1, servingTempC: 4 });
  });

  it('keeps what we do not model in the notes and says what it dropped and guessed', () => {
    expect(doc.notes).toContain('Tasting notes: A dry stout');
    expect(doc.notes).toContain('Irish Moss (Fining): 10 g, Boil 15 min');
    expect(doc.notes).toContain('Measured in the file: OG 1.036, FG 1.012');
    // 16A is Sweet Stout in the 2021 guidelines: a 2004-era "Dry Stout" must not be filed under it.
    expect(doc.style).toBeUndefined();
    expect(recipe.dropped.join('\n')).toMatch(/Style 16A Dry Stout \(BJCP\)/);
    expect(recipe.dropped.join('\n')).toMatch(/FERMENTABLE 1 \(Pale Malt \(2 row\) UK\): ORIGIN/);
    expect(recipe.guessed.join('\n')).toMatch(/Irish Ale: the file gives no attenuation; used 75%/);
    expect(recipe.guessed.join('\n')).toMatch(/Boil-off rate: worked out/);
  });

  it('recomputes the numbers from the mapped grist', () => {
    const stats = computeStats(doc);
    // Palmer, How to Brew (extract): points = Σ kg × ppg × 8.3454 × efficiency / L.
    const ppg = (yieldPct: number) => (yieldPct * 46.214) / 100;
    const points = ((2.27 * ppg(78) + 0.91 * ppg(70) + 0.45 * ppg(78)) * 8.3454 * 0.72) / 18.93;
    expect(stats.og).toBeCloseTo(1 + points / 1000, 4);
    // Tinseth (Palmer, How to Brew, ch. 5): 63.8 g at 4.5% for 60 min.
    const utilisation = 1.65 * Math.pow(0.000125, stats.og - 1) * ((1 - Math.exp(-0.04 * 60)) / 4.15);
    expect(stats.ibu).toBeCloseTo((utilisation * 0.045 * 63.8 * 1000) / 18.93, 2);
  });
});

describe('BeerXML files we refuse', () => {
  const hop = (amount: string) => `<?xml version="1.0"?>
<RECIPES><RECIPE><NAME>Bad hop</NAME><VERSION>1</VERSION><TYPE>All Grain</TYPE><BATCH_SIZE>20</BATCH_SIZE><BOIL_TIME>60</BOIL_TIME><EFFICIENCY>70</EFFICIENCY>
<HOPS><HOP><NAME>Cascade</NAME><VERSION>1</VERSION><ALPHA>5</ALPHA><AMOUNT>${amount}</AMOUNT><USE>Boil</USE><TIME>60</TIME></HOP></HOPS>
<FERMENTABLES><FERMENTABLE><NAME>Pale</NAME><VERSION>1</VERSION><TYPE>Grain</TYPE><AMOUNT>4</AMOUNT><YIELD>80</YIELD><COLOR>3</COLOR></FERMENTABLE></FERMENTABLES>
<YEASTS><YEAST><NAME>Ale</NAME><VERSION>1</VERSION><TYPE>Ale</TYPE><FORM>Dry</FORM><AMOUNT>0.011</AMOUNT></YEAST></YEASTS>
</RECIPE></RECIPES>`;

  it('imports the well-formed base file', () => {
    expect(parseBeerXml(hop('0.03')).recipes[0].document.hops[0].amountG).toBe(30);
  });

  it('refuses external entities (XXE) before parsing', () => {
    const xxe = `<?xml version="1.0"?>\n<!DOCTYPE RECIPES [<!ENTITY secret SYSTEM "file:///etc/passwd">]>\n${hop('0.03').split('\n').slice(1).join('\n').replace('Bad hop', '&secret;')}`;
    const err = refusal(() => parseBeerXml(xxe));
    expect(err.kind).toBe('unsafe');
    expect(err.message).toMatch(/DOCTYPE/);
  });

  it('refuses entity expansion (billion laughs) before parsing', () => {
    const lol = [
      '<!ENTITY lol "lol">',
      ...Array.from({ length: 9 }, (_, i) => `<!ENTITY lol${i + 1} "${`&lol${i || ''};`.repeat(10)}">`),
    ].join('');
    const err = refusal(() =>
      parseBeerXml(
        `<?xml version="1.0"?><!DOCTYPE lolz [${lol}]><RECIPES><RECIPE><NAME>&lol9;</NAME></RECIPE></RECIPES>`,
      ),
    );
    expect(err.kind).toBe('unsafe');
  });

  it('refuses an entity declaration even without a DOCTYPE line', () => {
    expect(refusal(() => parseBeerXml('<RECIPES><!ENTITY x "y"></RECIPES>')).message).toMatch(/ENTITY/);
  });

  it('refuses malformed XML naming the line', () => {
    const err = refusal(() => parseBeerXml('<RECIPES>\n<RECIPE><NAME>Half</RECIPE>\n</RECIPES>'));
    expect(err.kind).toBe('malformed');
    expect(err.message).toMatch(/line 2/);
  });

  it('refuses a negative amount naming the element', () => {
    const err = refusal(() => parseBeerXml(hop('-0.03')));
    expect(err.message).toBe('RECIPE 1 (Bad hop) › HOPS › HOP 1 (Cascade) › AMOUNT: must not be negative (got -0.03)');
  });

  it('refuses text where a number belongs', () => {
    expect(refusal(() => parseBeerXml(hop('lots'))).message).toMatch(
      /HOP 1 \(Cascade\) › AMOUNT: "lots" is not a number/,
    );
  });

  it('refuses an alpha acid over 100%, which no hop has', () => {
    const err = refusal(() => parseBeerXml(hop('0.03').replace('<ALPHA>5</ALPHA>', '<ALPHA>145</ALPHA>')));
    expect(err.message).toMatch(/HOP 1 \(Cascade\) › ALPHA: an alpha acid of 145% is more than the whole/);
  });

  it('refuses a mash above boiling, naming the element', () => {
    const file = hop('0.03').replace(
      '</FERMENTABLES>',
      '</FERMENTABLES><MASH><NAME>M</NAME><VERSION>1</VERSION><GRAIN_TEMP>20</GRAIN_TEMP><MASH_STEPS><MASH_STEP><NAME>Rest</NAME><VERSION>1</VERSION><TYPE>Infusion</TYPE><STEP_TEMP>152</STEP_TEMP><STEP_TIME>60</STEP_TIME></MASH_STEP></MASH_STEPS></MASH>',
    );
    expect(refusal(() => parseBeerXml(file)).message).toMatch(
      /MASH_STEP 1 \(Rest\) › STEP_TEMP: a mash at 152 °C is outside liquid water/,
    );
  });

  it('refuses a file over 2 MB', () => {
    const big = `<RECIPES>${' '.repeat(2 * 1024 * 1024 + 10)}</RECIPES>`;
    expect(refusal(() => parseBeerXml(big)).kind).toBe('too_large');
  });

  it('offers every recipe of a file with several', () => {
    const two = hop('0.03')
      .replace('</RECIPE></RECIPES>', `</RECIPE>${hop('0.02').split('<RECIPES>')[1]}`)
      .replace('</RECIPES></RECIPES>', '</RECIPES>');
    expect(parseBeerXml(two).recipes.map((r) => r.document.hops[0].amountG)).toEqual([30, 20]);
  });
});
