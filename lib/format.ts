import type { IonName } from '@/lib/brewing/schema';
import { DISPLAY_UNITS, toDisplayUnits, type Quantity, type UnitSystem } from '@/lib/brewing/units';

const UNIT_LABEL: Record<string, string> = {
  kg: 'kg',
  g: 'g',
  l: 'L',
  lb: 'lb',
  oz: 'oz',
  gal: 'gal',
  C: '°C',
  F: '°F',
  kPa: 'kPa',
  psi: 'psi',
};

/** A stored metric amount in the reader's units, with its unit label. */
export function formatAmount(value: number, quantity: Quantity, units: UnitSystem, decimals = 2): string {
  const shown = toDisplayUnits(value, quantity, units);
  const unit = DISPLAY_UNITS[units][quantity];
  const digits = quantity === 'temperature' ? 0 : decimals;
  return `${trim(shown.toFixed(digits))} ${UNIT_LABEL[unit] ?? unit}`;
}

function trim(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

export const formatGravity = (sg: number): string => sg.toFixed(3);

/** The one-line summary of a recipe's numbers, used in lists, titles and link previews. */
export function statsLine(s: { og: number; fg: number; abv: number; ibu: number }): string {
  return `OG ${formatGravity(s.og)} · FG ${formatGravity(s.fg)} · ${s.abv.toFixed(1)}% ABV · ${Math.round(s.ibu)} IBU`;
}

export const HOP_USE_LABEL = {
  mash: 'mash',
  first_wort: 'first wort',
  boil: 'boil',
  whirlpool: 'whirlpool',
  dry_hop: 'dry hop',
} as const;
/** The six ions of a water report, in brewers' words. */
export const ION_LABEL: Record<IonName, string> = {
  calcium: 'Calcium',
  magnesium: 'Magnesium',
  sodium: 'Sodium',
  chloride: 'Chloride',
  sulfate: 'Sulfate',
  bicarbonate: 'Bicarbonate',
};

export const SALT_LABEL = {
  gypsum: 'Gypsum',
  epsom: 'Epsom salt',
  table_salt: 'Table salt',
  calcium_chloride: 'Calcium chloride',
  baking_soda: 'Baking soda',
} as const;
