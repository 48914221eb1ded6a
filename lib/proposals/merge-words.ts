import type { UnitSystem } from '@/lib/brewing/units';
import { HOP_USE_LABEL } from '@/lib/format';
import {
  SECTION_FIELDS,
  describeFields,
  saltLine,
  saltName,
  showAmount,
  showField,
  trimNumber,
  type FieldSpec,
  type Scalar,
} from '@/lib/recipes/fields';
import type { MergeConflict } from './merge';

/**
 * Merge paths and conflicting values in a brewer's words, with the labels and unit formatting of
 * lib/recipes/fields.ts: `hops[cascade|boil].amountG` reads "Hop Cascade (boil) · Amount", and its
 * values "1 oz" or "28 g" as the member's units say. No document key is ever shown.
 */

type Row = Record<string, unknown>;

interface PathParts {
  section: string;
  key: string | undefined;
  field: string | undefined;
}

const SECTIONS: Record<string, { word: string; specs: readonly FieldSpec[] }> = {
  batch: { word: 'Batch', specs: SECTION_FIELDS.batch },
  fermentables: { word: 'Fermentable', specs: SECTION_FIELDS.fermentables },
  hops: { word: 'Hop', specs: SECTION_FIELDS.hops },
  yeasts: { word: 'Yeast', specs: SECTION_FIELDS.yeasts },
  'mash.steps': { word: 'Mash step', specs: SECTION_FIELDS['mash.steps'] },
  'fermentation.steps': { word: 'Fermentation step', specs: SECTION_FIELDS['fermentation.steps'] },
  'water.salts': { word: 'Water salt', specs: SECTION_FIELDS['water.salts'] },
  'water.source': { word: 'Source water', specs: SECTION_FIELDS.water },
  'water.target': { word: 'Target water', specs: SECTION_FIELDS.water },
  water: { word: 'Water', specs: SECTION_FIELDS.water },
  carbonation: { word: 'Carbonation', specs: SECTION_FIELDS.carbonation },
  notes: { word: 'Notes', specs: [] },
  style: { word: 'Style', specs: [] },
};

/** Fields no table above lists: named in words all the same. */
const OTHER_FIELDS: Record<string, string> = {
  name: 'Name',
  acid: 'Acid',
  target: 'Target water',
  spunding: 'Spunding',
  salt: 'Salt',
  source: 'Source water',
  salts: 'Salts',
};

function parsePath(path: string): PathParts | null {
  const m = /^([a-z.]+?)(?:\[(.+)\])?(?:\.(\w+))?$/i.exec(path);
  return m ? { section: m[1], key: m[2], field: m[3] } : null;
}

const sample = (c: Pick<MergeConflict, 'base' | 'ours' | 'theirs'> | undefined): Row | undefined => {
  const v = c && [c.ours, c.theirs, c.base].find((x) => x && typeof x === 'object');
  return v as Row | undefined;
};

function fieldLabel(section: string, field: string): string {
  const spec = SECTIONS[section]?.specs.find((s) => s.key === field);
  return spec?.label ?? OTHER_FIELDS[field] ?? 'Another setting';
}

/** The item a list path names: the ingredient's own spelling when a side has it. */
function itemWords(section: string, key: string, item: Row | undefined): string {
  if (/^\d+$/.test(key)) {
    const name = typeof item?.name === 'string' && item.name ? ` (${item.name})` : '';
    return `${Number(key) + 1}${name}`;
  }
  const [main, nth] = key.split('~');
  const [keyName, use] = main.split('|');
  // The matching key is lower-cased; an item's own spelling is used when a side has the item.
  const name =
    section === 'water.salts'
      ? saltName(keyName)
      : typeof item?.name === 'string'
        ? item.name
        : keyName.charAt(0).toUpperCase() + keyName.slice(1);
  const useWords = use ? ` (${HOP_USE_LABEL[use as keyof typeof HOP_USE_LABEL] ?? use.replaceAll('_', ' ')})` : '';
  return `${name}${useWords}${nth ? `, the ${nth}. one` : ''}`;
}

/**
 * A path as a brewer reads it: `hops[cascade|boil].amountG` → "Hop Cascade (boil) · Amount". With
 * the conflict's values the item keeps its own spelling ("Cascade", not the matching key "cascade").
 */
