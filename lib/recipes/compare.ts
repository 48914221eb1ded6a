import { diffWords } from 'diff';
import type { RecipeDocument } from '@/lib/brewing/schema';
import { computeStats } from '@/lib/brewing/stats';
import type { UnitSystem } from '@/lib/brewing/units';
import { attribute, type StatAttribution, type StatDelta, type StatsOf } from './attribution';
import {
  BATCH_FIELDS,
  CARBONATION_FIELDS,
  FERMENTABLE_FIELDS,
  FERMENTATION_STEP_FIELDS,
  HOP_FIELDS,
  MASH_STEP_FIELDS,
  SALT_FIELDS,
  WATER_FIELDS,
  YEAST_FIELDS,
  describeFields,
  hopLabel,
  hopTime,
  saltLine,
  saltName,
  showAmount,
  showField,
  signed,
  temperatureStep,
  trimNumber,
  type FieldSpec,
  type Scalar,
} from './fields';

export type { StatAttribution, StatDelta } from './attribution';

export type ChangeStatus = 'added' | 'removed' | 'changed' | 'same';
/** How a changed item reads: another ingredient in the same role, or the same one moved in the schedule. */
type ChangeKind = 'swap' | 'moved' | 'edit' | null;

interface FieldChange {
  /** The document key, for programs; screens show `label`. */
  field: string;
  label: string;
  before: string;
  after: string;
  /** A signed amount ("+0.3 kg") where the change is a number. */
  delta: string | null;
}

export interface ItemComparison {
  /** Names the change within this comparison (attribution refers to it). */
  id: string;
  /** What the item is called, e.g. "Munich malt", "Cascade (boil, 10 min)", "Clean ale yeast → Kveik". */
  label: string;
  status: ChangeStatus;
  kind: ChangeKind;
  /** One line in brewers' words, e.g. "Yeast: Clean ale yeast → Kveik" or "Pale ale malt +0.3 kg". */
  summary: string;
  /** Short phrase naming the change in "… from the yeast swap". */
  cause: string;
  /** The summary without its before → after detail, e.g. "Mashed 1 °C cooler": a history line's lead. */
  short: string;
  /** The item's fields in words (for an added, removed or unchanged item). */
  details: string;
  changes: FieldChange[];
}

type SectionName =
  'settings' | 'fermentables' | 'hops' | 'yeasts' | 'mash' | 'fermentation' | 'water' | 'salts' | 'carbonation';

export interface SectionComparison {
  section: SectionName;
  items: ItemComparison[];
}

interface NotesPart {
  value: string;
  added: boolean;
  removed: boolean;
}

export interface DocumentComparison {
  units: UnitSystem;
  sections: SectionComparison[];
  stats: StatDelta[];
  /** For every number that moved: how much each change moved it on its own, and what is left as their interplay. */
  attribution: StatAttribution[];
  notes: NotesPart[];
  notesChanged: boolean;
  /** How many items were added, removed or changed across all sections. */
  changeCount: number;
  /** Nothing differs at all (ingredients, schedules, settings and notes). */
  identical: boolean;
}

/** A change with the way to make it alone on a copy of the "before" document. */
export interface AppliedChange {
  item: ItemComparison;
  apply: (doc: RecipeDocument) => RecipeDocument;
}

type Row = Record<string, Scalar>;
const asRow = (value: object): Row => value as unknown as Row;

function fieldChanges(specs: readonly FieldSpec[], before: Row, after: Row, units: UnitSystem): FieldChange[] {
  const out: FieldChange[] = [];
  for (const spec of specs) {
    const b = before[spec.key];
    const a = after[spec.key];
    if ((b ?? null) === (a ?? null)) continue;
    const bText = b === undefined || b === null ? 'not set' : showField(spec, before, units);
    const aText = a === undefined || a === null ? 'not set' : showField(spec, after, units);
    if (bText === aText && spec.key !== 'timeMin') continue;
    let delta: string | null = null;
    if (typeof b === 'number' && typeof a === 'number' && spec.delta) {
      delta =
        spec.key === 'timeMin' && after.use === 'dry_hop' && before.use === 'dry_hop'
          ? signed(daysText(Math.abs(a - b) / 1440), a - b)
          : spec.delta(b, a, units);
    }
    out.push({ field: spec.key, label: spec.label, before: bText, after: aText, delta });
  }
  return out;
}

