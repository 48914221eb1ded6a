import { ION_NAMES, type IonName, type RecipeDocument } from '@/lib/brewing/schema';
import { toDisplayUnits, type Quantity, type UnitSystem } from '@/lib/brewing/units';
import { HOP_USE_LABEL, ION_LABEL, SALT_LABEL, formatAmount } from '@/lib/format';

/**
 * The one set of field labels and value formatters for every place that shows a difference between
 * two recipe documents (compare, proposals, the editor's conflict panel, the history timeline, the
 * merge table). Amounts follow the recipe page's formatting (`formatAmount`) in the reader's units;
 * no document key is ever shown.
 */

export type Scalar = string | number | boolean | null | undefined;

export interface FieldSpec {
  /** The document key (kept in JSON for programs; never shown). */
  key: string;
  label: string;
  show: (value: Scalar, units: UnitSystem) => string;
  /** A signed difference ("+0.3 kg"), for numbers whose change reads better as an amount. */
  delta?: (before: number, after: number, units: UnitSystem) => string;
}

const MINUTES_PER_DAY = 24 * 60;

export function trimNumber(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** A minus sign, not a hyphen, so "−0.001" reads as a number going down. */
export function signed(text: string, value: number): string {
  return value > 0 ? `+${text}` : value < 0 ? `−${text.replace(/^-/, '')}` : text;
}

function plain(unit: string, decimals: number): Pick<FieldSpec, 'show' | 'delta'> {
  const join = unit === '%' ? '' : ' ';
  return {
    show: (v) => (typeof v === 'number' ? `${trimNumber(v, decimals)}${unit ? join + unit : ''}` : none(v)),
    delta: (b, a) => signed(`${trimNumber(Math.abs(a - b), decimals)}${unit ? join + unit : ''}`, a - b),
  };
}

function none(value: Scalar): string {
  return value === null || value === undefined || value === '' ? 'none' : String(value);
}

/** Decimals per quantity, as the recipe page shows them. */
function decimalsOf(quantity: Quantity, units: UnitSystem): number | undefined {
  if (quantity === 'hopMass') return units === 'us' ? 2 : 0;
  if (quantity === 'volume') return 1;
  return undefined;
}

export function showAmount(value: number, quantity: Quantity, units: UnitSystem): string {
  return formatAmount(value, quantity, units, decimalsOf(quantity, units));
}

/** A signed difference of two stored amounts in the reader's units ("+0.3 kg", "−1.8 °F"). */
function amountDelta(before: number, after: number, quantity: Quantity, units: UnitSystem): string {
  if (quantity === 'temperature') return signed(temperatureStep(Math.abs(after - before), units), after - before);
  const shownDiff = toDisplayUnits(after, quantity, units) - toDisplayUnits(before, quantity, units);
  const unitText = formatAmount(0, quantity, units).replace(/^0 /, '');
  const decimals = decimalsOf(quantity, units) ?? 2;
  const digits = Math.max(decimals, Math.abs(shownDiff) < 0.1 ? 2 : decimals);
  return signed(`${trimNumber(Math.abs(shownDiff), digits)} ${unitText}`, shownDiff);
}

/** A temperature difference (not a temperature): 2 °C is 3.6 °F. */
export function temperatureStep(diffC: number, units: UnitSystem): string {
  return units === 'us' ? `${trimNumber(diffC * 1.8, 1)} °F` : `${trimNumber(diffC, 1)} °C`;
}

function amount(quantity: Quantity): Pick<FieldSpec, 'show' | 'delta'> {
  return {
    show: (v, units) => (typeof v === 'number' ? showAmount(v, quantity, units) : none(v)),
    delta: (b, a, units) => amountDelta(b, a, quantity, units),
  };
}

function rate(quantity: 'volume' | 'litresPerKg'): Pick<FieldSpec, 'show' | 'delta'> {
  const show = (v: number, units: UnitSystem) => {
    if (quantity === 'volume')
      return units === 'us' ? `${trimNumber(toDisplayUnits(v, 'volume', 'us'), 2)} gal/h` : `${trimNumber(v, 1)} L/h`;
    // litres per kg ↔ US quarts per lb
    return units === 'us' ? `${trimNumber(v * 0.4793, 2)} qt/lb` : `${trimNumber(v, 2)} L/kg`;
  };
  return {
    show: (v, units) => (typeof v === 'number' ? show(v, units) : none(v)),
    delta: (b, a, units) => signed(show(Math.abs(a - b), units), a - b),
  };
}

const text: Pick<FieldSpec, 'show'> = { show: (v) => none(v) };
const minutes = plain('min', 0);
const percent = plain('%', 1);

/** Hop time: days for a dry hop, minutes otherwise. */
export function hopTime(timeMin: number, use: string): string {
  return use === 'dry_hop' ? `${trimNumber(timeMin / MINUTES_PER_DAY, 1)} days` : `${trimNumber(timeMin, 0)} min`;
}

export const BATCH_FIELDS: FieldSpec[] = [
  { key: 'volumeL', label: 'Batch volume', ...amount('volume') },
  { key: 'boilTimeMin', label: 'Boil time', ...minutes },
  { key: 'efficiencyPct', label: 'Brewhouse efficiency', ...percent },
  { key: 'boilOffLPerHour', label: 'Boil-off', ...rate('volume') },
  { key: 'trubLossL', label: 'Kettle trub loss', ...amount('volume') },
  { key: 'grainAbsorptionLPerKg', label: 'Grain absorption', ...rate('litresPerKg') },
  { key: 'mashWaterLPerKg', label: 'Mash thickness', ...rate('litresPerKg') },
];

export const FERMENTABLE_FIELDS: FieldSpec[] = [
  { key: 'amountKg', label: 'Amount', ...amount('mass') },
  { key: 'colorLovibond', label: 'Colour', ...plain('°L', 1) },
  { key: 'potentialPpg', label: 'Potential', ...plain('points per lb per gal', 1) },
  { key: 'kind', label: 'Kind', ...text },
];

export const HOP_FIELDS: FieldSpec[] = [
  { key: 'amountG', label: 'Amount', ...amount('hopMass') },
  { key: 'alphaPct', label: 'Alpha acid', ...percent },
  { key: 'use', label: 'Use', show: (v) => HOP_USE_LABEL[v as keyof typeof HOP_USE_LABEL] ?? none(v) },
  { key: 'timeMin', label: 'Time', ...minutes },
  { key: 'form', label: 'Form', ...text },
  { key: 'tempC', label: 'Hop stand temperature', ...amount('temperature') },
];

export const YEAST_FIELDS: FieldSpec[] = [
  { key: 'kind', label: 'Kind', ...text },
  { key: 'attenuationPct', label: 'Attenuation', ...percent },
  { key: 'tempMinC', label: 'Lowest temperature', ...amount('temperature') },
  { key: 'tempMaxC', label: 'Highest temperature', ...amount('temperature') },
];

export const MASH_STEP_FIELDS: FieldSpec[] = [
  { key: 'name', label: 'Name', ...text },
  { key: 'tempC', label: 'Temperature', ...amount('temperature') },
  { key: 'timeMin', label: 'Time', ...minutes },
];

export const FERMENTATION_STEP_FIELDS: FieldSpec[] = [
  { key: 'tempC', label: 'Temperature', ...amount('temperature') },
  { key: 'days', label: 'Days', ...plain('days', 1) },
];

const ion = (key: IonName): FieldSpec => ({
  key,
  label: ION_LABEL[key],
  show: (v, units) => (typeof v === 'number' ? `${trimNumber(v, 0)} ${units === 'us' ? 'ppm' : 'mg/L'}` : none(v)),
  delta: (b, a, units) => signed(`${trimNumber(Math.abs(a - b), 0)} ${units === 'us' ? 'ppm' : 'mg/L'}`, a - b),
});

export const WATER_FIELDS: FieldSpec[] = [
  { key: 'volumeL', label: 'Water volume', ...amount('volume') },
  ...ION_NAMES.map(ion),
];

export const SALT_FIELDS: FieldSpec[] = [{ key: 'grams', label: 'Amount', ...plain('g', 1) }];

export const CARBONATION_FIELDS: FieldSpec[] = [
  { key: 'volumesCO2', label: 'Carbonation', ...plain('volumes CO2', 2) },
  { key: 'servingTempC', label: 'Serving temperature', ...amount('temperature') },
];

export const saltName = (salt: string): string => SALT_LABEL[salt as keyof typeof SALT_LABEL] ?? salt;

/** A salt addition in words: "Gypsum 5 g". */
export function saltLine(salt: string, grams: number): string {
  return `${saltName(salt)} ${trimNumber(grams, 1)} g`;
}

/** Each part of the recipe document with field specs, by its path in the document. */
export const SECTION_FIELDS = {
  batch: BATCH_FIELDS,
  fermentables: FERMENTABLE_FIELDS,
  hops: HOP_FIELDS,
  yeasts: YEAST_FIELDS,
  'mash.steps': MASH_STEP_FIELDS,
  'fermentation.steps': FERMENTATION_STEP_FIELDS,
  'water.salts': SALT_FIELDS,
  water: WATER_FIELDS,
  carbonation: CARBONATION_FIELDS,
} as const satisfies Record<string, readonly FieldSpec[]>;

/** "Cascade (boil, 10 min)", "Cascade (dry hop, 3 days)". */
export function hopLabel(hop: RecipeDocument['hops'][number]): string {
  return `${hop.name} (${HOP_USE_LABEL[hop.use]}, ${hopTime(hop.timeMin, hop.use)})`;
}

/** Every field of an item in words, e.g. "Amount 4.2 kg · Colour 3 °L · Kind grain". */
export function describeFields(
  specs: readonly FieldSpec[],
  values: Record<string, Scalar>,
  units: UnitSystem,
  skip: readonly string[] = [],
): string {
  return specs
    .filter((s) => !skip.includes(s.key) && values[s.key] !== undefined && values[s.key] !== null)
    .map((s) => `${s.label} ${showField(s, values, units)}`)
    .join(' · ');
}

/** A field's value in words; a hop's time reads in days for a dry hop. */
export function showField(spec: FieldSpec, values: Record<string, Scalar>, units: UnitSystem): string {
  if (spec.key === 'timeMin' && typeof values.use === 'string' && typeof values.timeMin === 'number')
    return hopTime(values.timeMin, values.use);
  return spec.show(values[spec.key], units);
}

export const SECTION_TITLE = {
  settings: 'Batch and style',
  fermentables: 'Fermentables',
  hops: 'Hops',
  yeasts: 'Yeast',
  mash: 'Mash',
  fermentation: 'Fermentation',
  water: 'Water',
  salts: 'Water salts',
  carbonation: 'Carbonation',
} as const;

/** The numbers compare explains, with their labels and how they are shown. */
export interface StatSpec {
  key: string;
  label: string;
  show: (value: number, units: UnitSystem) => string;
  /** The signed change, e.g. "+0.004", "−6 IBU". */
  delta: (delta: number, units: UnitSystem) => string;
  /** Smallest change worth telling (half of the last digit shown). */
  epsilon: (units: UnitSystem) => number;
}

function statSpec(key: string, label: string, decimals: number, suffix = ''): StatSpec {
  return {
    key,
    label,
    show: (v) => `${v.toFixed(decimals)}${suffix}`,
    delta: (d) => signed(`${Math.abs(d).toFixed(decimals)}${suffix}`, Number(d.toFixed(decimals)) === 0 ? 0 : d),
    epsilon: () => 0.5 * 10 ** -decimals,
  };
}

export const STAT_SPECS: StatSpec[] = [
  statSpec('og', 'OG', 3),
  statSpec('fg', 'FG', 3),
  statSpec('abv', 'ABV', 1, '%'),
  statSpec('ibu', 'IBU', 0),
  statSpec('srm', 'Colour (SRM)', 1),
  statSpec('ebc', 'Colour (EBC)', 1),
  statSpec('buGu', 'Bitterness ratio (BU:GU)', 2),
  statSpec('attenuationPct', 'Attenuation', 1, '%'),
  statSpec('caloriesPer355mL', 'Calories per 355 mL', 0),
  statSpec('sulfateToChloride', 'Sulfate to chloride', 2),
  {
    ...statSpec('residualAlkalinity', 'Residual alkalinity', 0),
    show: (v, units) => `${v.toFixed(0)} ${units === 'us' ? 'ppm' : 'mg/L'} as CaCO3`,
  },
  {
    key: 'kegPressureKPa',
    label: 'Keg pressure',
    show: (v, units) =>
      units === 'us' ? `${toDisplayUnits(v, 'pressure', 'us').toFixed(1)} psi` : `${v.toFixed(0)} kPa`,
    delta: (d, units) => {
      const shown = units === 'us' ? toDisplayUnits(d, 'pressure', 'us') : d;
      const digits = units === 'us' ? 1 : 0;
      const zero = Number(shown.toFixed(digits)) === 0;
      return signed(`${Math.abs(shown).toFixed(digits)} ${units === 'us' ? 'psi' : 'kPa'}`, zero ? 0 : shown);
    },
    epsilon: (units) => (units === 'us' ? 0.05 / toDisplayUnits(1, 'pressure', 'us') : 0.5),
  },
];

/** "2 versions", "1 brew day": a count with its noun in the right number. */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}
