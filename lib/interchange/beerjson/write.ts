import type { FermentableKind, RecipeDocument, YeastKind } from '@/lib/brewing/schema';
import { ION_NAMES } from '@/lib/brewing/schema';
import { preBoilVolumeL } from '@/lib/brewing/brewday';
import { findStyle } from '@/lib/brewing/styles';
import { SALT_FILE_NAMES, mashedKg, recipeType, splitStyleCode, unnamedStep } from '../shared';
import { fileNumber, ppgToPotentialSg, type Measured } from '../units';

/**
 * Writing BeerJSON 1.0 (the BeerJSON project, "BeerJSON: a JSON schema for beer recipes", 1.0).
 * Only what the published schema allows is written: a procedure with no steps (an extract brew's
 * mash, a recipe with no fermentation plan) is left out rather than written with an empty list,
 * which the schema forbids (`minItems: 1`).
 */

type Json = Record<string, unknown>;

/** BeerJSON times are whole numbers of a unit: the coarsest unit that holds the value exactly, else seconds. */
function time(minutes: number): Measured {
  const value = fileNumber(minutes);
  if (Number.isInteger(value)) return { unit: 'min', value };
  return { unit: 'sec', value: Math.round(minutes * 60) };
}

function days(value: number): Measured {
  const d = fileNumber(value);
  if (Number.isInteger(d)) return { unit: 'day', value: d };
  if (Number.isInteger(fileNumber(d * 24))) return { unit: 'hr', value: fileNumber(d * 24) };
  return time(d * 1440);
}

const kg = (value: number): Measured => ({ unit: 'kg', value: fileNumber(value) });
const g = (value: number): Measured => ({ unit: 'g', value: fileNumber(value) });
const litres = (value: number): Measured => ({ unit: 'l', value: fileNumber(value) });
const celsius = (value: number): Measured => ({ unit: 'C', value: fileNumber(value) });
const percent = (value: number): Measured => ({ unit: '%', value: fileNumber(value) });
const litresPerKg = (value: number): Measured => ({ unit: 'l/kg', value: fileNumber(value) });

const FERMENTABLE_TYPES: Record<FermentableKind, string> = {
  grain: 'grain',
  adjunct: 'grain',
  extract: 'extract',
  sugar: 'sugar',
};
// BeerJSON 1.0 has no wheat-beer culture type: such yeasts go out as ale, with what they are best for.
const CULTURE_TYPES: Record<YeastKind, string> = {
  ale: 'ale',
  lager: 'lager',
  kveik: 'kveik',
  wheat: 'ale',
  wild: 'brett',
  other: 'other',
};
export const WHEAT_YEAST_BEST_FOR = 'Wheat beers';

/** One recipe as a BeerJSON 1.0 file, with its equipment and cultures beside it as the format keeps them. */
export function toBeerJson(doc: RecipeDocument, opts: { author?: string } = {}): Json {
  const boilSteps = buildBoilSteps(doc);
  const style = styleFor(doc);
  const recipe: Json = {
    name: doc.title,
    type: recipeType(doc),
    author: opts.author ?? '',
    batch_size: litres(doc.batch.volumeL),
    efficiency: { brewhouse: percent(doc.batch.efficiencyPct) },
    ...(style ? { style } : {}),
    ingredients: ingredients(doc, boilSteps),
    ...(doc.mash.steps.length ? { mash: mash(doc) } : {}),
    notes: doc.notes,
    boil: {
      name: 'Boil',
      pre_boil_size: litres(preBoilVolumeL(doc.batch)),
      boil_time: time(doc.batch.boilTimeMin),
      ...(boilSteps.length > 1 ? { boil_steps: boilSteps.map((s) => s.json) } : {}),
    },
    ...(doc.fermentation.steps.length
      ? {
          fermentation: {
            name: 'Fermentation',
            fermentation_steps: doc.fermentation.steps.map((s, i) => ({
              name: `Step ${i + 1}`,
              start_temperature: celsius(s.tempC),
              step_time: days(s.days),
            })),
          },
        }
      : {}),
    ...(doc.carbonation
      ? {
          carbonation: fileNumber(doc.carbonation.volumesCO2),
          packaging: {
            name: 'Packaging',
            packaging_vessels: [
              {
                name: 'Serving vessel',
                carbonation: fileNumber(doc.carbonation.volumesCO2),
                start_temperature: celsius(doc.carbonation.servingTempC),
              },
            ],
          },
        }
      : {}),
  };
  // One entry per culture addition, in the same order, so two cultures of one name stay apart.
  const cultures = doc.yeasts.map((y) => ({
    name: y.name,
    type: CULTURE_TYPES[y.kind],
    form: 'dry',
    ...(y.tempMinC !== undefined && y.tempMaxC !== undefined
      ? { temperature_range: { minimum: celsius(y.tempMinC), maximum: celsius(y.tempMaxC) } }
      : {}),
    ...(y.kind === 'wheat' ? { best_for: WHEAT_YEAST_BEST_FOR } : {}),
  }));
  return {
    beerjson: {
      version: 1,
      recipes: [recipe],
      cultures,
      equipments: [equipment(doc)],
    },
  };
}

