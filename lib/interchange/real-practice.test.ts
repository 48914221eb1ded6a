import { describe, expect, it } from 'vitest';
import { computeStats } from '@/lib/brewing';
import { parseBeerJson } from './beerjson/read';
import { parseBeerXml } from './beerxml/read';
import { example } from './test-helpers';
import { InterchangeError } from './types';

/**
 * Files from real brewing practice import whole: long souring rests, long dry hops, thin and
 * no-sparge mashes. A value the editor does not take is fitted and listed ("Assumed") or left out
 * and listed ("Left out"); only physical nonsense refuses the file.
 */

type Json = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any -- hand-edited BeerJSON fixtures

function beerJson(change: (recipe: Json) => void) {
  const file = JSON.parse(example('beerjson-spec-pale-ale.json'));
  change(file.beerjson.recipes[0]);
  return parseBeerJson(JSON.stringify(file)).recipes[0];
}

const XML_HEAD = `<?xml version="1.0"?>
<RECIPES><RECIPE><NAME>Farmhouse sour</NAME><VERSION>1</VERSION><TYPE>All Grain</TYPE><BREWER>Orla</BREWER>
<BATCH_SIZE>20</BATCH_SIZE><BOIL_SIZE>26</BOIL_SIZE><BOIL_TIME>60</BOIL_TIME><EFFICIENCY>72</EFFICIENCY>
<FERMENTABLES><FERMENTABLE><NAME>Pilsner malt</NAME><VERSION>1</VERSION><TYPE>Grain</TYPE><AMOUNT>2.5</AMOUNT><YIELD>80</YIELD><COLOR>2</COLOR></FERMENTABLE></FERMENTABLES>
<YEASTS><YEAST><NAME>Clean ale yeast</NAME><VERSION>1</VERSION><TYPE>Ale</TYPE><FORM>Dry</FORM><AMOUNT>0.011</AMOUNT><ATTENUATION>78</ATTENUATION></YEAST></YEASTS>`;

function beerXml(parts: { hops?: string; steps?: string; extra?: string }) {
  const text = `${XML_HEAD}
<HOPS>${parts.hops ?? ''}</HOPS>
<MASH><NAME>Mash</NAME><VERSION>1</VERSION><GRAIN_TEMP>20</GRAIN_TEMP><MASH_STEPS>${parts.steps ?? ''}</MASH_STEPS></MASH>
${parts.extra ?? ''}</RECIPE></RECIPES>`;
  return parseBeerXml(text).recipes[0];
}

const xmlStep = (name: string, tempC: number, timeMin: number, infuseL?: number) =>
  `<MASH_STEP><NAME>${name}</NAME><VERSION>1</VERSION><TYPE>Infusion</TYPE>${infuseL === undefined ? '' : `<INFUSE_AMOUNT>${infuseL}</INFUSE_AMOUNT>`}<STEP_TEMP>${tempC}</STEP_TEMP><STEP_TIME>${timeMin}</STEP_TIME></MASH_STEP>`;
const xmlHop = (use: string, timeMin: number, alpha = 5) =>
  `<HOP><NAME>Saaz</NAME><VERSION>1</VERSION><ALPHA>${alpha}</ALPHA><AMOUNT>0.05</AMOUNT><USE>${use}</USE><TIME>${timeMin}</TIME></HOP>`;

