import type {
  FermentableKind,
  HopForm,
  HopUse,
  RecipeDocumentInput,
  WaterProfile,
  YeastKind,
} from '@/lib/brewing/schema';
import { platoToSg } from '@/lib/brewing/gravity';
import { ION_NAMES } from '@/lib/brewing/schema';
import { assertWithinLimit } from '../limits';
import {
  DEFAULT_ATTENUATION_PCT,
  DEFAULT_BOIL_TIME_MIN,
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
import {
  isMassUnit,
  plain,
  potentialSgToPpg,
  round,
  tidy,
  toCelsius,
  toKg,
  toLitres,
  toLovibond,
  toMgPerL,
  toMinutes,
  toPercent,
  yieldPctToPpg,
  type Measured,
} from '../units';
import { checkBeerJsonSchema } from './schema';
import { WHEAT_YEAST_BEST_FOR } from './write';

/**
 * Reading BeerJSON 1.0 (the BeerJSON project, "BeerJSON: a JSON schema for beer recipes", 1.0).
 * Every measured value carries its unit; the file is checked against the published schema
 * before any of it is read.
 */

const FORMAT_NAME = 'BeerJSON';

type Json = Record<string, unknown>;

export function parseBeerJson(text: string): ImportResult {
  assertWithinLimit(text);
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    throw new InterchangeError(`the file is not valid JSON: ${(err as Error).message}`, '(file)', 'malformed');
  }
  const problem = checkBeerJsonSchema(data);
  if (problem) throw new InterchangeError(problem.message, problem.path);
  const root = (data as { beerjson: Json }).beerjson;
  const recipes = (root.recipes as Json[] | undefined) ?? [];
  if (recipes.length === 0) throw new InterchangeError('the file holds no recipe', 'beerjson.recipes');
  const library = {
    cultures: (root.cultures as Json[] | undefined) ?? [],
    equipments: (root.equipments as Json[] | undefined) ?? [],
  };
  return { recipes: recipes.map((recipe, index) => readRecipe(recipe, `beerjson.recipes[${index}]`, library)) };
}

interface Library {
  cultures: Json[];
  equipments: Json[];
}

/** A BeerJSON object with its path in the file, for messages. */
class Node {
  constructor(
    readonly data: Json,
    readonly path: string,
  ) {}

  at(key: string): string {
    return `${this.path}.${key}`;
  }

  str(key: string): string | undefined {
    const value = this.data[key];
    return typeof value === 'string' && value.trim() ? value : undefined;
  }

  child(key: string): Node | undefined {
    const value = this.data[key];
    return value && typeof value === 'object' && !Array.isArray(value)
      ? new Node(value as Json, this.at(key))
      : undefined;
  }

  list(key: string): Node[] {
    const value = this.data[key];
    if (!Array.isArray(value)) return [];
    return value.map((item, i) => {
      const name = (item as Json).name;
      return new Node(
        item as Json,
        `${this.at(key)}[${i}]${typeof name === 'string' && name ? ` (${name.slice(0, 60)})` : ''}`,
      );
    });
  }

  /** A measured value; negative ones are refused here, since the schema allows them. */
  measured(key: string, opts: { allowNegative?: boolean } = {}): Measured | undefined {
    const value = this.data[key] as Measured | undefined;
    if (!value) return undefined;
    if (!opts.allowNegative && value.value < 0)
      throw new InterchangeError(`must not be negative (got ${value.value} ${value.unit})`, this.at(key));
    return value;
  }
}

const FIELD_NAMES: Record<string, string> = {
  title: 'name',
  notes: 'notes',
  'batch.volumeL': 'batch_size',
  'batch.boilTimeMin': 'boil.boil_time',
  'batch.efficiencyPct': 'efficiency.brewhouse',
  'batch.boilOffLPerHour': 'equipment boil_rate_per_hour',
  'batch.trubLossL': 'equipment loss',
  'batch.grainAbsorptionLPerKg': 'equipment grain_absorption_rate',
  'batch.mashWaterLPerKg': 'mash.mash_steps[0].water_grain_ratio',
  'carbonation.volumesCO2': 'carbonation',
  'carbonation.servingTempC': 'packaging.packaging_vessels[0].start_temperature',
  'water.volumeL': 'ingredients.water_additions',
  'water.salts': 'ingredients.miscellaneous_additions',
  fermentables: 'ingredients.fermentable_additions',
  hops: 'ingredients.hop_additions',
  yeasts: 'ingredients.culture_additions',
  amountKg: 'amount',
  amountG: 'amount',
  potentialPpg: 'yield',
  colorLovibond: 'color',
  alphaPct: 'alpha_acid',
  attenuationPct: 'attenuation',
  tempMinC: 'temperature_range.minimum',
  tempMaxC: 'temperature_range.maximum',
  timeMin: 'step_time',
  tempC: 'step_temperature',
  days: 'step_time',
};

