import { addDays, differenceInCalendarDays, format, parseISO } from 'date-fns';
import { z } from 'zod';
import type { RecipeDocument, YeastKind } from '@/lib/brewing/schema';

/**
 * Planning a brew back from the day it must pour. Pure: every date comes in as an ISO day
 * (`today` included), so the same plan is computed in the browser and on the server.
 *
 * Every duration below is a fact of the trade with a range; where no single published source
 * gives it, it is marked "common practice".
 */

const CARBONATION_METHODS = ['set_and_forget', 'burst', 'spunding', 'bottle'] as const;
export type CarbonationMethod = (typeof CARBONATION_METHODS)[number];
const DRY_HOP_PLACES = ['fermenter', 'keg'] as const;
export type DryHopPlace = (typeof DRY_HOP_PLACES)[number];

export interface DayRange {
  min: number;
  typical: number;
  max: number;
  source: string;
}

const COMMON = 'common practice';

/** Named sources for the lengths below; each is quoted from memory of the printed text. */
const PALMER = 'Palmer, How to Brew (4th ed., 2017)';
const GARSHOL = 'Garshol, Historical Brewing Techniques: The Lost Art of Farmhouse Brewing (2020)';

/**
 * Days of primary fermentation until the gravity is stable, by yeast kind and the beer's
 * temperature. Each range carries its source: an ale finishing primary in one to two weeks
 * (Palmer, from memory); kveik pitched hot finishing in two to four days (Garshol reports farmhouse
 * brewers' ferments done in a day or two at 30–40 °C, from memory); the rest common practice.
 */
export function fermentationDays(kind: YeastKind, tempC: number): DayRange {
  switch (kind) {
    case 'kveik':
      if (tempC >= 30) return { min: 2, typical: 3, max: 4, source: `${GARSHOL} (kveik at 30–35 °C)` };
      // Cooler kveik ferments: common practice.
      if (tempC >= 25) return { min: 3, typical: 4, max: 6, source: `${COMMON} (kveik at 25–29 °C)` };
      return { min: 5, typical: 7, max: 10, source: `${COMMON} (kveik below 25 °C)` };
    case 'lager':
      // Lager primary at 8–13 °C for two to four weeks, warmer lagers faster: common practice.
      if (tempC <= 13) return { min: 14, typical: 21, max: 28, source: `${COMMON} (lager at 8–13 °C)` };
      return { min: 10, typical: 14, max: 21, source: `${COMMON} (lager above 13 °C)` };
    case 'wild':
      // Mixed and wild fermentations run for months: common practice.
      return { min: 30, typical: 60, max: 180, source: `${COMMON} (mixed and wild fermentation)` };
    case 'ale':
    case 'wheat':
    case 'other':
    default:
      // Warm ales finish sooner than cool ones (common practice); the 1–2 week span is Palmer's.
      if (tempC >= 20) return { min: 5, typical: 7, max: 10, source: `${COMMON} (ale at 20 °C and above)` };
      return { min: 7, typical: 10, max: 14, source: `${PALMER} (ale at 16–19 °C: one to two weeks)` };
  }
}

/**
 * Days from a filled keg or bottle to carbonated beer, by method. Bottle conditioning's two weeks
 * at room temperature is Palmer's (from memory); the keg methods are common practice.
 */
export function carbonationDays(method: CarbonationMethod): DayRange {
  switch (method) {
    case 'set_and_forget':
      return { min: 7, typical: 10, max: 14, source: `${COMMON} (cold keg held at serving pressure)` };
    case 'burst':
      return { min: 1, typical: 2, max: 3, source: `${COMMON} (24–48 h at high pressure, then serving pressure)` };
    case 'spunding':
      return { min: 0, typical: 1, max: 2, source: `${COMMON} (CO2 kept from fermentation; chill and top up)` };
    case 'bottle':
      return { min: 10, typical: 14, max: 21, source: `${PALMER} (primed bottles at about 20 °C: two weeks)` };
  }
}

/** A cold crash before packaging: 1–3 days near 0–4 °C (common practice). */
const CRASH_DAYS: DayRange = { min: 1, typical: 2, max: 3, source: `${COMMON} (0–4 °C)` };
/** Spunding valve goes on with a few gravity points left: about the last day of primary (common practice). */
const SPUNDING_WINDOW_DAYS = 1;
/** Dry-hop contact when the recipe gives none (common practice: 2–4 days). */
const DEFAULT_DRY_HOP_DAYS = 3;