describe('real brewing practice imports whole', () => {
  // A sour mash held warm for two days (common practice: 24–72 h at 30–50 °C for lactic bacteria).
  it('a 48-hour souring rest, in BeerXML and BeerJSON', () => {
    const xml = beerXml({ steps: xmlStep('Sour mash', 45, 2880, 7.5) });
    expect(xml.document.mash.steps).toEqual([{ name: 'Sour mash', tempC: 45, timeMin: 2880 }]);
    const json = beerJson((r) => {
      r.mash.mash_steps.push({
        name: 'Lactic rest',
        type: 'souring mash',
        step_temperature: { unit: 'C', value: 40 },
        step_time: { unit: 'hr', value: 48 },
      });
    });
    expect(json.document.mash.steps[1]).toEqual({ name: 'Lactic rest', tempC: 40, timeMin: 2880 });
    // The souring rest is outside the saccharification band, so it does not move the main rest (60–72 °C).
    expect(computeStats(json.document).mash.mainRestTempC).toBeCloseTo((152 - 32) / 1.8, 6);
  });

  // Dry hopping runs from a day to about three weeks (common practice).
  it.each([1, 7, 21])('a %i-day dry hop', (days) => {
    const xml = beerXml({ hops: xmlHop('Dry Hop', days * 1440), steps: xmlStep('Rest', 66, 60, 7.5) });
    expect(xml.document.hops[0]).toMatchObject({ use: 'dry_hop', timeMin: days * 1440 });
    const json = beerJson((r) => {
      r.ingredients.hop_additions[1].timing.duration = { unit: 'day', value: days };
    });
    expect(json.document.hops[1]).toMatchObject({ use: 'dry_hop', timeMin: days * 1440 });
  });

  // A keg hop stays in while the keg is served (common practice).
  it('a keg hop left in for 60 days', () => {
    const json = beerJson((r) => {
      r.ingredients.hop_additions[1].timing = { use: 'add_to_package', duration: { unit: 'day', value: 60 } };
    });
    expect(json.document.hops[1]).toMatchObject({ use: 'dry_hop', timeMin: 60 * 1440 });
    expect(json.guessed.join('\n')).toMatch(/a hop added at packaging, counted as a dry hop/);
  });

  it('a thin mash of 12 L/kg and a full-volume (no-sparge) mash of 11.6 L/kg', () => {
    // 30 L of strike water on 2.5 kg: 12 L/kg.
    const thin = beerXml({ steps: xmlStep('Full volume', 66, 60, 30) });
    expect(thin.document.batch.mashWaterLPerKg).toBeCloseTo(12, 9);
    expect(thin.guessed.join('\n')).not.toMatch(/Mash thickness/);
    // No sparge: the whole pre-boil volume and what the grain keeps goes in at the start (Palmer, How to Brew).
    const noSparge = beerJson((r) => {
      r.mash.mash_steps[0].water_grain_ratio = { unit: 'qt/lb', value: 5.56 };
    });
    expect(noSparge.document.batch.mashWaterLPerKg).toBeCloseTo((5.56 * 0.946352946) / 0.45359237, 6);
  });

  it('lists a value past what the editor takes under Assumed and keeps the recipe', () => {
    // An extract of hop resins can carry 40–60% alpha acid (common practice); the editor takes up to 30%.
    const xml = beerXml({ hops: xmlHop('Boil', 60, 45), steps: xmlStep('Rest', 66, 60, 7.5) });
    expect(xml.document.hops[0].alphaPct).toBe(30);
    expect(xml.guessed.join('\n')).toMatch(
      /HOP 1 \(Saaz\) › ALPHA: 45 is outside what the editor takes \(Alpha acid must be at most 30%\); used 30/,
    );
  });

  it('leaves out a step the editor cannot hold, lists it under Left out and keeps it in the notes', () => {
    // A cold steep of dark grain at 10 °C for a day (common practice) is not a mash rest the editor takes.
    const xml = beerXml({ steps: xmlStep('Cold steep', 10, 1440, 7.5) + xmlStep('Rest', 66, 60) });
    expect(xml.document.mash.steps).toEqual([{ name: 'Rest', tempC: 66, timeMin: 60 }]);
    expect(xml.dropped.join('\n')).toMatch(
      /MASH_STEP 1 \(Cold steep\) › STEP_TEMP: 10 is outside what the editor takes \(Mash temperature must be at least 25 °C\); the mash step is left out/,
    );
    expect(xml.document.notes).toContain('Left out mash step: Cold steep, 10 °C, 1440 min');
    const json = beerJson((r) => {
      r.fermentation.fermentation_steps.push({
        name: 'Long cellar',
        start_temperature: { unit: 'C', value: 12 },
        step_time: { unit: 'day', value: 400 },
      });
    });
    expect(json.document.fermentation.steps).toHaveLength(1);
    expect(json.dropped.join('\n')).toMatch(
      /fermentation_steps\[1\] \(Long cellar\)\.step_time: 400 is outside what the editor takes \(Fermentation days must be at most 365\)/,
    );
  });

  it('reads types and uses outside the BeerXML 1.0 lists as the nearest one, listed under Assumed', () => {
    const xml = parseBeerXml(
      `${XML_HEAD.replace('<TYPE>Grain</TYPE>', '<TYPE>Fruit</TYPE>').replace('<TYPE>Ale</TYPE>', '<TYPE>Kveik</TYPE>')}
<HOPS>${xmlHop('Hop Stand', 20)}</HOPS></RECIPE></RECIPES>`,
    ).recipes[0];
    expect(xml.document.fermentables[0].kind).toBe('adjunct');
    expect(xml.document.yeasts[0].kind).toBe('kveik');
    expect(xml.document.hops[0].use).toBe('whirlpool');
    expect(xml.guessed.join('\n')).toMatch(/FERMENTABLE 1 \(Pilsner malt\) › TYPE: "Fruit" is not a BeerXML 1.0 type/);
    expect(xml.guessed.join('\n')).toMatch(
      /HOP 1 \(Saaz\) › USE: "Hop Stand" is not a BeerXML 1.0 use .*read as whirlpool/,
    );
  });

  it('reads a BeerJSON potential given in °P', () => {
    const json = beerJson((r) => {
      r.ingredients.fermentable_additions[1].yield = { potential: { unit: 'plato', value: 8.5 } };
    });
    // °P → SG: 1 + P / (258.6 − 227.1 P / 258.2) (the common inverse of the ASBC polynomial).
    expect(json.document.fermentables[1].potentialPpg).toBeCloseTo((8.5 / (258.6 - (8.5 / 258.2) * 227.1)) * 1000, 6);
  });

  it('reads an attenuation of 0 as not given, using the usual attenuation for the yeast kind', () => {
    expect(beerXml({}).document.yeasts[0].attenuationPct).toBe(78);
    const zero = parseBeerXml(
      `${XML_HEAD.replace('<ATTENUATION>78</ATTENUATION>', '<ATTENUATION>0</ATTENUATION>')}</RECIPE></RECIPES>`,
    ).recipes[0];
    expect(zero.document.yeasts[0].attenuationPct).toBe(75);
    expect(zero.guessed.join('\n')).toMatch(/Clean ale yeast: the file gives no attenuation; used 75%/);
  });

  it('brings a boil hop longer than the boil to the boil time, listed under Assumed', () => {
    const xml = beerXml({ hops: xmlHop('Boil', 90), steps: xmlStep('Rest', 66, 60, 7.5) });
    expect(xml.document.hops[0].timeMin).toBe(60);
    expect(xml.guessed.join('\n')).toMatch(/HOP 1 \(Saaz\) › TIME: .*longer than the boil.*used the boil time, 60 min/);
  });

  it('still refuses physical nonsense: a fermentation hotter than boiling water', () => {
    const refuse = () =>
      beerJson((r) => {
        r.fermentation.fermentation_steps[0].start_temperature = { unit: 'C', value: 150 };
      });
    expect(refuse).toThrow(InterchangeError);
    expect(refuse).toThrow(/fermentation_steps\[0\] \(Primary\)\.start_temperature: a fermentation at 150 °C/);
  });
});