type Origins = SharedOrigins<Node>;

function describer(recipe: Node, origins: Origins) {
  return (path: string): string =>
    describeFromOrigins(
      origins,
      path,
      (section, field) => {
        if (section === 'hops' && field === 'timeMin') return 'timing.duration';
        if (section === 'hops' && field === 'tempC') return 'hop stand step temperature';
        if (section === 'fermentation' && field === 'tempC') return 'start_temperature';
        return FIELD_NAMES[field] ?? field;
      },
      (originPath, name) => `${originPath}.${name}`,
    ) ?? recipe.at(FIELD_NAMES[path] ?? path);
}

function readRecipe(data: Json, basePath: string, library: Library): ImportedRecipe {
  const name = typeof data.name === 'string' ? data.name : '';
  const recipe = new Node(data, `${basePath}${name ? ` (${name.slice(0, 60)})` : ''}`);
  const draft = newDraft();
  const origins: Origins = new Map();
  const volumeL = toLitres(recipe.measured('batch_size')!, recipe.at('batch_size'));
  const efficiency = recipe.child('efficiency')!;
  const efficiencyPct = toPercent(efficiency.measured('brewhouse')!, efficiency.at('brewhouse'));
  const boil = recipe.child('boil');
  let boilTimeMin = DEFAULT_BOIL_TIME_MIN;
  if (boil) boilTimeMin = toMinutes(boil.measured('boil_time')!, boil.at('boil_time'));
  else draft.guessed.push(`Boil time: the recipe has no boil; used ${DEFAULT_BOIL_TIME_MIN} min`);
  const boilSteps = boil?.list('boil_steps') ?? [];
  const ingredients = recipe.child('ingredients')!;
  const fermentables = readFermentables(ingredients, draft, origins);
  const mash = readMash(recipe, draft, origins, mashedKg(fermentables));
  const equipment = readEquipment(recipe, library, draft, {
    volumeL,
    boilTimeMin,
    preBoil: boil?.measured('pre_boil_size'),
  });
  const salts = readMiscs(ingredients, draft, origins);
  const document: RecipeDocumentInput = {
    title: name.trim().slice(0, 120) || 'Imported recipe',
    batch: { volumeL, boilTimeMin, efficiencyPct, ...equipment, mashWaterLPerKg: mash.mashWaterLPerKg },
    fermentables,
    hops: readHops(ingredients, boilSteps, draft, origins),
    yeasts: readCultures(ingredients, library, draft, origins),
    mash: { steps: mash.steps },
    fermentation: { steps: readFermentation(recipe, draft, origins) },
    water: readWater(ingredients, salts, draft, volumeL),
    carbonation: readCarbonation(recipe, draft),
    style: readStyle(recipe, draft),
    notes: '',
  };
  if (!name.trim()) draft.guessed.push('Title: the recipe has no name; called it "Imported recipe"');
  readKeptExtras(recipe, draft);
  return finishRecipe(document, draft, describer(recipe, origins), {
    text: recipe.str('notes') ?? '',
    formatName: FORMAT_NAME,
  });
}

function amountKg(node: Node, what: string): number {
  const amount = node.measured('amount');
  if (!amount) throw new InterchangeError('is required', node.at('amount'));
  if (!isMassUnit(amount.unit)) {
    throw new InterchangeError(
      `${what} given as a volume (${amount.value} ${amount.unit}); Kettlefork needs a weight (kg, g, lb or oz)`,
      node.at('amount'),
    );
  }
  return toKg(amount, node.at('amount'));
}

