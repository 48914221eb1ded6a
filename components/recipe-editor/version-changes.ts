import { ION_NAMES, recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { fieldUnit, formatForInput, plainUnit, type FieldUnit } from './field-units';

/**
 * What one version of a recipe changed against another, field by field, in
 * words a brewer can scan: used when someone saved a newer version while a
 * member was still editing an older one.
 */

export interface ValueChange {
  label: string;
  from: string;
  to: string;
}

export interface ItemChange {
  change: 'added' | 'removed' | 'changed';
  name: string;
  /** For a changed item: the fields that differ. */
  fields: ValueChange[];
}

export interface VersionChanges {
  title: ValueChange | null;
  style: ValueChange | null;
  fermentables: ItemChange[];
  hops: ItemChange[];
  yeasts: ItemChange[];
  batch: ValueChange[];
  mash: ValueChange[];
  fermentation: ValueChange[];
  waterChanged: boolean;
  carbonationChanged: boolean;
  notesChanged: boolean;
}

type Doc = RecipeDocumentInput;

interface NumberFieldSpec<T> {
  label: string;
  read: (item: T) => number | undefined;
  unit: FieldUnit;
}

const HOP_USE_WORDS: Record<Doc['hops'][number]['use'], string> = {
  mash: 'mash',
  first_wort: 'first wort',
  boil: 'boil',
  whirlpool: 'whirlpool',
  dry_hop: 'dry hop',
};

function showNumber(value: number | undefined, unit: FieldUnit): string {
  return value === undefined ? 'not set' : `${formatForInput(value, unit)} ${unit.label}`.trim();
}

function numberChanges<T>(before: T, after: T, specs: NumberFieldSpec<T>[], prefix = ''): ValueChange[] {
  const changes: ValueChange[] = [];
  for (const spec of specs) {
    const from = showNumber(spec.read(before), spec.unit);
    const to = showNumber(spec.read(after), spec.unit);
    if (from !== to) changes.push({ label: `${prefix}${spec.label}`, from, to });
  }
  return changes;
}

function textChange(label: string, from: string | undefined, to: string | undefined): ValueChange | null {
  const before = from?.trim() ?? '';
  const after = to?.trim() ?? '';
  return before === after ? null : { label, from: before || 'none', to: after || 'none' };
}

/**
 * Pairs items of two lists by a key (the n-th "Cascade, boil" with the n-th),
 * then reports the unpaired ones as added or removed and the paired ones whose
 * fields differ as changed.
 */
function listChanges<T>(
  before: readonly T[],
  after: readonly T[],
  key: (item: T) => string,
  name: (item: T) => string,
  fields: (a: T, b: T) => ValueChange[],
): ItemChange[] {
  const remaining = new Map<string, T[]>();
  for (const item of before) remaining.set(key(item), [...(remaining.get(key(item)) ?? []), item]);
  const changes: ItemChange[] = [];
  for (const item of after) {
    const match = remaining.get(key(item))?.shift();
    if (!match) {
      changes.push({ change: 'added', name: name(item), fields: [] });
      continue;
    }
    const differences = fields(match, item);
    if (differences.length > 0) changes.push({ change: 'changed', name: name(item), fields: differences });
  }
  for (const left of remaining.values()) {
    for (const item of left) changes.push({ change: 'removed', name: name(item), fields: [] });
  }
  return changes;
}

const normalName = (name: string) => name.trim().toLowerCase();

function stepListChanges<T>(
  noun: string,
  before: readonly T[],
  after: readonly T[],
  specs: NumberFieldSpec<T>[],
): ValueChange[] {
  const changes: ValueChange[] = [];
  if (before.length !== after.length) {
    const count = (n: number) => `${n} ${n === 1 ? 'step' : 'steps'}`;
    changes.push({ label: `${noun} steps`, from: count(before.length), to: count(after.length) });
  }
  const shared = Math.min(before.length, after.length);
  for (let i = 0; i < shared; i++) changes.push(...numberChanges(before[i], after[i], specs, `${noun} step ${i + 1} `));
  return changes;
}

/** Defaults filled in, so a left-out default and the same value written out compare equal. */
function withDefaults(doc: Doc): Doc {
  const parsed = recipeDocumentSchema.safeParse(doc);
  return parsed.success ? parsed.data : doc;
}

/** Water as text with a fixed key order, so documents from different writers compare by content. */
function waterText(water: Doc['water']): string {
  if (!water) return 'none';
  const source = ION_NAMES.map((ion) => water.source[ion]);
  const salts = (water.salts ?? []).map((s) => [s.salt, s.grams]);
  return JSON.stringify([water.volumeL, source, salts]);
}

function carbonationText(carbonation: Doc['carbonation']): string {
  return carbonation ? JSON.stringify([carbonation.volumesCO2, carbonation.servingTempC]) : 'none';
}

export function compareVersions(baseInput: Doc, headInput: Doc, units: UnitSystem): VersionChanges {
  const base = withDefaults(baseInput);
  const head = withDefaults(headInput);
  const temperature = fieldUnit('temperature', units);
  const minutes = plainUnit('min', 0);
  const percent = plainUnit('%', 1);
  type Fermentable = Doc['fermentables'][number];
  type Hop = Doc['hops'][number];
  type Yeast = Doc['yeasts'][number];
  type MashStep = Doc['mash']['steps'][number];
  type FermentationStep = Doc['fermentation']['steps'][number];

  return {
    title: textChange('Title', base.title, head.title),
    style: textChange(
      'Style',
      base.style && `${base.style.code} ${base.style.name}`,
      head.style && `${head.style.code} ${head.style.name}`,
    ),
    fermentables: listChanges<Fermentable>(
      base.fermentables,
      head.fermentables,
      (f) => normalName(f.name),
      (f) => f.name,
      (a, b) => [
        ...numberChanges(a, b, [
          { label: 'amount', read: (f) => f.amountKg, unit: fieldUnit('mass', units) },
          { label: 'potential', read: (f) => f.potentialPpg, unit: plainUnit('ppg', 1) },
          { label: 'colour', read: (f) => f.colorLovibond, unit: plainUnit('°L', 1) },
        ]),
        ...[textChange('kind', a.kind, b.kind)].filter((c) => c !== null),
      ],
    ),
    hops: listChanges<Hop>(
      base.hops,
      head.hops,
      (h) => `${normalName(h.name)}|${h.use}`,
      (h) => `${h.name} (${HOP_USE_WORDS[h.use]})`,
      (a, b) => [
        ...numberChanges(a, b, [
          { label: 'amount', read: (h) => h.amountG, unit: fieldUnit('hopMass', units) },
          { label: 'alpha acid', read: (h) => h.alphaPct, unit: percent },
          { label: 'time', read: (h) => h.timeMin, unit: minutes },
          { label: 'temperature', read: (h) => h.tempC, unit: temperature },
        ]),
        ...[textChange('form', a.form, b.form)].filter((c) => c !== null),
      ],
    ),
    yeasts: listChanges<Yeast>(
      base.yeasts,
      head.yeasts,
      (y) => normalName(y.name),
      (y) => y.name,
      (a, b) => [
        ...numberChanges(a, b, [
          { label: 'attenuation', read: (y) => y.attenuationPct, unit: percent },
          { label: 'lowest temperature', read: (y) => y.tempMinC, unit: temperature },
          { label: 'highest temperature', read: (y) => y.tempMaxC, unit: temperature },
        ]),
        ...[textChange('kind', a.kind, b.kind)].filter((c) => c !== null),
      ],
    ),
    batch: numberChanges(base.batch, head.batch, [
      { label: 'Batch volume', read: (b) => b.volumeL, unit: fieldUnit('volume', units) },
      { label: 'Boil time', read: (b) => b.boilTimeMin, unit: minutes },
      { label: 'Brewhouse efficiency', read: (b) => b.efficiencyPct, unit: percent },
      { label: 'Boil-off rate', read: (b) => b.boilOffLPerHour, unit: fieldUnit('volumePerHour', units) },
      { label: 'Kettle trub loss', read: (b) => b.trubLossL, unit: fieldUnit('volume', units) },
      { label: 'Grain absorption', read: (b) => b.grainAbsorptionLPerKg, unit: fieldUnit('litresPerKg', units) },
      { label: 'Mash thickness', read: (b) => b.mashWaterLPerKg, unit: fieldUnit('litresPerKg', units) },
    ]),
    mash: stepListChanges<MashStep>('Mash', base.mash.steps, head.mash.steps, [
      { label: 'temperature', read: (s) => s.tempC, unit: temperature },
      { label: 'time', read: (s) => s.timeMin, unit: minutes },
    ]),
    fermentation: stepListChanges<FermentationStep>('Fermentation', base.fermentation.steps, head.fermentation.steps, [
      { label: 'temperature', read: (s) => s.tempC, unit: temperature },
      { label: 'days', read: (s) => s.days, unit: plainUnit('', 1) },
    ]),
    waterChanged: waterText(base.water) !== waterText(head.water),
    carbonationChanged: carbonationText(base.carbonation) !== carbonationText(head.carbonation),
    notesChanged: (base.notes ?? '').trim() !== (head.notes ?? '').trim(),
  };
}

export function hasChanges(changes: VersionChanges): boolean {
  return (
    changes.title !== null ||
    changes.style !== null ||
    changes.fermentables.length > 0 ||
    changes.hops.length > 0 ||
    changes.yeasts.length > 0 ||
    changes.batch.length > 0 ||
    changes.mash.length > 0 ||
    changes.fermentation.length > 0 ||
    changes.waterChanged ||
    changes.carbonationChanged ||
    changes.notesChanged
  );
}
