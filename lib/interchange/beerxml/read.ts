import type {
  FermentableKind,
  HopForm,
  HopUse,
  RecipeDocumentInput,
  WaterProfile,
  YeastKind,
} from '@/lib/brewing/schema';
import { ION_NAMES } from '@/lib/brewing/schema';
import {
  DEFAULT_ATTENUATION_PCT,
  DEFAULT_BOIL_TIME_MIN,
  DEFAULT_EFFICIENCY_PCT,
  DEFAULT_SERVING_TEMP_C,
  defaultYeast,
  describeFromOrigins,
  dropCredits,
  finishRecipe,
  mashedKg,
  matchStyle,
  mixWaters,
  newDraft,
  takeSalt,
  unnamedStep,
  type Draft,
  type Origins as SharedOrigins,
  type SaltAddition,
} from '../shared';
import { InterchangeError, type ImportResult, type ImportedRecipe } from '../types';
import { plain, round, srmToLovibondClamped, tidy, yieldPctToPpg } from '../units';
import { XmlRecord, parseXmlSafely } from '../xml-reader';
import { UNSPECIFIED_STYLE, YEAST_BEST_FOR } from './write';

/**
 * Reading BeerXML 1.0 (Smith, Avis, Taylor, Perron and Johnson, "BeerXML: An XML Standard for Beer
 * Brewing Data", version 1.0, 2004). Units are fixed: kg, L, °C, minutes (days for
 * fermentation ages), colour in °L (SRM for liquid extract), yield in % of sucrose.
 */

const FORMAT_NAME = 'BeerXML';

export function parseBeerXml(text: string): ImportResult {
  const root = parseXmlSafely(text);
  const recipes = recipeRecords(root);
  if (recipes.length === 0) throw new InterchangeError('the file holds no RECIPE record', 'RECIPES');
  return { recipes: recipes.map(readRecipe) };
}

function recipeRecords(root: Record<string, unknown>): XmlRecord[] {
  if (root.RECIPES !== undefined) {
    const holder = new XmlRecord({ RECIPES: root.RECIPES }, '');
    return holder.list('RECIPES', 'RECIPE').map((r, i) => relabel(r, i));
  }
  if (Array.isArray(root.RECIPE)) {
    return root.RECIPE.map((node, i) => relabel(new XmlRecord(node as Record<string, unknown>, ''), i));
  }
  return [];
}

function relabel(record: XmlRecord, index: number): XmlRecord {
  const name = record.node.NAME;
  return new XmlRecord(
    record.node,
    `RECIPE ${index + 1}${typeof name === 'string' && name ? ` (${name.slice(0, 60)})` : ''}`,
  );
}

/** Where each part of our document came from, so a refusal can name the file's element. */
type Origins = SharedOrigins<XmlRecord>;

const FIELD_TAGS: Record<string, string> = {
  title: 'NAME',
  notes: 'NOTES',
  'batch.volumeL': 'BATCH_SIZE',
  'batch.boilTimeMin': 'BOIL_TIME',
  'batch.efficiencyPct': 'EFFICIENCY',
  'batch.boilOffLPerHour': 'EQUIPMENT › EVAP_RATE',
  'batch.trubLossL': 'EQUIPMENT › TRUB_CHILLER_LOSS',
  'batch.mashWaterLPerKg': 'MASH › MASH_STEPS › MASH_STEP 1 › INFUSE_AMOUNT',
  'carbonation.volumesCO2': 'CARBONATION',
  'carbonation.servingTempC': 'CARBONATION_TEMP',
  'water.volumeL': 'WATERS › WATER › AMOUNT',
  'water.salts': 'MISCS',
  fermentables: 'FERMENTABLES',
  hops: 'HOPS',
  yeasts: 'YEASTS',
  amountKg: 'AMOUNT',
  potentialPpg: 'YIELD',
  colorLovibond: 'COLOR',
  kind: 'TYPE',
  name: 'NAME',
  amountG: 'AMOUNT',
  alphaPct: 'ALPHA',
  use: 'USE',
  form: 'FORM',
  timeMin: 'STEP_TIME',
  tempC: 'STEP_TEMP',
  attenuationPct: 'ATTENUATION',
  tempMinC: 'MIN_TEMPERATURE',
  tempMaxC: 'MAX_TEMPERATURE',
  days: 'AGE',
  grams: 'AMOUNT',
};