function readFermentables(ingredients: Node, draft: Draft, origins: Origins) {
  const byWeight = ingredients.list('fermentable_additions').filter((f) => {
    const amount = f.measured('amount');
    if (!amount || isMassUnit(amount.unit)) return true;
    // Syrups, honey and purées are measured by volume; their weight depends on a density the file does not give.
    draft.dropped.push(
      `${f.path}: measured by volume (${plain(amount.value, 3)} ${amount.unit}); Kettlefork counts fermentables by weight, so it is left out`,
    );
    draft.kept.push(`${String(f.data.name)}: ${plain(amount.value, 3)} ${amount.unit} (left out: measured by volume)`);
    return false;
  });
  return byWeight.map((f, index) => {
    origins.set(`fermentables.${index}`, f);
    const type = String(f.data.type);
    const group = f.str('grain_group');
    let kind: FermentableKind;
    if (type === 'grain') kind = group === 'adjunct' || group === 'flaked' ? 'adjunct' : 'grain';
    else if (type === 'extract' || type === 'dry extract') kind = 'extract';
    else if (type === 'sugar' || type === 'honey') kind = 'sugar';
    else {
      kind = 'adjunct';
      draft.guessed.push(`${f.path}: a "${type}" fermentable counted as an adjunct`);
    }
    const yieldNode = f.child('yield')!;
    let potentialPpg: number;
    const potential = yieldNode.measured('potential');
    const fine = yieldNode.measured('fine_grind');
    const coarse = yieldNode.measured('coarse_grind');
    if (potential) {
      // °P and °Brix measure the same thing for a sugar solution: grams of extract per 100 g (common practice).
      let sg = potential.unit === 'sg' ? potential.value : platoToSg(potential.value);
      // Some files write the potential as gravity times 1000 (1037 for 1.037).
      if (potential.unit === 'sg' && sg >= 1000 && sg < 1200) {
        sg /= 1000;
        draft.guessed.push(`${yieldNode.at('potential')}: ${potential.value} read as ${sg}`);
      }
      potentialPpg = potentialSgToPpg(sg);
    } else if (fine) potentialPpg = yieldPctToPpg(toPercent(fine, yieldNode.at('fine_grind')));
    else if (coarse) {
      potentialPpg = yieldPctToPpg(toPercent(coarse, yieldNode.at('coarse_grind')));
      draft.guessed.push(`${f.path}: only a coarse-grind yield is given; used it as the potential`);
    } else throw new InterchangeError('gives no potential, fine_grind or coarse_grind yield', yieldNode.path);
    const colorLovibond = tidy(toLovibond(f.measured('color')!, f.at('color')));
    const timing = f.child('timing');
    if (timing?.str('use') && timing.str('use') !== 'add_to_mash' && timing.str('use') !== 'add_to_boil') {
      draft.kept.push(`${f.data.name}: added ${String(timing.str('use')).replace(/_/g, ' ')}`);
    }
    return {
      name: String(f.data.name).slice(0, 80),
      amountKg: tidy(amountKg(f, 'the amount')),
      potentialPpg,
      colorLovibond,
      kind,
    };
  });
}

/** How each boil step is read for hop timing: a step named for first wort, or a hop stand below boiling. */
function boilStepKind(step: Node | undefined): { use: 'first_wort' | 'whirlpool' | 'boil'; tempC?: number } {
  if (!step) return { use: 'boil' };
  const name = step.str('name') ?? '';
  if (/first wort/i.test(name)) return { use: 'first_wort' };
  const start = step.measured('start_temperature', { allowNegative: true });
  const startC = start ? toCelsius(start, step.at('start_temperature')) : undefined;
  const end = step.measured('end_temperature', { allowNegative: true });
  const endC = end ? toCelsius(end, step.at('end_temperature')) : undefined;
  if (/whirlpool|hop stand|steep/i.test(name) || (endC !== undefined && endC < 99)) {
    return { use: 'whirlpool', tempC: endC ?? startC };
  }
  return { use: 'boil' };
}