const isoDay = (label: string) =>
  z
    .string({ error: `${label} is required` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date such as 2026-12-05`)
    .refine((s) => !Number.isNaN(parseISO(s).getTime()) && format(parseISO(s), 'yyyy-MM-dd') === s, {
      message: `${label} is not a real date`,
    });

/** What the brewer chooses on the plan form (the dates are checked against `today` in `planBrew`). */
export const planOptionsSchema = z.object({
  pourOn: isoDay('Pour date'),
  brewOn: isoDay('Brew date').nullish(),
  fermentTempC: z
    .number({ error: 'Fermentation temperature must be a number' })
    .min(0, 'Fermentation temperature cannot be below 0 °C')
    .max(40, 'Fermentation temperature must be at most 40 °C')
    .nullish(),
  carbonation: z.enum(CARBONATION_METHODS, {
    error: `Carbonation must be one of: ${CARBONATION_METHODS.join(', ')}`,
  }),
  dryHopIn: z.enum(DRY_HOP_PLACES, { error: 'Dry hop must be in the fermenter or the keg' }).default('fermenter'),
  crash: z.boolean({ error: 'Cold crash must be yes or no' }).default(true),
});
export type PlanOptions = z.output<typeof planOptionsSchema>;

export type PlanEventKind = 'brew' | 'ferment' | 'dry_hop' | 'spunding' | 'crash' | 'package' | 'carbonate' | 'pour';

interface PlanEvent {
  kind: PlanEventKind;
  title: string;
  /** First day (ISO). */
  startOn: string;
  /** Last day, inclusive (ISO); equal to startOn for a one-day event. */
  endOn: string;
  detail: string;
  /** Where the length comes from. */
  source: string | null;
  caution: string | null;
}

interface PlanSuggestion {
  change: string;
  savesDays: number;
}

export interface BrewPlan {
  options: PlanOptions;
  brewOn: string;
  readyOn: string;
  pourOn: string;
  totalDays: number;
  fastestDays: number;
  /** Days too late (0 when the pour date is met). */
  shortfallDays: number;
  events: PlanEvent[];
  suggestions: PlanSuggestion[];
  /** Whether taking every suggestion together meets the date. */
  gapClosable: boolean;
  summary: string;
}

export class PlanDateError extends Error {
  constructor(
    readonly field: 'pourOn' | 'brewOn',
    message: string,
  ) {
    super(message);
  }
}

const CO2_CAUTION =
  'CO2 under pressure: use a relief valve, stay within the fermenter or keg maker’s rated pressure, and vent in a ventilated room.';
const HOT_CAUTION = 'Boiling wort and hot water scald: lift with help, keep children and pets away.';

function days(n: number): string {
  return `${n} day${n === 1 ? '' : 's'}`;
}

interface Timing {
  ferment: number;
  laterSteps: number;
  dryHopExtra: number;
  crash: number;
  carbonate: number;
}

function mainYeastKind(doc: RecipeDocument): YeastKind {
  return doc.yeasts[0]?.kind ?? 'ale';
}

function fermentTemp(doc: RecipeDocument, options: PlanOptions): number {
  if (options.fermentTempC !== null && options.fermentTempC !== undefined) return options.fermentTempC;
  const first = doc.fermentation.steps[0];
  if (first) return first.tempC;
  const y = doc.yeasts[0];
  if (y?.tempMinC !== undefined && y.tempMaxC !== undefined) return (y.tempMinC + y.tempMaxC) / 2;
  // Middle of each kind's usual range when the recipe gives none (common practice).
  return y?.kind === 'kveik' ? 32 : y?.kind === 'lager' ? 10 : 18;
}

function dryHopContactDays(doc: RecipeDocument): number {
  const dry = doc.hops.filter((h) => h.use === 'dry_hop');
  if (dry.length === 0) return 0;
  const longest = Math.max(...dry.map((h) => h.timeMin));
  return longest > 0 ? Math.max(1, Math.ceil(longest / 1440)) : DEFAULT_DRY_HOP_DAYS;
}

function timing(doc: RecipeDocument, options: PlanOptions, pick: 'typical' | 'min'): Timing {
  const ferment = fermentationDays(mainYeastKind(doc), fermentTemp(doc, options))[pick];
  // Steps after the first (a rest, a conditioning or lagering step) keep the recipe's own days.
  const laterSteps = doc.fermentation.steps.slice(1).reduce((sum, s) => sum + Math.ceil(s.days), 0);
  const contact = dryHopContactDays(doc);
  // In the fermenter the hops go in for the last days of fermentation (common practice); only
  // contact longer than what is left adds days. In the keg they sit while it carbonates.
  const dryHopExtra =
    contact === 0 ? 0 : options.dryHopIn === 'fermenter' ? Math.max(0, contact - Math.min(2, ferment)) : 0;
  const crash = options.crash ? CRASH_DAYS[pick] : 0;
  const carbonate = carbonationDays(options.carbonation)[pick];
  return { ferment, laterSteps, dryHopExtra, crash, carbonate };
}

function total(t: Timing): number {
  return t.ferment + t.laterSteps + t.dryHopExtra + t.crash + t.carbonate;
}

/**
 * Lay out the calendar of one recipe version from brew day to pour. Throws `PlanDateError`
 * for a pour date in the past or before the brew date (a brew date already past is a brew under way).
 */
export function planBrew(doc: RecipeDocument, input: PlanOptions, today: string): BrewPlan {
  const options = planOptionsSchema.parse(input);
  if (options.pourOn < today) throw new PlanDateError('pourOn', `Pour date ${options.pourOn} is in the past`);
  if (options.brewOn && options.pourOn < options.brewOn)
    throw new PlanDateError('pourOn', 'Pour date cannot be before the brew date');

  const t = timing(doc, options, 'typical');
  const totalDays = total(t);
  const fastestDays = total(timing(doc, options, 'min'));
  const brewOn =
    options.brewOn ?? (addIso(options.pourOn, -totalDays) < today ? today : addIso(options.pourOn, -totalDays));
  const readyOn = addIso(brewOn, totalDays);
  const shortfallDays = Math.max(0, differenceInCalendarDays(parseISO(readyOn), parseISO(options.pourOn)));

  const kind = mainYeastKind(doc);
  const tempC = fermentTemp(doc, options);
  const fermentRange = fermentationDays(kind, tempC);
  const carbRange = carbonationDays(options.carbonation);
  const events: PlanEvent[] = [];
  let cursor = brewOn;
  events.push({
    kind: 'brew',
    title: 'Brew day and pitch',
    startOn: brewOn,
    endOn: brewOn,
    detail: `Mash, boil, chill to ${round(tempC)} °C and pitch the ${doc.yeasts[0]?.name ?? 'yeast'}.`,
    source: null,
    caution: HOT_CAUTION,
  });
  const fermentEnd = addIso(cursor, t.ferment + t.dryHopExtra - 1);
  events.push({
    kind: 'ferment',
    title: `Ferment at ${round(tempC)} °C`,
    startOn: cursor,
    endOn: fermentEnd,
    detail: `${days(t.ferment)} for ${kind} yeast at ${round(tempC)} °C (${fermentRange.min}–${fermentRange.max} days); go on when the gravity holds steady for two days.`,
    source: fermentRange.source,
    caution: null,
  });
  const contact = dryHopContactDays(doc);
  if (contact > 0 && options.dryHopIn === 'fermenter') {
    const start = addIso(fermentEnd, -(contact - 1));
    events.push({
      kind: 'dry_hop',
      title: 'Dry hop in the fermenter',
      startOn: start < cursor ? cursor : start,
      endOn: fermentEnd,
      detail: `${days(contact)} of contact, added near the end of fermentation.`,
      source: COMMON,
      caution: null,
    });
  }
  if (options.carbonation === 'spunding') {
    const start = addIso(fermentEnd, -(SPUNDING_WINDOW_DAYS - 1));
    events.push({
      kind: 'spunding',
      title: 'Spund: fit the pressure valve',
      startOn: start,
      endOn: fermentEnd,
      detail:
        'Close the vessel with a spunding valve when a few gravity points remain, so the last of the CO2 stays in the beer.',
      source: COMMON,
      caution: CO2_CAUTION,
    });
  }
  cursor = addIso(fermentEnd, 1);
  doc.fermentation.steps.slice(1).forEach((step, i) => {
    const n = Math.ceil(step.days);
    events.push({
      kind: 'ferment',
      title: `Step ${i + 2} at ${round(step.tempC)} °C`,
      startOn: cursor,
      endOn: addIso(cursor, n - 1),
      detail: `${days(n)}, as the recipe gives.`,
      source: 'the recipe',
      caution: null,
    });
    cursor = addIso(cursor, n);
  });
  if (t.crash > 0) {
    events.push({
      kind: 'crash',
      title: 'Cold crash',
      startOn: cursor,
      endOn: addIso(cursor, t.crash - 1),
      detail: `${days(t.crash)} near 0–4 °C to drop yeast and hop matter.`,
      source: CRASH_DAYS.source,
      caution: options.carbonation === 'spunding' ? CO2_CAUTION : null,
    });
    cursor = addIso(cursor, t.crash);
  }
  events.push({
    kind: 'package',
    title: options.carbonation === 'bottle' ? 'Bottle' : 'Keg',
    startOn: cursor,
    endOn: cursor,
    detail:
      contact > 0 && options.dryHopIn === 'keg'
        ? `Package, with the dry hops in the keg (${days(contact)} of contact while it carbonates).`
        : 'Package.',
    source: null,
    caution: CO2_CAUTION,
  });
  if (t.carbonate > 0) {
    events.push({
      kind: 'carbonate',
      title: carbonationTitle(options.carbonation),
      startOn: cursor,
      endOn: addIso(cursor, t.carbonate - 1),
      detail: `${days(t.carbonate)} (${carbRange.min}–${carbRange.max}).`,
      source: carbRange.source,
      caution: options.carbonation === 'bottle' ? null : CO2_CAUTION,
    });
  }
  events.push({
    kind: 'pour',
    title: 'Ready to pour',
    startOn: readyOn,
    endOn: readyOn,
    detail:
      readyOn <= options.pourOn
        ? `Ready for ${options.pourOn}.`
        : `Ready ${days(shortfallDays)} after ${options.pourOn}.`,
    source: null,
    caution: 'Serve responsibly; say how strong the beer is.',
  });

  const suggestions = shortfallDays > 0 ? suggest(doc, options, totalDays) : [];
  const fixed = applyAll(doc, options);
  const gapClosable = shortfallDays === 0 || totalDays - total(timing(doc, fixed, 'typical')) >= shortfallDays;
  const summary =
    shortfallDays === 0
      ? `Brew on ${brewOn}: ready on ${readyOn}, ${days(differenceInCalendarDays(parseISO(options.pourOn), parseISO(readyOn)))} to spare.`
      : `${options.pourOn} cannot be met: brewing on ${brewOn}, the beer is ready on ${readyOn}, ${days(shortfallDays)} late.` +
        (gapClosable ? ' The changes below together close the gap.' : ' Even with every change below it is late.');
  return {
    options,
    brewOn,
    readyOn,
    pourOn: options.pourOn,
    totalDays,
    fastestDays,
    shortfallDays,
    events,
    suggestions,
    gapClosable,
    summary,
  };
}

function carbonationTitle(method: CarbonationMethod): string {
  switch (method) {
    case 'set_and_forget':
      return 'Carbonate at serving pressure';
    case 'burst':
      return 'Carbonate fast (high pressure, then serving)';
    case 'spunding':
      return 'Chill and top up the spunded beer';
    case 'bottle':
      return 'Bottle conditioning';
  }
}

function applyAll(doc: RecipeDocument, options: PlanOptions): PlanOptions {
  const out: PlanOptions = { ...options, carbonation: options.carbonation === 'bottle' ? 'bottle' : 'spunding' };
  out.dryHopIn = 'keg';
  out.crash = false;
  if (mainYeastKind(doc) === 'kveik') out.fermentTempC = 35;
  return out;
}

function suggest(doc: RecipeDocument, options: PlanOptions, totalDays: number): PlanSuggestion[] {
  const out: PlanSuggestion[] = [];
  const saves = (changed: PlanOptions) => totalDays - total(timing(doc, changed, 'typical'));
  const kind = mainYeastKind(doc);
  const tempC = fermentTemp(doc, options);
  if (kind === 'kveik' && tempC < 35) {
    const s = saves({ ...options, fermentTempC: 35 });
    if (s > 0)
      out.push({ change: `Ferment the kveik hotter, at 32–35 °C instead of ${round(tempC)} °C.`, savesDays: s });
  } else if (kind !== 'kveik') {
    const fast = fermentationDays('kveik', 32).typical;
    const s = fermentationDays(kind, tempC).typical - fast;
    if (s > 0)
      out.push({
        change: `Use a kveik yeast at 30–35 °C instead (a different recipe: make a new version).`,
        savesDays: s,
      });
  }
  if (options.carbonation === 'set_and_forget' || options.carbonation === 'burst') {
    const s = saves({ ...options, carbonation: 'spunding' });
    if (s > 0) out.push({ change: 'Spund near the end of fermentation instead of force-carbonating.', savesDays: s });
  }
  if (options.carbonation === 'set_and_forget') {
    const s = saves({ ...options, carbonation: 'burst' });
    if (s > 0)
      out.push({ change: 'Burst-carbonate at high pressure instead of waiting at serving pressure.', savesDays: s });
  }
  if (dryHopContactDays(doc) > 0 && options.dryHopIn === 'fermenter') {
    const s = saves({ ...options, dryHopIn: 'keg' });
    if (s > 0) out.push({ change: 'Dry hop in the keg, so contact overlaps carbonation.', savesDays: s });
  }
  if (options.crash) {
    out.push({ change: 'Skip the cold crash (the first pints will be hazier).', savesDays: CRASH_DAYS.typical });
  }
  return out;
}

function addIso(day: string, n: number): string {
  return format(addDays(parseISO(day), n), 'yyyy-MM-dd');
}

function round(n: number): number {
  return Math.round(n * 10) / 10;
}