function describer(recipe: XmlRecord, origins: Origins) {
  return (path: string): string => {
    const described = describeFromOrigins(
      origins,
      path,
      (section, field) => {
        if (section === 'hops' && field === 'timeMin') return 'TIME';
        if (section === 'hops' && field === 'tempC') return 'NOTES (hop stand temperature)';
        return FIELD_TAGS[field] ?? field;
      },
      (originPath, tag) => `${originPath} › ${tag}`,
    );
    if (described) return described;
    const tag = FIELD_TAGS[path] ?? path;
    return tag ? recipe.at(tag) : recipe.path;
  };
}

function readRecipe(recipe: XmlRecord): ImportedRecipe {
  const draft = newDraft();
  const origins: Origins = new Map();
  const title = recipe.text('NAME', { required: true })!.slice(0, 120);
  const volumeL = recipe.num('BATCH_SIZE', { required: true, min: 0 })!;
  const boilSizeL = recipe.num('BOIL_SIZE', { min: 0 });
  let boilTimeMin = recipe.num('BOIL_TIME', { min: 0 });
  if (boilTimeMin === undefined) {
    boilTimeMin = DEFAULT_BOIL_TIME_MIN;
    draft.guessed.push(`Boil time: the file gives none; used ${DEFAULT_BOIL_TIME_MIN} min`);
  }
  const type = recipe.text('TYPE');
  let efficiencyPct = recipe.num('EFFICIENCY', { min: 0 });
  if (efficiencyPct === undefined || efficiencyPct < 10) {
    draft.guessed.push(
      `Brewhouse efficiency: the file gives ${efficiencyPct === undefined ? 'none' : `${efficiencyPct}%`}; used ${DEFAULT_EFFICIENCY_PCT}%`,
    );
    efficiencyPct = DEFAULT_EFFICIENCY_PCT;
  }
  if (type) draft.dropped.push(`${recipe.at('TYPE')}: ${type} (the ingredients say how it is brewed)`);

  const fermentables = readFermentables(recipe, draft, origins);
  const equipment = readEquipment(recipe, draft, { volumeL, boilSizeL, boilTimeMin });
  const mash = readMash(recipe, draft, origins, mashedKg(fermentables));
  const miscs = readMiscs(recipe, draft, origins);
  const water = readWater(recipe, draft, miscs.salts, boilSizeL ?? volumeL);
  const style = readStyle(recipe, draft);
  const carbonation = readCarbonation(recipe, draft);
  readKeptExtras(recipe, draft);

  const document: RecipeDocumentInput = {
    title,
    batch: {
      volumeL,
      boilTimeMin,
      efficiencyPct,
      boilOffLPerHour: equipment.boilOffLPerHour,
      trubLossL: equipment.trubLossL,
      grainAbsorptionLPerKg: 1,
      mashWaterLPerKg: mash.mashWaterLPerKg,
    },
    fermentables,
    hops: readHops(recipe, draft, origins),
    yeasts: readYeasts(recipe, draft, origins),
    mash: { steps: mash.steps },
    fermentation: { steps: readFermentation(recipe, draft) },
    water,
    carbonation,
    style,
    notes: '',
  };
  draft.guessed.push('Grain absorption: BeerXML 1.0 has no field for it; used 1 L/kg');
  const notes = [recipe.text('NOTES'), recipe.text('TASTE_NOTES') && `Tasting notes: ${recipe.text('TASTE_NOTES')}`]
    .filter(Boolean)
    .join('\n\n');
  listUnread(recipe, draft);
  return finishRecipe(document, draft, describer(recipe, origins), { text: notes, formatName: FORMAT_NAME });
}

function listUnread(record: XmlRecord, draft: Draft): void {
  const tags = record.unread();
  if (tags.length) draft.dropped.push(`${record.path}: ${tags.join(', ')}`);
}

const FERMENTABLE_TYPES: Record<string, FermentableKind> = {
  grain: 'grain',
  sugar: 'sugar',
  extract: 'extract',
  'dry extract': 'extract',
  adjunct: 'adjunct',
};