function readHops(ingredients: Node, boilSteps: Node[], draft: Draft, origins: Origins) {
  const byWeight = ingredients.list('hop_additions').filter((h) => {
    const amount = h.measured('amount');
    if (!amount || isMassUnit(amount.unit)) return true;
    // Hop oils and liquid extracts are measured by volume; they add aroma, and we count hops by weight.
    draft.dropped.push(
      `${h.path}: measured by volume (${plain(amount.value, 3)} ${amount.unit}); hops are counted by weight`,
    );
    draft.kept.push(`${String(h.data.name)}: ${plain(amount.value, 3)} ${amount.unit}`);
    return false;
  });
  return byWeight.map((h, index) => {
    origins.set(`hops.${index}`, h);
    const name = String(h.data.name).slice(0, 80);
    const amountG = tidy(amountKg(h, 'the hop amount') * 1000);
    const alphaPct = toPercent(h.measured('alpha_acid')!, h.at('alpha_acid'));
    const form = readHopForm(h.str('form'), h.path, draft);
    const timing = h.child('timing')!;
    const useText = timing.str('use');
    const duration = timing.measured('duration');
    const time = timing.measured('time');
    const minutes = (m: Measured | undefined, key: string) => (m ? toMinutes(m, timing.at(key)) : undefined);
    let use: HopUse;
    let tempC: number | undefined;
    let timeMin: number | undefined;
    if (useText === 'add_to_mash') {
      use = 'mash';
      timeMin = minutes(duration, 'duration') ?? minutes(time, 'time');
    } else if (useText === 'add_to_fermentation' || useText === 'add_to_package') {
      use = 'dry_hop';
      timeMin = minutes(duration, 'duration');
      if (time)
        draft.kept.push(`${name}: dry hop added ${plain(minutes(time, 'time')! / 1440, 2)} days into fermentation`);
      if (useText === 'add_to_package') draft.guessed.push(`${h.path}: a hop added at packaging, counted as a dry hop`);
    } else {
      const step = typeof timing.data.step === 'number' ? boilSteps[(timing.data.step as number) - 1] : undefined;
      const kind = boilStepKind(step);
      use = kind.use;
      tempC = kind.tempC;
      timeMin = minutes(duration, 'duration');
      if (timeMin === undefined && time) {
        timeMin = minutes(time, 'time');
        draft.guessed.push(`${h.path}: timing gives only "time"; read it as ${timeMin} minutes of contact`);
      }
      if (!useText) draft.guessed.push(`${h.path}: timing names no use; counted as a boil addition`);
    }
    if (timeMin === undefined) {
      timeMin = 0;
      draft.guessed.push(`${h.path}: timing gives no duration; used 0 min`);
    }
    if (use === 'whirlpool' && tempC === undefined)
      draft.guessed.push(`${h.path}: hop stand temperature not given; counted at 80 °C`);
    return {
      name,
      amountG,
      alphaPct,
      use,
      timeMin: tidy(timeMin),
      form,
      ...(tempC === undefined ? {} : { tempC: tidy(tempC) }),
    };
  });
}

function readHopForm(form: string | undefined, path: string, draft: Draft): HopForm {
  if (form === undefined || form === 'pellet') return 'pellet';
  if (form === 'leaf' || form === 'leaf (wet)' || form === 'plug') {
    if (form !== 'leaf') draft.guessed.push(`${path}: "${form}" hops counted as leaf`);
    return 'leaf';
  }
  draft.guessed.push(`${path}: "${form}" hops counted as pellet`);
  return 'pellet';
}

const CULTURE_KINDS: Record<string, YeastKind> = {
  ale: 'ale',
  lager: 'lager',
  kveik: 'kveik',
  brett: 'wild',
  lacto: 'wild',
  pedio: 'wild',
  bacteria: 'wild',
  spontaneous: 'wild',
  'mixed-culture': 'wild',
  wine: 'other',
  champagne: 'other',
  malolactic: 'other',
  other: 'other',
};