export function describeMergePath(path: string, values?: Pick<MergeConflict, 'base' | 'ours' | 'theirs'>): string {
  const parts = parsePath(path);
  if (!parts) return 'A recipe field';
  const { section, key, field } = parts;
  const word = SECTIONS[section]?.word ?? 'Recipe';
  if (section === 'batch' && field && key === undefined) return fieldLabel(section, field);
  const item = key === undefined ? word : `${word} ${itemWords(section, key, sample(values))}`;
  return field ? `${item} · ${fieldLabel(section, field)}` : item;
}

function showWhole(section: string, value: Row, units: UnitSystem): string {
  if (section === 'style') return `${String(value.code ?? '')} ${String(value.name ?? '')}`.trim();
  if (section === 'water') {
    const source = (value.source ?? {}) as Row;
    const salts = Array.isArray(value.salts)
      ? (value.salts as Row[]).map((s) => saltLine(String(s.salt), Number(s.grams)))
      : [];
    return [
      describeFields(
        SECTION_FIELDS.water,
        { volumeL: value.volumeL as Scalar, ...(source as Record<string, Scalar>) },
        units,
      ),
      ...salts,
    ]
      .filter(Boolean)
      .join(' · ');
  }
  if (section === 'water.salts') {
    return saltLine(String(value.salt), Number(value.grams));
  }
  const specs = SECTIONS[section]?.specs ?? [];
  const named = typeof value.name === 'string' && section !== 'mash.steps' ? `${value.name}: ` : '';
  return `${named}${describeFields(specs, value as Record<string, Scalar>, units, ['name'])}`;
}

function showOther(field: string, value: unknown, units: UnitSystem): string {
  if (!value || typeof value !== 'object') return String(value);
  const row = value as Row;
  if (field === 'spunding' && typeof row.pressureKPa === 'number' && typeof row.tempC === 'number')
    return `${showAmount(row.pressureKPa, 'pressure', units)} at ${showAmount(row.tempC, 'temperature', units)}`;
  if (field === 'acid' && typeof row.mL === 'number')
    return `${String(row.kind).startsWith('lactic') ? 'Lactic acid 88%' : 'Phosphoric acid 10%'}, ${trimNumber(row.mL, 1)} mL`;
  if (field === 'target') return describeFields(SECTION_FIELDS.water, row as Record<string, Scalar>, units);
  return 'set';
}

/** One side's value of a conflict in the member's units; `undefined` is an absent item or field. */
function showConflictValue(path: string, value: unknown, hopUse: string | undefined, units: UnitSystem): string {
  if (value === undefined || value === null) return 'not in the recipe';
  const parts = parsePath(path);
  if (!parts) return typeof value === 'object' ? 'set' : String(value);
  const { section, field } = parts;
  if (section === 'notes') {
    const text = String(value).trim();
    return text ? (text.length > 300 ? `${text.slice(0, 300)}…` : text) : '(empty)';
  }
  if (!field) return typeof value === 'object' ? showWhole(section, value as Row, units) : String(value);
  const spec = SECTIONS[section]?.specs.find((s) => s.key === field);
  if (spec && typeof value !== 'object') return showField(spec, { [field]: value as Scalar, use: hopUse }, units);
  return showOther(field, value, units);
}

export interface ConflictView {
  /** The merge path the owner's pick is sent back under (never shown). */
  path: string;
  label: string;
  base: string;
  ours: string;
  theirs: string;
}

/** A conflict as the proposal page and the accept form show it. */
export function describeConflict(conflict: MergeConflict, units: UnitSystem): ConflictView {
  const use = /^hops\[[^\]|]+\|([a-z_]+)/.exec(conflict.path)?.[1];
  const show = (v: unknown) => showConflictValue(conflict.path, v, use, units);
  return {
    path: conflict.path,
    label: describeMergePath(conflict.path, conflict),
    base: show(conflict.base),
    ours: show(conflict.ours),
    theirs: show(conflict.theirs),
  };
}

/**
 * A field taken from the proposal without asking, e.g. "Mash step 1 · Temperature 66 °C → 68 °C",
 * "Yeast Kveik (added)", "Yeast Clean ale yeast (removed)".
 */
export function describeTaken(taken: Omit<MergeConflict, 'ours'>, units: UnitSystem): string {
  const label = describeMergePath(taken.path, { ...taken, ours: undefined });
  if (taken.base === undefined) return `${label} (added)`;
  if (taken.theirs === undefined) return `${label} (removed)`;
  if (typeof taken.base === 'object' || typeof taken.theirs === 'object' || taken.path === 'notes') return label;
  const view = describeConflict({ ...taken, ours: taken.base }, units);
  return `${label} ${view.base} → ${view.theirs}`;
}