function readFermentables(recipe: XmlRecord, draft: Draft, origins: Origins) {
  return recipe.list('FERMENTABLES', 'FERMENTABLE').map((f, index) => {
    origins.set(`fermentables.${index}`, f);
    const name = f.text('NAME', { required: true })!;
    const typeText = f.text('TYPE', { required: true })!;
    let kind = FERMENTABLE_TYPES[typeText.trim().toLowerCase()];
    if (!kind) {
      kind = 'adjunct';
      draft.guessed.push(
        `${f.at('TYPE')}: "${typeText}" is not a BeerXML 1.0 type (Grain, Sugar, Extract, Dry Extract, Adjunct); counted as an adjunct`,
      );
    }
    const amountKg = f.num('AMOUNT', { required: true, min: 0 })!;
    const yieldPct = f.num('YIELD', { required: true, min: 0 })!;
    const colour = f.num('COLOR', { required: true, min: 0 })!;
    // The specification gives liquid extract colour in SRM and everything else in °L.
    const isLiquidExtract = typeText.trim().toLowerCase() === 'extract';
    const colorLovibond = isLiquidExtract ? srmToLovibondClamped(colour) : colour;
    if (f.bool('ADD_AFTER_BOIL')) draft.kept.push(`${name}: added after the boil`);
    listUnread(f, draft);
    return { name: name.slice(0, 80), amountKg, potentialPpg: yieldPctToPpg(yieldPct), colorLovibond, kind };
  });
}

const HOP_USES: Record<string, HopUse> = {
  boil: 'boil',
  'dry hop': 'dry_hop',
  mash: 'mash',
  'first wort': 'first_wort',
  aroma: 'whirlpool',
  whirlpool: 'whirlpool',
};

const HOP_STAND_NOTE = /hop stand at (\d+(?:\.\d+)?) ?°?C/i;

function readHops(recipe: XmlRecord, draft: Draft, origins: Origins) {
  return recipe.list('HOPS', 'HOP').map((h, index) => {
    origins.set(`hops.${index}`, h);
    const name = h.text('NAME', { required: true })!;
    const useText = h.text('USE', { required: true })!;
    let use = HOP_USES[useText.trim().toLowerCase()];
    if (!use) {
      use = /stand|flame ?out|knock ?out|steep|whirl/i.test(useText)
        ? 'whirlpool'
        : /dry/i.test(useText)
          ? 'dry_hop'
          : 'boil';
      draft.guessed.push(
        `${h.at('USE')}: "${useText}" is not a BeerXML 1.0 use (Boil, Dry Hop, Mash, First Wort, Aroma); read as ${use.replace('_', ' ')}`,
      );
    }
    const amountKg = h.num('AMOUNT', { required: true, min: 0 })!;
    const alphaPct = h.num('ALPHA', { required: true, min: 0 })!;
    const timeMin = h.num('TIME', { required: true, min: 0 })!;
    const formText = h.text('FORM');
    const form = readHopForm(formText, name, draft);
    const notes = h.text('NOTES');
    let tempC: number | undefined;
    if (use === 'whirlpool') {
      const stand = notes ? HOP_STAND_NOTE.exec(notes) : null;
      if (stand) tempC = Number(stand[1]);
      else draft.guessed.push(`${h.path}: an "Aroma" addition, read as a hop stand at 80 °C for ${timeMin} min`);
    }
    if (notes && !HOP_STAND_NOTE.test(notes)) draft.dropped.push(`${h.at('NOTES')}: ${notes.slice(0, 80)}`);
    listUnread(h, draft);
    return {
      name: name.slice(0, 80),
      amountG: tidy(amountKg * 1000),
      alphaPct,
      use,
      timeMin,
      form,
      ...(tempC === undefined ? {} : { tempC }),
    };
  });
}

function readHopForm(formText: string | undefined, name: string, draft: Draft): HopForm {
  const form = formText?.trim().toLowerCase();
  if (form === undefined || form === 'pellet') return 'pellet';
  if (form === 'leaf') return 'leaf';
  if (form === 'plug') {
    draft.guessed.push(`${name}: plug hops counted as leaf`);
    return 'leaf';
  }
  draft.guessed.push(`${name}: hop form "${formText}" counted as pellet`);
  return 'pellet';
}