function readCultures(ingredients: Node, library: Library, draft: Draft, origins: Origins) {
  const cultures = ingredients.list('culture_additions');
  if (cultures.length === 0) return defaultYeast(draft);
  return cultures.map((c, index) => {
    origins.set(`yeasts.${index}`, c);
    const name = String(c.data.name).slice(0, 80);
    let kind = CULTURE_KINDS[String(c.data.type)] ?? 'other';
    // The n-th addition of a name is described by the n-th library entry of that name (else the first).
    const occurrence = cultures.slice(0, index).filter((other) => other.data.name === c.data.name).length;
    const namesakes = library.cultures.filter((entry) => entry.name === c.data.name);
    const info = namesakes[occurrence] ?? namesakes[0];
    const infoNode = info ? new Node(info, `beerjson.cultures (${name})`) : undefined;
    // BeerJSON has no wheat-beer type; such yeasts travel as ale, known by what they are best for or by name.
    if (kind === 'ale' && infoNode?.str('best_for') === WHEAT_YEAST_BEST_FOR) kind = 'wheat';
    else if (kind === 'ale' && /wheat|weizen|weiss/i.test(name)) {
      kind = 'wheat';
      draft.guessed.push(`${name}: read as a wheat-beer yeast from its name`);
    }
    const attenuation = c.measured('attenuation');
    let attenuationPct: number;
    // An attenuation of 0 is how some programs write "not known": no yeast leaves the wort untouched.
    if (attenuation && attenuation.value > 0) attenuationPct = toPercent(attenuation, c.at('attenuation'));
    else {
      const range = infoNode?.child('attenuation_range');
      if (range) {
        attenuationPct = round(
          (toPercent(range.measured('minimum')!, range.at('minimum')) +
            toPercent(range.measured('maximum')!, range.at('maximum'))) /
            2,
          1,
        );
        draft.guessed.push(`${name}: attenuation taken as the middle of its range, ${attenuationPct}%`);
      } else {
        attenuationPct = DEFAULT_ATTENUATION_PCT[kind];
        draft.guessed.push(`${name}: the file gives no attenuation; used ${attenuationPct}%`);
      }
    }
    const range = c.child('temperature_range') ?? infoNode?.child('temperature_range');
    const tempMinC = range
      ? tidy(toCelsius(range.measured('minimum', { allowNegative: true })!, range.at('minimum')))
      : undefined;
    const tempMaxC = range
      ? tidy(toCelsius(range.measured('maximum', { allowNegative: true })!, range.at('maximum')))
      : undefined;
    const producer = [c.str('producer'), c.str('product_id')].filter(Boolean).join(' ');
    if (producer) draft.kept.push(`Culture ${name}: ${producer}`);
    return {
      name,
      kind,
      attenuationPct,
      ...(tempMinC === undefined ? {} : { tempMinC }),
      ...(tempMaxC === undefined ? {} : { tempMaxC }),
    };
  });
}

function readEquipment(
  recipe: Node,
  library: Library,
  draft: Draft,
  batch: { volumeL: number; boilTimeMin: number; preBoil?: Measured },
) {
  // Equipment sits beside the recipes in BeerJSON; one set (or one named like the recipe) is the recipe's.
  const match =
    library.equipments.find((e) => e.name === recipe.data.name) ??
    (library.equipments.length === 1 ? library.equipments[0] : undefined);
  const items = match ? new Node(match, `beerjson.equipments (${String(match.name)})`).list('equipment_items') : [];
  const kettle = items.find((i) => i.data.form === 'Brew Kettle');
  const tun = items.find((i) => i.data.form === 'Mash Tun' || i.data.form === 'Lauter Tun');
  const rate = kettle?.measured('boil_rate_per_hour');
  const loss = kettle?.measured('loss');
  const absorption = tun?.measured('grain_absorption_rate');
  const trubLossL = loss ? tidy(toLitres(loss, kettle!.at('loss'))) : 1;
  if (!loss) draft.guessed.push('Kettle trub loss: the file gives none; used 1 L');
  let boilOffLPerHour: number;
  if (rate) boilOffLPerHour = tidy(toLitres(rate, kettle!.at('boil_rate_per_hour')));
  else if (batch.preBoil && batch.boilTimeMin > 0) {
    const preBoilL = toLitres(batch.preBoil, recipe.at('boil.pre_boil_size'));
    const worked = round((preBoilL - batch.volumeL - trubLossL) / (batch.boilTimeMin / 60), 2);
    boilOffLPerHour = worked > 0 ? Math.min(worked, 100) : 4;
    draft.guessed.push(`Boil-off rate: worked out from the pre-boil and batch sizes as ${boilOffLPerHour} L per hour`);
  } else {
    boilOffLPerHour = 4;
    draft.guessed.push('Boil-off rate: the file gives none; used 4 L per hour');
  }
  let grainAbsorptionLPerKg = 1;
  if (absorption) grainAbsorptionLPerKg = tidy(specificVolumeToLPerKg(absorption, tun!.at('grain_absorption_rate')));
  else draft.guessed.push('Grain absorption: the file gives none; used 1 L/kg');
  return { boilOffLPerHour, trubLossL, grainAbsorptionLPerKg };
}

