import {
  fromDisplayUnits,
  litresPerKgToQuartsPerLb,
  quartsPerLbToLitresPerKg,
  toDisplayUnits,
  type UnitSystem,
} from '@/lib/brewing/units';

/** How one editor field shows its stored value and reads a typed one back. */
export interface FieldUnit {
  /** Shown beside the input and read with its label, e.g. "kg" or "°F". */
  label: string;
  toDisplay: (stored: number) => number;
  fromDisplay: (typed: number) => number;
  /** Most decimals shown for a stored value; typed text is kept as typed. */
  decimals: number;
}

export type ConvertedQuantity =
  'mass' | 'hopMass' | 'volume' | 'volumePerHour' | 'litresPerKg' | 'temperature' | 'pressure';

const MINUTES_PER_DAY = 24 * 60;

const same = (value: number) => value;

/** A field stored and shown in the same unit. */
export function plainUnit(label: string, decimals: number): FieldUnit {
  return { label, toDisplay: same, fromDisplay: same, decimals };
}

/** Dry-hop contact is stored in minutes like every hop time but reads better in days. */
export const DAYS_FROM_MINUTES: FieldUnit = {
  label: 'days',
  toDisplay: (minutes) => minutes / MINUTES_PER_DAY,
  fromDisplay: (days) => days * MINUTES_PER_DAY,
  decimals: 2,
};

export function fieldUnit(quantity: ConvertedQuantity, units: UnitSystem): FieldUnit {
  const metric = units === 'metric';
  switch (quantity) {
    case 'mass':
      return converted(metric ? 'kg' : 'lb', 'mass', units, 3);
    case 'hopMass':
      return converted(metric ? 'g' : 'oz', 'hopMass', units, metric ? 1 : 2);
    case 'volume':
      return converted(metric ? 'L' : 'gal', 'volume', units, 2);
    case 'volumePerHour':
      return converted(metric ? 'L per hour' : 'gal per hour', 'volume', units, 2);
    case 'temperature':
      return converted(metric ? '°C' : '°F', 'temperature', units, 1);
    case 'pressure':
      return converted(metric ? 'kPa' : 'psi', 'pressure', units, metric ? 0 : 1);
    case 'litresPerKg':
      return metric
        ? plainUnit('L per kg', 2)
        : {
            label: 'qt per lb',
            toDisplay: litresPerKgToQuartsPerLb,
            fromDisplay: quartsPerLbToLitresPerKg,
            decimals: 2,
          };
  }
}

function converted(
  label: string,
  quantity: 'mass' | 'hopMass' | 'volume' | 'temperature' | 'pressure',
  units: UnitSystem,
  decimals: number,
): FieldUnit {
  return {
    label,
    toDisplay: (stored) => toDisplayUnits(stored, quantity, units),
    fromDisplay: (typed) => fromDisplayUnits(typed, quantity, units),
    decimals,
  };
}

/** A stored value as the text an input shows: at most `decimals` places, no trailing zeros. */
export function formatForInput(stored: number | null | undefined, unit: FieldUnit): string {
  if (stored === undefined || stored === null || !Number.isFinite(stored)) return '';
  return String(Number(unit.toDisplay(stored).toFixed(unit.decimals)));
}

/**
 * Typed text as a stored value: null when empty (the form holds it so; the
 * schema then says the field is required, or leaves an optional one out), NaN
 * when it is not a number (the schema says so). A decimal comma is read as a point.
 */
export function parseTyped(text: string, unit: FieldUnit): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(trimmed)) return Number.NaN;
  return unit.fromDisplay(Number(trimmed));
}