const YEAST_TYPES: Record<string, YeastKind> = {
  ale: 'ale',
  lager: 'lager',
  wheat: 'wheat',
  wine: 'other',
  champagne: 'other',
};

function readYeasts(recipe: XmlRecord, draft: Draft, origins: Origins) {
  const yeasts = recipe.list('YEASTS', 'YEAST');
  if (yeasts.length === 0) return defaultYeast(draft);
  return yeasts.map((y, index) => {
    origins.set(`yeasts.${index}`, y);
    const name = y.text('NAME', { required: true })!;
    const typeText = y.text('TYPE', { required: true })!;
    let kind = YEAST_TYPES[typeText.trim().toLowerCase()];
    if (!kind) {
      kind = /kveik/i.test(typeText) ? 'kveik' : /brett|lacto|pedio|wild|sour|mixed/i.test(typeText) ? 'wild' : 'other';
      draft.guessed.push(
        `${y.at('TYPE')}: "${typeText}" is not a BeerXML 1.0 type (Ale, Lager, Wheat, Wine, Champagne); read as ${kind}`,
      );
    }
    const bestFor = y.text('BEST_FOR');
    const written = (Object.keys(YEAST_BEST_FOR) as YeastKind[]).find((k) => YEAST_BEST_FOR[k] === bestFor);
    if (kind === 'ale' && written) kind = written;
    else if (kind === 'ale' && /kveik/i.test(name)) {
      kind = 'kveik';
      draft.guessed.push(`${name}: read as a kveik yeast from its name`);
    } else if (kind !== 'wheat' && /brett|lacto|pedio|wild|sour/i.test(name)) {
      kind = 'wild';
      draft.guessed.push(`${name}: read as a wild culture from its name`);
    }
    let attenuationPct = y.num('ATTENUATION', { min: 0 });
    // An attenuation of 0 is how some programs write "not known": no yeast leaves the wort untouched.
    if (attenuationPct === undefined || attenuationPct === 0) {
      attenuationPct = DEFAULT_ATTENUATION_PCT[kind];
      draft.guessed.push(`${name}: the file gives no attenuation; used ${attenuationPct}%`);
    }
    const tempMinC = y.num('MIN_TEMPERATURE');
    const tempMaxC = y.num('MAX_TEMPERATURE');
    y.markRead('FORM', 'AMOUNT', 'AMOUNT_IS_WEIGHT');
    if (bestFor && !written) draft.kept.push(`Yeast ${name}: best for ${bestFor}`);
    const source = [y.text('LABORATORY'), y.text('PRODUCT_ID')].filter(Boolean).join(' ');
    if (source) draft.kept.push(`Yeast ${name}: ${source}`);
    const notes = y.text('NOTES');
    if (notes) draft.kept.push(`Yeast ${name}: ${notes}`);
    listUnread(y, draft);
    return {
      name: name.slice(0, 80),
      kind,
      attenuationPct,
      ...(tempMinC === undefined ? {} : { tempMinC }),
      ...(tempMaxC === undefined ? {} : { tempMaxC }),
    };
  });
}

function readEquipment(
  recipe: XmlRecord,
  draft: Draft,
  batch: { volumeL: number; boilSizeL?: number; boilTimeMin: number },
) {
  const equipment = recipe.child('EQUIPMENT');
  const evapRatePct = equipment?.num('EVAP_RATE', { min: 0 });
  const boilSizeL = equipment?.num('BOIL_SIZE', { min: 0 }) ?? batch.boilSizeL;
  let trubLossL = equipment?.num('TRUB_CHILLER_LOSS', { min: 0 });
  if (trubLossL === undefined) {
    trubLossL = 1;
    draft.guessed.push('Kettle trub loss: the file gives none; used 1 L');
  }
  let boilOffLPerHour: number;
  if (evapRatePct !== undefined && boilSizeL !== undefined) {
    // BeerXML's evaporation rate is a percentage of the pre-boil volume per hour.
    boilOffLPerHour = tidy((evapRatePct / 100) * boilSizeL);
  } else if (boilSizeL !== undefined && batch.boilTimeMin > 0 && boilSizeL - batch.volumeL - trubLossL > 0) {
    boilOffLPerHour = round((boilSizeL - batch.volumeL - trubLossL) / (batch.boilTimeMin / 60), 2);
    draft.guessed.push(`Boil-off rate: worked out from the boil and batch sizes as ${boilOffLPerHour} L per hour`);
  } else {
    boilOffLPerHour = 4;
    draft.guessed.push('Boil-off rate: the file gives none; used 4 L per hour');
  }
  if (equipment) {
    equipment.markRead('NAME', 'BATCH_SIZE', 'BOIL_TIME', 'CALC_BOIL_VOLUME');
    listUnread(equipment, draft);
  }
  return { boilOffLPerHour: Math.min(boilOffLPerHour, 100), trubLossL };
}