/** Mash thickness and grain absorption: litres per kg from the schema's specific-volume units. */
function specificVolumeToLPerKg(m: Measured, element: string): number {
  const perKg = (volume: string, mass: string) =>
    toLitres({ value: m.value, unit: volume }, element) / toKg({ value: 1, unit: mass }, element);
  switch (m.unit) {
    case 'l/kg':
      return m.value;
    case 'l/g':
      return m.value * 1000;
    case 'qt/lb':
      return perKg('qt', 'lb');
    case 'gal/lb':
      return perKg('gal', 'lb');
    case 'gal/oz':
      return perKg('gal', 'oz');
    case 'floz/oz':
      return perKg('floz', 'oz');
    case 'm^3/kg':
      return m.value * 1000;
    case 'ft^3/lb':
      return (m.value * 28.316846592) / toKg({ value: 1, unit: 'lb' }, element);
    default:
      throw new InterchangeError(`unknown specific volume unit "${m.unit}"`, element);
  }
}

function readMash(recipe: Node, draft: Draft, origins: Origins, gristKg: number) {
  const mash = recipe.child('mash');
  const steps: { name?: string; tempC: number; timeMin: number }[] = [];
  let mashWaterLPerKg = 3;
  if (!mash) return { steps, mashWaterLPerKg };
  let thicknessGiven = false;
  mash.list('mash_steps').forEach((step, index) => {
    const type = String(step.data.type);
    if (type === 'sparge' || type === 'drain mash tun') {
      draft.dropped.push(`${step.path}: a ${type} step (not a rest)`);
      return;
    }
    const tempC = tidy(toCelsius(step.measured('step_temperature')!, step.at('step_temperature')));
    const timeMin = tidy(toMinutes(step.measured('step_time')!, step.at('step_time')));
    if (index === 0) {
      const ratio = step.measured('water_grain_ratio');
      const amount = step.measured('amount');
      if (ratio) {
        mashWaterLPerKg = tidy(specificVolumeToLPerKg(ratio, step.at('water_grain_ratio')));
        thicknessGiven = true;
      } else if (amount && gristKg > 0) {
        mashWaterLPerKg = tidy(toLitres(amount, step.at('amount')) / gristKg);
        thicknessGiven = true;
      }
    }
    if (timeMin === 0) {
      draft.dropped.push(`${step.path}: a step of 0 minutes`);
      return;
    }
    origins.set(`mash.steps.${steps.length}`, step);
    const stepName = step.str('name');
    const name = stepName === unnamedStep(index) ? undefined : stepName;
    steps.push({ ...(name ? { name: name.slice(0, 60) } : {}), tempC, timeMin });
  });
  if (steps.length && !thicknessGiven)
    draft.guessed.push('Mash thickness: the first step gives no water-to-grain ratio; used 3 L/kg');
  return { steps, mashWaterLPerKg };
}

function readFermentation(recipe: Node, draft: Draft, origins: Origins) {
  const fermentation = recipe.child('fermentation');
  if (!fermentation) return [];
  const steps: { tempC: number; days: number }[] = [];
  let lastC: number | undefined;
  for (const step of fermentation.list('fermentation_steps')) {
    const start = step.measured('start_temperature', { allowNegative: true });
    const end = step.measured('end_temperature', { allowNegative: true });
    const time = step.measured('step_time');
    if (!time || time.value === 0) {
      draft.dropped.push(`${step.path}: a step with no time`);
      continue;
    }
    let tempC = start
      ? toCelsius(start, step.at('start_temperature'))
      : end
        ? toCelsius(end, step.at('end_temperature'))
        : undefined;
    if (tempC === undefined) {
      tempC = lastC ?? 18;
      draft.guessed.push(`${step.path}: no temperature given; used ${tempC} °C`);
    }
    if (start && end && Math.abs(toCelsius(end, step.at('end_temperature')) - tempC) > 0.05) {
      draft.kept.push(
        `${step.str('name') ?? 'Fermentation step'}: from ${plain(tempC, 1)} °C to ${plain(toCelsius(end, step.at('end_temperature')), 1)} °C`,
      );
    }
    lastC = tempC;
    origins.set(`fermentation.steps.${steps.length}`, step);
    steps.push({ tempC: tidy(tempC), days: tidy(toMinutes(time, step.at('step_time')) / 1440) });
  }
  return steps;
}

