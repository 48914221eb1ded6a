import { ebcToSrm, lovibondToSrm, srmToLovibond } from '@/lib/brewing/colour';
import { G_PER_OZ, KG_PER_LB, L_PER_US_GALLON, fahrenheitToCelsius } from '@/lib/brewing/constants';
import { InterchangeError } from './types';

/**
 * Unit conversions for the two open formats. Each reader names the element it
 * is converting, so an unknown unit is refused with that element in the message.
 */

/** Extract of sucrose: 46.214 gravity points per pound per US gallon (common practice). */
const SUCROSE_PPG = 46.214;

/** BeerXML and BeerJSON give a fermentable's yield as % of sucrose's extract; we keep points per pound per gallon. */
export function yieldPctToPpg(yieldPct: number): number {
  return tidy((yieldPct * SUCROSE_PPG) / 100);
}

export function ppgToYieldPct(ppg: number): number {
  return fileNumber((ppg / SUCROSE_PPG) * 100);
}

/** A potential given as a specific gravity (1.037 for 1 lb in 1 US gal) is already in points per pound per gallon. */
export function potentialSgToPpg(sg: number): number {
  return tidy((sg - 1) * 1000);
}

export function ppgToPotentialSg(ppg: number): number {
  return fileNumber(1 + ppg / 1000);
}

const MASS_TO_KG: Record<string, number> = { mg: 1e-6, g: 1e-3, kg: 1, lb: KG_PER_LB, oz: G_PER_OZ / 1000 };

/** US and imperial volumes from the BeerJSON unit list (US customary: 1 gal = 231 in³; imperial: 4.54609 L, 1985 Weights and Measures Act). */
const IMPERIAL_GALLON_L = 4.54609;
const VOLUME_TO_L: Record<string, number> = {
  ml: 1e-3,
  l: 1,
  tsp: L_PER_US_GALLON / 768,
  tbsp: L_PER_US_GALLON / 256,
  floz: L_PER_US_GALLON / 128,
  cup: L_PER_US_GALLON / 16,
  pt: L_PER_US_GALLON / 8,
  qt: L_PER_US_GALLON / 4,
  gal: L_PER_US_GALLON,
  bbl: L_PER_US_GALLON * 31,
  ifloz: IMPERIAL_GALLON_L / 160,
  ipt: IMPERIAL_GALLON_L / 8,
  iqt: IMPERIAL_GALLON_L / 4,
  igal: IMPERIAL_GALLON_L,
  ibbl: IMPERIAL_GALLON_L * 36,
};

const TIME_TO_MIN: Record<string, number> = { sec: 1 / 60, min: 1, hr: 60, day: 1440, week: 10080 };

export interface Measured {
  value: number;
  unit: string;
}

function pick(table: Record<string, number>, m: Measured, what: string, element: string): number {
  const factor = Object.hasOwn(table, m.unit) ? table[m.unit] : undefined;
  if (factor === undefined) {
    throw new InterchangeError(
      `unknown ${what} unit "${m.unit}" (expected one of: ${Object.keys(table).join(', ')})`,
      element,
    );
  }
  return tidy(m.value * factor);
}

export const isMassUnit = (unit: string): boolean => Object.hasOwn(MASS_TO_KG, unit);

export const toKg = (m: Measured, element: string): number => pick(MASS_TO_KG, m, 'mass', element);
export const toLitres = (m: Measured, element: string): number => pick(VOLUME_TO_L, m, 'volume', element);
export const toMinutes = (m: Measured, element: string): number => pick(TIME_TO_MIN, m, 'time', element);

export function toCelsius(m: Measured, element: string): number {
  if (m.unit === 'C') return m.value;
  if (m.unit === 'F') return tidy(fahrenheitToCelsius(m.value));
  throw new InterchangeError(`unknown temperature unit "${m.unit}" (expected C or F)`, element);
}

/** A malt colour as degrees Lovibond (SRM and EBC through the usual conversions; see lib/brewing/colour.ts). */
export function toLovibond(m: Measured, element: string): number {
  if (m.unit === 'Lovi') return m.value;
  if (m.unit === 'SRM') return srmToLovibondClamped(m.value);
  if (m.unit === 'EBC') return srmToLovibondClamped(ebcToSrm(m.value));
  throw new InterchangeError(`unknown colour unit "${m.unit}" (expected Lovi, SRM or EBC)`, element);
}

export function toPercent(m: Measured, element: string): number {
  if (m.unit === '%') return m.value;
  throw new InterchangeError(`unknown percentage unit "${m.unit}" (expected %)`, element);
}

/** Ion concentrations: mg/L and ppm alike in dilute water (common practice); ppb is a thousandth of that. */
export function toMgPerL(m: Measured, element: string): number {
  if (m.unit === 'ppm' || m.unit === 'mg/l') return m.value;
  if (m.unit === 'ppb') return m.value / 1000;
  throw new InterchangeError(`unknown concentration unit "${m.unit}" (expected ppm, mg/l or ppb)`, element);
}

/** Liquid extract colour is written in SRM by BeerXML; we keep malt colour in °L. */
export function srmToLovibondClamped(srm: number): number {
  return tidy(Math.max(srmToLovibond(srm), 0));
}

export function lovibondToSrmClamped(lovibond: number): number {
  return fileNumber(Math.max(lovibondToSrm(lovibond), 0));
}

/** Rounds away the binary noise a unit conversion leaves (0.1 + 0.2 and friends). */
export function round(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}

/** A number for a message: at most `decimals` decimals, no trailing zeros. */
export function plain(value: number, decimals = 6): string {
  return String(round(value, decimals));
}

/**
 * Significant digits: files are written with 12, far finer than any brewing measurement; values
 * read are kept to 10, which clears the binary noise a conversion (or a product of two written
 * values, such as an evaporation rate times the boil size) leaves in the last digits.
 */
const WRITTEN_DIGITS = 12;
const READ_DIGITS = 10;

function significant(value: number, digits: number): number {
  if (value === 0 || !Number.isFinite(value)) return value === 0 ? 0 : value;
  return Number(value.toPrecision(digits));
}

/** A value read or converted from a file, its binary noise removed. */
export function tidy(value: number): number {
  return significant(value, READ_DIGITS);
}

/** A value as it is written to a file. */
export function fileNumber(value: number): number {
  return significant(value, WRITTEN_DIGITS);
}

/** A number as file text: every significant digit kept, never in exponent notation (1e-7). */
export function decimalText(value: number): string {
  const v = fileNumber(value);
  // Past a hundred decimals a value is nothing any brewery measures: it is written as 0.
  if (Math.abs(v) < 1e-90) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const decimals = Math.min(Math.max(WRITTEN_DIGITS - 1 - magnitude, 0), 100);
  const text = v.toFixed(decimals);
  return text.includes('.') ? text.replace(/0+$/, '').replace(/\.$/, '') : text;
}