function ingredients(doc: RecipeDocument, boilSteps: BoilStep[]): Json {
  return {
    fermentable_additions: doc.fermentables.map((f) => ({
      name: f.name,
      type: FERMENTABLE_TYPES[f.kind],
      ...(f.kind === 'adjunct' ? { grain_group: 'adjunct' } : {}),
      yield: { potential: { unit: 'sg', value: ppgToPotentialSg(f.potentialPpg) } },
      color: { unit: 'Lovi', value: fileNumber(f.colorLovibond) },
      amount: kg(f.amountKg),
    })),
    ...(doc.hops.length
      ? {
          hop_additions: doc.hops.map((h) => ({
            name: h.name,
            form: h.form,
            alpha_acid: percent(h.alphaPct),
            amount: g(h.amountG),
            timing: hopTiming(h, doc, boilSteps),
          })),
        }
      : {}),
    culture_additions: doc.yeasts.map((y) => ({
      name: y.name,
      type: CULTURE_TYPES[y.kind],
      form: 'dry',
      attenuation: percent(y.attenuationPct),
      amount: { unit: 'pkg', value: 1 },
    })),
    ...(doc.water
      ? {
          water_additions: [
            {
              name: 'Source water',
              ...Object.fromEntries(
                ION_NAMES.map((ion) => [ion, { unit: 'mg/l', value: fileNumber(doc.water!.source[ion]) }]),
              ),
              amount: litres(doc.water.volumeL),
            },
          ],
          ...(doc.water.salts.length
            ? {
                miscellaneous_additions: doc.water.salts.map((s) => ({
                  name: SALT_FILE_NAMES[s.salt],
                  type: 'water agent',
                  amount: g(s.grams),
                  timing: { use: 'add_to_mash' },
                })),
              }
            : {}),
        }
      : {}),
  };
}

function mash(doc: RecipeDocument): Json {
  const gristKg = mashedKg(doc.fermentables);
  return {
    name: 'Mash',
    grain_temperature: celsius(20),
    mash_steps: doc.mash.steps.map((s, i) => ({
      name: s.name ?? unnamedStep(i),
      type: i === 0 ? 'infusion' : 'temperature',
      ...(i === 0 && gristKg > 0 ? { water_grain_ratio: litresPerKg(doc.batch.mashWaterLPerKg) } : {}),
      step_temperature: celsius(s.tempC),
      step_time: time(s.timeMin),
    })),
  };
}

function equipment(doc: RecipeDocument): Json {
  return {
    name: doc.title,
    equipment_items: [
      {
        name: 'Kettle',
        form: 'Brew Kettle',
        maximum_volume: litres(doc.batch.volumeL * 2),
        boil_rate_per_hour: litres(doc.batch.boilOffLPerHour),
        loss: litres(doc.batch.trubLossL),
      },
      {
        name: 'Mash tun',
        form: 'Mash Tun',
        maximum_volume: litres(doc.batch.volumeL * 2),
        loss: litres(0),
        grain_absorption_rate: litresPerKg(doc.batch.grainAbsorptionLPerKg),
      },
    ],
  };
}

interface BoilStep {
  key: string;
  json: Json;
}

/** The boil as BeerJSON steps: first wort (if used), the boil, then one hop stand per temperature. */
function buildBoilSteps(doc: RecipeDocument): BoilStep[] {
  const steps: BoilStep[] = [];
  if (doc.hops.some((h) => h.use === 'first_wort'))
    steps.push({ key: 'first_wort', json: { name: 'First wort', step_time: time(0) } });
  steps.push({
    key: 'boil',
    json: {
      name: 'Boil',
      start_temperature: celsius(100),
      end_temperature: celsius(100),
      step_time: time(doc.batch.boilTimeMin),
    },
  });
  const stands = [...new Set(doc.hops.filter((h) => h.use === 'whirlpool').map((h) => h.tempC))];
  for (const tempC of stands) {
    const longest = Math.max(
      ...doc.hops.filter((h) => h.use === 'whirlpool' && h.tempC === tempC).map((h) => h.timeMin),
    );
    const temps = tempC === undefined ? {} : { start_temperature: celsius(tempC), end_temperature: celsius(tempC) };
    steps.push({
      key: `stand:${tempC ?? 'unstated'}`,
      json: {
        name: tempC === undefined ? 'Hop stand' : `Hop stand at ${fileNumber(tempC)} °C`,
        ...temps,
        step_time: time(longest),
      },
    });
  }
  return steps;
}

function hopTiming(h: RecipeDocument['hops'][number], doc: RecipeDocument, steps: BoilStep[]): Json {
  const stepNumber = (key: string) => steps.findIndex((s) => s.key === key) + 1;
  switch (h.use) {
    case 'mash':
      return { use: 'add_to_mash', duration: time(h.timeMin) };
    case 'dry_hop':
      return { use: 'add_to_fermentation', duration: time(h.timeMin) };
    case 'first_wort':
      return { use: 'add_to_boil', step: stepNumber('first_wort'), duration: time(h.timeMin) };
    case 'whirlpool':
      return { use: 'add_to_boil', step: stepNumber(`stand:${h.tempC ?? 'unstated'}`), duration: time(h.timeMin) };
    case 'boil':
      return {
        use: 'add_to_boil',
        ...(steps.length > 1 ? { step: stepNumber('boil') } : {}),
        time: time(Math.max(doc.batch.boilTimeMin - h.timeMin, 0)),
        duration: time(h.timeMin),
      };
  }
}

function styleFor(doc: RecipeDocument): Json | undefined {
  const guideline = doc.style ? findStyle(doc.style.code) : undefined;
  if (!guideline) return undefined;
  const { number, letter } = splitStyleCode(guideline.code);
  return {
    name: guideline.name,
    category: guideline.category,
    ...(/^\d+$/.test(number) ? { category_number: Number(number) } : {}),
    ...(letter ? { style_letter: letter } : {}),
    style_guide: 'BJCP 2021',
    type: 'beer',
  };
}