function readMiscs(ingredients: Node, draft: Draft, origins: Origins): SaltAddition[] {
  const salts: SaltAddition[] = [];
  for (const m of ingredients.list('miscellaneous_additions')) {
    const name = String(m.data.name);
    const amount = m.measured('amount');
    const weighedGrams = () => (amount && isMassUnit(amount.unit) ? toKg(amount, m.at('amount')) * 1000 : undefined);
    if (takeSalt(salts, origins, m, name, weighedGrams)) continue;
    draft.dropped.push(`${m.path}: ${String(m.data.type)} ingredients are not modelled`);
    const use = m.child('timing')?.str('use');
    draft.kept.push(
      `${name} (${String(m.data.type)}): ${amount ? `${plain(amount.value, 3)} ${amount.unit}` : 'amount not given'}${use ? `, ${use.replace(/_/g, ' ')}` : ''}`,
    );
  }
  return salts;
}

function readWater(ingredients: Node, salts: SaltAddition[], draft: Draft, batchL: number) {
  const waters = ingredients.list('water_additions');
  if (waters.length === 0 && salts.length === 0) return undefined;
  const readings = waters.map((w) => {
    const ions = Object.fromEntries(
      ION_NAMES.map((ion) => [ion, tidy(toMgPerL(w.measured(ion)!, w.at(ion)))]),
    ) as WaterProfile;
    const amount = w.measured('amount');
    return { ions, volumeL: amount ? toLitres(amount, w.at('amount')) : 0 };
  });
  return mixWaters(readings, salts, draft, batchL * 1.5);
}

function readCarbonation(recipe: Node, draft: Draft) {
  const vessel = recipe.child('packaging')?.list('packaging_vessels')[0];
  const volumes = typeof recipe.data.carbonation === 'number' ? recipe.data.carbonation : undefined;
  const vesselCarbonation =
    typeof vessel?.data.carbonation === 'number' ? (vessel.data.carbonation as number) : undefined;
  const volumesCO2 = volumes ?? vesselCarbonation;
  if (volumesCO2 === undefined) return undefined;
  if (volumesCO2 < 0) throw new InterchangeError(`must not be negative (got ${volumesCO2})`, recipe.at('carbonation'));
  const start = vessel?.measured('start_temperature', { allowNegative: true });
  if (!start) draft.guessed.push(`Serving temperature: the file gives none; used ${DEFAULT_SERVING_TEMP_C} °C`);
  return {
    volumesCO2,
    servingTempC: start ? tidy(toCelsius(start, vessel!.at('start_temperature'))) : DEFAULT_SERVING_TEMP_C,
  };
}

function readStyle(recipe: Node, draft: Draft) {
  const style = recipe.child('style');
  if (!style) return undefined;
  const number = typeof style.data.category_number === 'number' ? String(style.data.category_number) : undefined;
  return matchStyle(
    { name: style.str('name'), number, letter: style.str('style_letter'), guide: style.str('style_guide') },
    draft,
  );
}

function readKeptExtras(recipe: Node, draft: Draft): void {
  dropCredits(draft, recipe.at('author'), [recipe.str('author'), recipe.str('coauthor')]);
  const measured = (key: string) => {
    const m = recipe.data[key] as Measured | undefined;
    return m && typeof m === 'object' ? `${plain(m.value, 3)} ${m.unit}` : undefined;
  };
  const og = measured('original_gravity');
  const fg = measured('final_gravity');
  if (og || fg)
    draft.dropped.push(
      `${recipe.path}: the file's own gravity estimates (${[og && `OG ${og}`, fg && `FG ${fg}`].filter(Boolean).join(', ')}); Kettlefork recomputes them`,
    );
  for (const key of [
    'ibu_estimate',
    'color_estimate',
    'alcohol_by_volume',
    'apparent_attenuation',
    'calories_per_pint',
  ]) {
    if (recipe.data[key] !== undefined) draft.dropped.push(`${recipe.at(key)}: recomputed by Kettlefork`);
  }
  const taste = recipe.child('taste');
  if (taste?.str('notes')) draft.kept.push(`Tasting notes: ${taste.str('notes')}`);
}