const daysText = (days: number) => `${trimNumber(days, 1)} ${trimNumber(days, 1) === '1' ? 'day' : 'days'}`;

const changesText = (changes: FieldChange[]) =>
  changes
    .map((c) =>
      c.delta && c.field.startsWith('amount')
        ? `${c.label.toLowerCase()} ${c.delta} (${c.before} → ${c.after})`
        : `${c.label.toLowerCase()} ${c.before} → ${c.after}`,
    )
    .join(', ');

/** "0.3 kg more Munich malt", "5 g less Cascade (boil)". */
function amountCause(change: FieldChange, name: string): string {
  const more = change.delta?.startsWith('+');
  return `${change.delta?.replace(/^[+−]/, '')} ${more ? 'more' : 'less'} ${name}`;
}

interface Pair<T> {
  before: T | null;
  after: T | null;
  beforeIndex: number;
}

/**
 * Pairs two lists the way a brewer reads them: passes run in order and each pairs what is still
 * unpaired when `eligible`, preferring the lowest `cost` (first in list order on a tie).
 */
function match<T>(
  before: readonly T[],
  after: readonly T[],
  passes: { eligible: (b: T, a: T) => boolean; cost?: (b: T, a: T) => number }[],
): Pair<T>[] {
  const pairedAfter = new Array<number>(before.length).fill(-1);
  const usedAfter = new Set<number>();
  for (const pass of passes) {
    for (let i = 0; i < before.length; i++) {
      if (pairedAfter[i] !== -1) continue;
      let best = -1;
      let bestCost = Infinity;
      for (let j = 0; j < after.length; j++) {
        if (usedAfter.has(j) || !pass.eligible(before[i], after[j])) continue;
        const cost = pass.cost ? pass.cost(before[i], after[j]) : 0;
        if (cost < bestCost) {
          best = j;
          bestCost = cost;
        }
      }
      if (best !== -1) {
        pairedAfter[i] = best;
        usedAfter.add(best);
      }
    }
  }
  const pairs: Pair<T>[] = before.map((b, i) => ({
    before: b,
    after: pairedAfter[i] === -1 ? null : after[pairedAfter[i]],
    beforeIndex: i,
  }));
  after.forEach((a, j) => {
    if (!usedAfter.has(j)) pairs.push({ before: null, after: a, beforeIndex: -1 });
  });
  return pairs;
}

const norm = (name: string) => name.trim().toLowerCase();

type ListKey = 'fermentables' | 'hops' | 'yeasts';

/** Replaces, removes or adds one entry of a list on a copy. */
function listEdit<K extends ListKey>(key: K, pair: Pair<RecipeDocument[K][number]>) {
  return (doc: RecipeDocument): RecipeDocument => {
    const list = doc[key] as RecipeDocument[K][number][];
    let next: RecipeDocument[K][number][];
    if (pair.before && pair.after) next = list.map((x, i) => (i === pair.beforeIndex ? pair.after! : x));
    else if (pair.before) next = list.filter((_, i) => i !== pair.beforeIndex);
    else next = [...list, pair.after!];
    return { ...doc, [key]: next };
  };
}

interface Builder {
  units: UnitSystem;
  changes: AppliedChange[];
  nextId: number;
}

function push(
  builder: Builder,
  section: SectionName,
  item: Omit<ItemComparison, 'id' | 'short'> & { short?: string },
  apply: AppliedChange['apply'] | null,
): ItemComparison {
  const full: ItemComparison = { id: `${section}-${builder.nextId++}`, ...item, short: item.short ?? item.summary };
  if (apply && full.status !== 'same') builder.changes.push({ item: full, apply });
  return full;
}

/** An ingredient only one side has: added in the newer version, or removed from it. */
function pushOneSided(
  builder: Builder,
  section: SectionName,
  apply: AppliedChange['apply'] | null,
  side: {
    added: boolean;
    label: string;
    /** How the summary names it, when not by its label alone ("yeast Kveik"). */
    named?: string;
    amount?: string;
    cause: string;
    details: ItemComparison['details'];
  },
): ItemComparison {
  const verb = side.added ? 'Added' : 'Removed';
  const named = side.named ?? side.label;
  return push(
    builder,
    section,
    {
      label: side.label,
      status: side.added ? 'added' : 'removed',
      kind: null,
      summary: side.amount ? `${verb} ${named}, ${side.amount}` : `${verb} ${named}`,
      cause: side.cause,
      details: side.details,
      changes: [],
    },
    apply,
  );
}

function fermentableItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  const pairs = match(a.fermentables, b.fermentables, [
    { eligible: (x, y) => norm(x.name) === norm(y.name) },
    { eligible: (x, y) => x.kind === y.kind, cost: (x, y) => Math.abs(x.colorLovibond - y.colorLovibond) },
  ]);
  return pairs.map((pair) => {
    const apply = listEdit('fermentables', pair);
    const { before, after } = pair;
    if (before && after) {
      const changes = fieldChanges(FERMENTABLE_FIELDS, asRow(before), asRow(after), units);
      const swap = norm(before.name) !== norm(after.name);
      const status: ChangeStatus = swap || changes.length ? 'changed' : 'same';
      const amountOnly = !swap && changes.length === 1 && changes[0].field === 'amountKg';
      const label = swap ? `${before.name} → ${after.name}` : after.name;
      const summary = swap
        ? `Fermentable: ${before.name} → ${after.name}${changes.length ? ` (${changesText(changes)})` : ''}`
        : amountOnly
          ? `${after.name} ${changes[0].delta} (${changes[0].before} → ${changes[0].after})`
          : `${after.name}: ${changesText(changes)}`;
      const cause = swap
        ? `the ${before.name} → ${after.name} swap`
        : amountOnly
          ? amountCause(changes[0], after.name)
          : `the ${after.name} change`;
      return push(
        builder,
        'fermentables',
        {
          label,
          status,
          kind: swap ? 'swap' : status === 'changed' ? 'edit' : null,
          summary: status === 'same' ? after.name : summary,
          short: swap
            ? `Fermentable: ${before.name} → ${after.name}`
            : amountOnly
              ? `${after.name} ${changes[0].delta}`
              : undefined,
          cause,
          details: describeFields(FERMENTABLE_FIELDS, asRow(after), units),
          changes,
        },
        apply,
      );
    }
    const one = (before ?? after)!;
    const added = !before;
    return pushOneSided(builder, 'fermentables', apply, {
      added,
      label: one.name,
      amount: showAmount(one.amountKg, 'mass', units),
      cause: added ? `adding ${one.name}` : `removing ${one.name}`,
      details: describeFields(FERMENTABLE_FIELDS, asRow(one), units),
    });
  });
}

function hopItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  type Hop = RecipeDocument['hops'][number];
  const timeGap = (x: Hop, y: Hop) => Math.abs(x.timeMin - y.timeMin);
  const pairs = match(a.hops, b.hops, [
    { eligible: (x, y) => norm(x.name) === norm(y.name) && x.use === y.use && x.timeMin === y.timeMin },
    { eligible: (x, y) => norm(x.name) === norm(y.name) && x.use === y.use, cost: timeGap },
    { eligible: (x, y) => norm(x.name) === norm(y.name), cost: timeGap },
    { eligible: (x, y) => x.use === y.use && x.timeMin === y.timeMin },
  ]);
  return pairs.map((pair) => {
    const apply = listEdit('hops', pair);
    const { before, after } = pair;
    if (before && after) {
      const all = fieldChanges(HOP_FIELDS, asRow(before), asRow(after), units);
      const swap = norm(before.name) !== norm(after.name);
      const moved = !swap && (before.use !== after.use || before.timeMin !== after.timeMin);
      const where = (h: Hop) =>
        before.use === after.use ? hopTime(h.timeMin, h.use) : `${hopUseWord(h.use)} ${hopTime(h.timeMin, h.use)}`;
      const rest = all.filter((c) => !(moved && (c.field === 'use' || c.field === 'timeMin')));
      const status: ChangeStatus = swap || all.length ? 'changed' : 'same';
      const movedText = moved ? `moved from ${where(before)} to ${where(after)}` : '';
      const amountOnly = !swap && !moved && rest.length === 1 && rest[0].field === 'amountG';
      const summary = swap
        ? `Hop: ${before.name} → ${after.name} (${hopUseWord(after.use)}, ${hopTime(after.timeMin, after.use)})${rest.length ? `, ${changesText(rest)}` : ''}`
        : amountOnly
          ? `${hopLabel(after)} ${rest[0].delta} (${rest[0].before} → ${rest[0].after})`
          : `${after.name} (${hopUseWord(after.use)}) ${[movedText, changesText(rest)].filter(Boolean).join(', ')}`;
      const cause = swap
        ? `the ${before.name} → ${after.name} swap`
        : moved && !rest.length
          ? `moving ${after.name} from ${where(before)} to ${where(after)}`
          : amountOnly
            ? amountCause(rest[0], `${after.name} (${hopUseWord(after.use)})`)
            : `the ${hopLabel(after)} change`;
      return push(
        builder,
        'hops',
        {
          label: swap ? `${before.name} → ${after.name} (${hopUseWord(after.use)})` : hopLabel(after),
          status,
          kind: swap ? 'swap' : moved ? 'moved' : status === 'changed' ? 'edit' : null,
          summary: status === 'same' ? hopLabel(after) : summary,
          short: amountOnly ? `${hopLabel(after)} ${rest[0].delta}` : undefined,
          cause,
          details: describeFields(HOP_FIELDS, asRow(after), units, ['use']),
          changes: all,
        },
        apply,
      );
    }
    const one = (before ?? after)!;
    const added = !before;
    const newAddition =
      one.use === 'dry_hop'
        ? `the new ${one.name} dry hop`
        : one.use === 'boil' || one.use === 'first_wort'
          ? `the new ${trimNumber(one.timeMin, 0)}-minute ${one.name} addition`
          : `the new ${one.name} ${hopUseWord(one.use)} addition`;
    return pushOneSided(builder, 'hops', apply, {
      added,
      label: hopLabel(one),
      amount: showAmount(one.amountG, 'hopMass', units),
      cause: added ? newAddition : `removing ${hopLabel(one)}`,
      details: describeFields(HOP_FIELDS, asRow(one), units, ['use']),
    });
  });
}