function readMash(recipe: XmlRecord, draft: Draft, origins: Origins, gristKg: number) {
  const mash = recipe.child('MASH');
  if (!mash) return { steps: [], mashWaterLPerKg: 3 };
  const steps: { name?: string; tempC: number; timeMin: number }[] = [];
  let mashWaterLPerKg = 3;
  let infusionGiven = false;
  mash.list('MASH_STEPS', 'MASH_STEP').forEach((step, index) => {
    const stepName = step.text('NAME');
    const name = stepName === unnamedStep(index) ? undefined : stepName;
    const tempC = step.num('STEP_TEMP', { required: true, min: 0 })!;
    const timeMin = step.num('STEP_TIME', { required: true, min: 0 })!;
    const infuseL = step.num('INFUSE_AMOUNT', { min: 0 });
    step.markRead('TYPE', 'RAMP_TIME', 'END_TEMP', 'DESCRIPTION', 'WATER_GRAIN_RATIO', 'INFUSE_TEMP');
    if (index === 0 && infuseL && gristKg > 0) {
      infusionGiven = true;
      mashWaterLPerKg = tidy(infuseL / gristKg);
    }
    listUnread(step, draft);
    if (timeMin === 0) {
      draft.dropped.push(`${step.path}: a step of 0 minutes`);
      return;
    }
    origins.set(`mash.steps.${steps.length}`, step);
    steps.push({ ...(name ? { name: name.slice(0, 60) } : {}), tempC, timeMin });
  });
  if (steps.length && !infusionGiven) {
    draft.guessed.push('Mash thickness: the first step gives no infusion amount; used 3 L/kg');
  }
  mash.markRead('NAME', 'GRAIN_TEMP', 'TUN_TEMP', 'SPARGE_TEMP', 'TUN_WEIGHT', 'TUN_SPECIFIC_HEAT', 'EQUIP_ADJUST');
  const spargeC = mash.num('SPARGE_TEMP');
  if (spargeC !== undefined) draft.kept.push(`Sparge water at ${spargeC} °C`);
  const ph = mash.num('PH');
  if (ph !== undefined) draft.kept.push(`Mash pH ${ph}`);
  listUnread(mash, draft);
  return { steps, mashWaterLPerKg };
}

function readFermentation(recipe: XmlRecord, draft: Draft) {
  const steps: { tempC: number; days: number }[] = [];
  recipe.markRead('FERMENTATION_STAGES');
  let lastTempC: number | undefined;
  for (const stage of ['PRIMARY', 'SECONDARY', 'TERTIARY'] as const) {
    const days = recipe.num(`${stage}_AGE`, { min: 0 });
    let tempC = recipe.num(`${stage}_TEMP`);
    if (!days) continue;
    if (tempC === undefined) {
      tempC = lastTempC ?? 18;
      draft.guessed.push(`${stage.toLowerCase()} fermentation: the file gives no temperature; used ${tempC} °C`);
    }
    lastTempC = tempC;
    steps.push({ tempC, days });
  }
  const ageDays = recipe.num('AGE', { min: 0 });
  const ageC = recipe.num('AGE_TEMP');
  if (ageDays) draft.kept.push(`Age ${ageDays} days after packaging${ageC === undefined ? '' : ` at ${ageC} °C`}`);
  return steps;
}

function readCarbonation(recipe: XmlRecord, draft: Draft) {
  const volumesCO2 = recipe.num('CARBONATION', { min: 0 });
  let servingTempC = recipe.num('CARBONATION_TEMP');
  recipe.markRead('FORCED_CARBONATION', 'PRIMING_SUGAR_NAME', 'PRIMING_SUGAR_EQUIV', 'KEG_PRIMING_FACTOR');
  const sugar = recipe.text('PRIMING_SUGAR_NAME');
  if (sugar) draft.kept.push(`Priming sugar: ${sugar}`);
  if (!volumesCO2) return undefined;
  if (servingTempC === undefined) {
    servingTempC = DEFAULT_SERVING_TEMP_C;
    draft.guessed.push(
      `Serving temperature: the file gives no carbonation temperature; used ${DEFAULT_SERVING_TEMP_C} °C`,
    );
  }
  return { volumesCO2, servingTempC };
}

function readStyle(recipe: XmlRecord, draft: Draft) {
  const style = recipe.child('STYLE');
  if (!style) return undefined;
  const name = style.text('NAME') ?? '';
  if (name === UNSPECIFIED_STYLE || (!style.text('CATEGORY_NUMBER') && /^(unspecified|none)?$/i.test(name))) {
    style.markRead(...Object.keys(style.node));
    return undefined;
  }
  const matched = matchStyle(
    {
      name: style.text('NAME'),
      number: style.text('CATEGORY_NUMBER'),
      letter: style.text('STYLE_LETTER'),
      guide: style.text('STYLE_GUIDE'),
    },
    draft,
  );
  // The style's own ranges are the guide's, not the recipe's; we fit against our copy of the guidelines.
  style.markRead(...Object.keys(style.node));
  return matched;
}

interface MiscReading {
  salts: SaltAddition[];
}

function readMiscs(recipe: XmlRecord, draft: Draft, origins: Origins): MiscReading {
  const salts: SaltAddition[] = [];
  recipe.list('MISCS', 'MISC').forEach((m) => {
    const name = m.text('NAME', { required: true })!;
    const type = m.text('TYPE') ?? '';
    const amount = m.num('AMOUNT', { required: true, min: 0 })!;
    const isWeight = m.bool('AMOUNT_IS_WEIGHT') ?? false;
    const use = m.text('USE') ?? '';
    const time = m.num('TIME', { min: 0 });
    m.markRead('USE_FOR', 'NOTES', 'VERSION');
    if (takeSalt(salts, origins, m, name, () => (isWeight ? amount * 1000 : undefined))) return;
    const amountText = isWeight ? `${plain(amount * 1000, 2)} g` : `${plain(amount * 1000, 1)} mL`;
    draft.dropped.push(`${m.path}: ${type || 'miscellaneous'} ingredients are not modelled`);
    draft.kept.push(`${name} (${type || 'other'}): ${amountText}${use ? `, ${use}` : ''}${time ? ` ${time} min` : ''}`);
  });
  return { salts };
}

function readWater(recipe: XmlRecord, draft: Draft, salts: MiscReading['salts'], fallbackVolumeL: number) {
  const waters = recipe.list('WATERS', 'WATER');
  if (waters.length === 0 && salts.length === 0) return undefined;
  const readings = waters.map((w) => {
    const volumeL = w.num('AMOUNT', { min: 0 }) ?? 0;
    const ions = Object.fromEntries(
      ION_NAMES.map((ion) => [ion, w.num(ion.toUpperCase(), { min: 0 }) ?? 0]),
    ) as WaterProfile;
    w.markRead('NAME', 'NOTES');
    const ph = w.num('PH');
    if (ph !== undefined) draft.kept.push(`Water ${w.text('NAME') ?? ''} pH ${ph}`.replace('  ', ' '));
    listUnread(w, draft);
    return { volumeL, ions };
  });
  return mixWaters(readings, salts, draft, fallbackVolumeL);
}

function readKeptExtras(recipe: XmlRecord, draft: Draft): void {
  recipe.markRead('VERSION', 'DATE', 'TASTE_RATING', 'NOTES', 'TASTE_NOTES');
  dropCredits(draft, recipe.at('BREWER'), [recipe.text('BREWER'), recipe.text('ASST_BREWER')]);
  const og = recipe.num('OG');
  const fg = recipe.num('FG');
  if (og !== undefined || fg !== undefined) {
    draft.kept.push(
      `Measured in the file: ${[og !== undefined && `OG ${og}`, fg !== undefined && `FG ${fg}`].filter(Boolean).join(', ')}`,
    );
  }
  const date = recipe.text('DATE');
  if (date) draft.kept.push(`Brewed on ${date}`);
}