function hopUseWord(use: string): string {
  return HOP_FIELDS.find((f) => f.key === 'use')!.show(use, 'metric');
}

function yeastItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  const pairs = match(a.yeasts, b.yeasts, [
    { eligible: (x, y) => norm(x.name) === norm(y.name) },
    { eligible: () => true, cost: (x, y) => (x.kind === y.kind ? 0 : 1) },
  ]);
  return pairs.map((pair) => {
    const apply = listEdit('yeasts', pair);
    const { before, after } = pair;
    if (before && after) {
      const changes = fieldChanges(YEAST_FIELDS, asRow(before), asRow(after), units);
      const swap = norm(before.name) !== norm(after.name);
      const status: ChangeStatus = swap || changes.length ? 'changed' : 'same';
      return push(
        builder,
        'yeasts',
        {
          label: swap ? `${before.name} → ${after.name}` : after.name,
          status,
          kind: swap ? 'swap' : status === 'changed' ? 'edit' : null,
          summary: swap
            ? `Yeast: ${before.name} → ${after.name}${changes.length ? ` (${changesText(changes)})` : ''}`
            : status === 'same'
              ? after.name
              : `${after.name}: ${changesText(changes)}`,
          short: swap ? `Yeast: ${before.name} → ${after.name}` : undefined,
          cause: swap ? 'the yeast swap' : `the ${after.name} change`,
          details: describeFields(YEAST_FIELDS, asRow(after), units),
          changes,
        },
        apply,
      );
    }
    const one = (before ?? after)!;
    const added = !before;
    return pushOneSided(builder, 'yeasts', apply, {
      added,
      label: one.name,
      named: `yeast ${one.name}`,
      cause: added ? `adding ${one.name}` : `removing ${one.name}`,
      details: describeFields(YEAST_FIELDS, asRow(one), units),
    });
  });
}

function settingsItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  const items: ItemComparison[] = [];
  const styleText = (d: RecipeDocument) => (d.style ? `${d.style.code} ${d.style.name}` : 'none');
  if (a.title !== b.title)
    items.push(
      push(
        builder,
        'settings',
        {
          label: 'Title',
          status: 'changed',
          kind: 'edit',
          summary: `Title: ${a.title} → ${b.title}`,
          cause: 'the new title',
          details: '',
          changes: [{ field: 'title', label: 'Title', before: a.title, after: b.title, delta: null }],
        },
        (d) => ({ ...d, title: b.title }),
      ),
    );
  if (styleText(a) !== styleText(b))
    items.push(
      push(
        builder,
        'settings',
        {
          label: 'Style',
          status: 'changed',
          kind: 'edit',
          summary: `Style: ${styleText(a)} → ${styleText(b)}`,
          cause: 'the style change',
          details: '',
          changes: [{ field: 'style', label: 'Style', before: styleText(a), after: styleText(b), delta: null }],
        },
        (d) => ({ ...d, style: b.style }),
      ),
    );
  for (const change of fieldChanges(BATCH_FIELDS, asRow(a.batch), asRow(b.batch), units)) {
    const key = change.field as keyof RecipeDocument['batch'];
    const value = b.batch[key];
    items.push(
      push(
        builder,
        'settings',
        {
          label: change.label,
          status: 'changed',
          kind: 'edit',
          summary: `${change.label} ${change.before} → ${change.after}`,
          cause: `${change.label.toLowerCase()} ${change.before} → ${change.after}`,
          details: '',
          changes: [change],
        },
        (d) => ({ ...d, batch: { ...d.batch, [key]: value } }),
      ),
    );
  }
  if (!items.length)
    items.push(
      push(
        builder,
        'settings',
        {
          label: 'Batch and style',
          status: 'same',
          kind: null,
          summary: 'Batch and style',
          cause: '',
          details: describeFields(BATCH_FIELDS, asRow(b.batch), units),
          changes: [],
        },
        null,
      ),
    );
  return items;
}

type StepList = 'mash' | 'fermentation';

function stepItems(kind: StepList, a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  const before = a[kind].steps as Row[];
  const after = b[kind].steps as Row[];
  const specs = kind === 'mash' ? MASH_STEP_FIELDS : FERMENTATION_STEP_FIELDS;
  const noun = kind === 'mash' ? 'Mash step' : 'Fermentation step';
  const items: ItemComparison[] = [];
  for (let i = 0; i < Math.max(before.length, after.length); i++) {
    const x = before[i];
    const y = after[i];
    const name = (row: Row | undefined) =>
      typeof row?.name === 'string' && row.name ? `${noun} ${i + 1} (${row.name})` : `${noun} ${i + 1}`;
    const apply = (d: RecipeDocument): RecipeDocument => {
      const steps = [...d[kind].steps] as Row[];
      if (y === undefined) steps.length = Math.min(steps.length, i);
      else steps[i] = y;
      return { ...d, [kind]: { steps: steps.filter((s) => s !== undefined) } } as RecipeDocument;
    };
    if (x && y) {
      const changes = fieldChanges(specs, x, y, units);
      const onlyTemp = changes.length === 1 && changes[0].field === 'tempC';
      const tempDiff = (y.tempC as number) - (x.tempC as number);
      const whole = kind === 'mash' ? (before.length === 1 || i === 0 ? 'mash' : name(y).toLowerCase()) : null;
      const cause = onlyTemp
        ? kind === 'mash'
          ? `the ${temperatureStep(Math.abs(tempDiff), units)} ${tempDiff > 0 ? 'hotter' : 'cooler'} ${whole}`
          : `fermenting ${temperatureStep(Math.abs(tempDiff), units)} ${tempDiff > 0 ? 'warmer' : 'cooler'} in step ${i + 1}`
        : `the ${name(y).toLowerCase()} change`;
      const short = onlyTemp
        ? kind === 'mash'
          ? `Mashed ${temperatureStep(Math.abs(tempDiff), units)} ${tempDiff > 0 ? 'hotter' : 'cooler'}`
          : `Fermented ${temperatureStep(Math.abs(tempDiff), units)} ${tempDiff > 0 ? 'warmer' : 'cooler'}`
        : undefined;
      const summary = short
        ? `${short} (${name(y)}: ${changes[0].before} → ${changes[0].after})`
        : `${name(y)}: ${changesText(changes)}`;
      items.push(
        push(
          builder,
          kind,
          {
            label: name(y),
            status: changes.length ? 'changed' : 'same',
            kind: changes.length ? 'edit' : null,
            summary: changes.length ? summary : name(y),
            short: changes.length ? short : undefined,
            cause,
            details: describeFields(specs, y, units, ['name']),
            changes,
          },
          apply,
        ),
      );
    } else {
      const one = (x ?? y)!;
      items.push(
        push(
          builder,
          kind,
          {
            label: name(one),
            status: x ? 'removed' : 'added',
            kind: null,
            summary: `${x ? 'Removed' : 'Added'} ${name(one).toLowerCase()}: ${describeFields(specs, one, units, ['name'])}`,
            cause: `${x ? 'removing' : 'adding'} ${name(one).toLowerCase()}`,
            details: describeFields(specs, one, units, ['name']),
            changes: [],
          },
          apply,
        ),
      );
    }
  }
  return items;
}

function waterItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  if (!a.water && !b.water) return [];
  const row = (w: NonNullable<RecipeDocument['water']>): Row => ({ volumeL: w.volumeL, ...w.source });
  if (!a.water || !b.water) {
    const one = (a.water ?? b.water)!;
    const added = !a.water;
    const salts = one.salts.map((s) => saltLine(s.salt, s.grams)).join(', ');
    return [
      push(
        builder,
        'water',
        {
          label: 'Source water',
          status: added ? 'added' : 'removed',
          kind: null,
          summary: added ? 'Added a water profile' : 'Removed the water profile',
          cause: added ? 'adding the water profile' : 'removing the water profile',
          details: [describeFields(WATER_FIELDS, row(one), units), salts && `salts: ${salts}`]
            .filter(Boolean)
            .join(' · '),
          changes: [],
        },
        (d) => ({ ...d, water: b.water }),
      ),
    ];
  }
  const wa = a.water;
  const wb = b.water;
  const changes = fieldChanges(WATER_FIELDS, row(wa), row(wb), units);
  const items: ItemComparison[] = [
    push(
      builder,
      'water',
      {
        label: 'Source water',
        status: changes.length ? 'changed' : 'same',
        kind: changes.length ? 'edit' : null,
        summary: changes.length ? `Source water: ${changesText(changes)}` : 'Source water',
        cause: 'the source water change',
        details: describeFields(WATER_FIELDS, row(wb), units),
        changes,
      },
      (d) => ({ ...d, water: d.water && { ...d.water, volumeL: wb.volumeL, source: wb.source } }),
    ),
  ];
  const pairs = match(wa.salts, wb.salts, [{ eligible: (x, y) => x.salt === y.salt }]);
  for (const pair of pairs) {
    const apply = (d: RecipeDocument): RecipeDocument => {
      if (!d.water) return d;
      const list = d.water.salts;
      const salts =
        pair.before && pair.after
          ? list.map((s, i) => (i === pair.beforeIndex ? pair.after! : s))
          : pair.before
            ? list.filter((_, i) => i !== pair.beforeIndex)
            : [...list, pair.after!];
      return { ...d, water: { ...d.water, salts } };
    };
    const one = (pair.after ?? pair.before)!;
    const name = saltName(one.salt);
    if (pair.before && pair.after) {
      const c = fieldChanges(SALT_FIELDS, asRow(pair.before), asRow(pair.after), units);
      items.push(
        push(
          builder,
          'salts',
          {
            label: name,
            status: c.length ? 'changed' : 'same',
            kind: c.length ? 'edit' : null,
            summary: c.length ? `${name} ${c[0].delta} (${c[0].before} → ${c[0].after})` : name,
            short: c.length ? `${name} ${c[0].delta}` : undefined,
            cause: c.length ? `${c[0].delta} ${name.toLowerCase()}` : '',
            details: describeFields(SALT_FIELDS, asRow(one), units),
            changes: c,
          },
          apply,
        ),
      );
    } else {
      const added = !pair.before;
      items.push(
        push(
          builder,
          'salts',
          {
            label: name,
            status: added ? 'added' : 'removed',
            kind: null,
            summary: `${added ? 'Added' : 'Removed'} ${name.toLowerCase()}, ${trimNumber(one.grams, 1)} g`,
            cause: `${added ? 'adding' : 'removing'} ${name.toLowerCase()}`,
            details: describeFields(SALT_FIELDS, asRow(one), units),
            changes: [],
          },
          apply,
        ),
      );
    }
  }
  return items;
}

function carbonationItems(a: RecipeDocument, b: RecipeDocument, builder: Builder): ItemComparison[] {
  const { units } = builder;
  if (!a.carbonation && !b.carbonation) return [];
  const apply = (d: RecipeDocument): RecipeDocument => ({ ...d, carbonation: b.carbonation });
  if (!a.carbonation || !b.carbonation) {
    const added = !a.carbonation;
    return [
      push(
        builder,
        'carbonation',
        {
          label: 'Carbonation',
          status: added ? 'added' : 'removed',
          kind: null,
          summary: added ? 'Added a carbonation target' : 'Removed the carbonation target',
          cause: added ? 'adding the carbonation target' : 'removing the carbonation target',
          details: describeFields(CARBONATION_FIELDS, asRow((a.carbonation ?? b.carbonation)!), units),
          changes: [],
        },
        apply,
      ),
    ];
  }
  const changes = fieldChanges(CARBONATION_FIELDS, asRow(a.carbonation), asRow(b.carbonation), units);
  return [
    push(
      builder,
      'carbonation',
      {
        label: 'Carbonation',
        status: changes.length ? 'changed' : 'same',
        kind: changes.length ? 'edit' : null,
        summary: changes.length ? `Carbonation: ${changesText(changes)}` : 'Carbonation',
        cause: `carbonation ${changesText(changes)}`,
        details: describeFields(CARBONATION_FIELDS, asRow(b.carbonation), units),
        changes,
      },
      apply,
    ),
  ];
}

/** The item-by-item differences of two documents, each with the way to make it alone. */
function diffDocuments(
  a: RecipeDocument,
  b: RecipeDocument,
  units: UnitSystem,
): { sections: SectionComparison[]; changes: AppliedChange[] } {
  const builder: Builder = { units, changes: [], nextId: 1 };
  const settings = settingsItems(a, b, builder);
  const fermentables = fermentableItems(a, b, builder);
  const hops = hopItems(a, b, builder);
  const yeasts = yeastItems(a, b, builder);
  const mash = stepItems('mash', a, b, builder);
  const fermentation = stepItems('fermentation', a, b, builder);
  const water = waterItems(a, b, builder);
  const carbonation = carbonationItems(a, b, builder);
  const sections: SectionComparison[] = [
    { section: 'settings', items: settings },
    { section: 'fermentables', items: fermentables },
    { section: 'hops', items: hops },
    { section: 'yeasts', items: yeasts },
    { section: 'mash', items: mash },
    { section: 'fermentation', items: fermentation },
    { section: 'water', items: water.filter((i) => i.id.startsWith('water-')) },
    { section: 'salts', items: water.filter((i) => i.id.startsWith('salts-')) },
    { section: 'carbonation', items: carbonation },
  ];
  return { sections, changes: builder.changes };
}

export interface CompareOptions {
  units: UnitSystem;
  /** The engine, as a black box: the numbers of a document (the brewing engine's by default). */
  computeStats?: StatsOf;
}

/** A structured comparison of two recipe documents and their numbers, in the reader's units (pure; no I/O). */
export function compareDocuments(a: RecipeDocument, b: RecipeDocument, options: CompareOptions): DocumentComparison {
  const { sections, changes } = diffDocuments(a, b, options.units);
  const notes = diffWords(a.notes ?? '', b.notes ?? '').map((p) => ({
    value: p.value,
    added: Boolean(p.added),
    removed: Boolean(p.removed),
  }));
  const notesChanged = (a.notes ?? '').trim() !== (b.notes ?? '').trim();
  const changeCount = sections.reduce((n, s) => n + s.items.filter((i) => i.status !== 'same').length, 0);
  const { stats, attribution } = attribute(a, b, changes, options.computeStats ?? computeStats, options.units);
  return {
    units: options.units,
    sections,
    stats,
    attribution,
    notes,
    notesChanged,
    changeCount,
    identical: changeCount === 0 && !notesChanged,
  };
}

/**
 * The item-by-item differences alone, without the numbers (no engine runs): for screens that list
 * what changed, such as the editor's panel when a newer version was saved meanwhile.
 */
export function compareItems(
  a: RecipeDocument,
  b: RecipeDocument,
  units: UnitSystem,
): Pick<DocumentComparison, 'sections' | 'notesChanged'> {
  return {
    sections: diffDocuments(a, b, units).sections,
    notesChanged: (a.notes ?? '').trim() !== (b.notes ?? '').trim(),
  };
}

/** Every change in one list, in section order: the lines the history and the conflict panel show. */
export function changeLines(comparison: Pick<DocumentComparison, 'sections'>): ItemComparison[] {
  return comparison.sections.flatMap((s) => s.items.filter((i) => i.status !== 'same'));
}
