import { diffWords } from 'diff';
import type { RecipeDocument, RecipeStats } from '@/lib/brewing';

export type ChangeStatus = 'added' | 'removed' | 'changed' | 'same';
type Scalar = string | number | boolean | null;

interface FieldChange {
  field: string;
  before: Scalar;
  after: Scalar;
}

export interface ItemComparison {
  /** What the item is called on both sides (its name, or "Step 2"). */
  label: string;
  status: ChangeStatus;
  before: Record<string, Scalar> | null;
  after: Record<string, Scalar> | null;
  changes: FieldChange[];
}

export interface SectionComparison {
  section:
    'settings' | 'fermentables' | 'hops' | 'yeasts' | 'mash' | 'fermentation' | 'water' | 'salts' | 'carbonation';
  items: ItemComparison[];
}

export interface StatDelta {
  stat: string;
  before: number | null;
  after: number | null;
  delta: number | null;
}

interface NotesPart {
  value: string;
  added: boolean;
  removed: boolean;
}

export interface DocumentComparison {
  sections: SectionComparison[];
  stats: StatDelta[];
  notes: NotesPart[];
  /** How many items were added, removed or changed across all sections. */
  changeCount: number;
}

function flat(value: object | undefined | null): Record<string, Scalar> | null {
  if (!value) return null;
  const out: Record<string, Scalar> = {};
  for (const [k, v] of Object.entries(value)) {
    if (v === undefined) continue;
    out[k] = typeof v === 'object' && v !== null ? JSON.stringify(v) : (v as Scalar);
  }
  return out;
}

function compareItem(
  label: string,
  before: Record<string, Scalar> | null,
  after: Record<string, Scalar> | null,
): ItemComparison {
  if (!before) return { label, status: 'added', before, after, changes: [] };
  if (!after) return { label, status: 'removed', before, after, changes: [] };
  const changes: FieldChange[] = [];
  for (const field of new Set([...Object.keys(before), ...Object.keys(after)])) {
    const b = before[field] ?? null;
    const a = after[field] ?? null;
    if (b !== a) changes.push({ field, before: b, after: a });
  }
  return { label, status: changes.length ? 'changed' : 'same', before, after, changes };
}

/**
 * Pairs list entries by a key (an ingredient's name and role); entries with the same key pair in
 * order, so two Cascade boil additions pair first with first.
 */
function pairByKey<T extends object>(
  before: readonly T[],
  after: readonly T[],
  key: (item: T) => string,
  label: (item: T) => string,
): ItemComparison[] {
  const remaining = new Map<string, T[]>();
  for (const item of after) {
    const k = key(item);
    remaining.set(k, [...(remaining.get(k) ?? []), item]);
  }
  const items: ItemComparison[] = [];
  for (const b of before) {
    const queue = remaining.get(key(b));
    const a = queue?.shift();
    items.push(compareItem(label(b), flat(b), flat(a)));
  }
  for (const queue of remaining.values()) for (const a of queue) items.push(compareItem(label(a), null, flat(a)));
  return items;
}

function pairByIndex<T extends object>(
  before: readonly T[],
  after: readonly T[],
  label: (i: number) => string,
): ItemComparison[] {
  const items: ItemComparison[] = [];
  for (let i = 0; i < Math.max(before.length, after.length); i++)
    items.push(compareItem(label(i), flat(before[i]), flat(after[i])));
  return items;
}

const nameKey = (item: { name: string }) => item.name.trim().toLowerCase();

const STAT_KEYS = ['og', 'fg', 'abv', 'ibu', 'srm', 'ebc', 'buGu', 'caloriesPer355mL', 'attenuationPct'] as const;

function statDeltas(a: RecipeStats, b: RecipeStats): StatDelta[] {
  const rows: StatDelta[] = STAT_KEYS.map((stat) => ({
    stat,
    before: a[stat],
    after: b[stat],
    delta: b[stat] - a[stat],
  }));
  const pair = (stat: string, before: number | undefined, after: number | undefined) =>
    rows.push({
      stat,
      before: before ?? null,
      after: after ?? null,
      delta: before !== undefined && after !== undefined ? after - before : null,
    });
  pair('sulfateToChloride', a.water?.sulfateToChloride, b.water?.sulfateToChloride);
  pair('residualAlkalinity', a.water?.residualAlkalinity, b.water?.residualAlkalinity);
  pair('kegPressureKPa', a.carbonation?.kegPressureKPa, b.carbonation?.kegPressureKPa);
  return rows;
}

/** A structured comparison of two recipe documents and their numbers (pure; no I/O). */
export function compareDocuments(
  a: RecipeDocument,
  b: RecipeDocument,
  statsA: RecipeStats,
  statsB: RecipeStats,
): DocumentComparison {
  const settingsA = { title: a.title, style: a.style ? `${a.style.code} ${a.style.name}` : null, ...a.batch };
  const settingsB = { title: b.title, style: b.style ? `${b.style.code} ${b.style.name}` : null, ...b.batch };
  const sections: SectionComparison[] = [
    { section: 'settings', items: [compareItem('Batch and style', flat(settingsA), flat(settingsB))] },
    { section: 'fermentables', items: pairByKey(a.fermentables, b.fermentables, nameKey, (f) => f.name) },
    {
      section: 'hops',
      items: pairByKey(
        a.hops,
        b.hops,
        (h) => `${nameKey(h)}|${h.use}`,
        (h) => `${h.name} (${h.use.replace('_', ' ')})`,
      ),
    },
    { section: 'yeasts', items: pairByKey(a.yeasts, b.yeasts, nameKey, (y) => y.name) },
    { section: 'mash', items: pairByIndex(a.mash.steps, b.mash.steps, (i) => `Mash step ${i + 1}`) },
    {
      section: 'fermentation',
      items: pairByIndex(a.fermentation.steps, b.fermentation.steps, (i) => `Fermentation step ${i + 1}`),
    },
    {
      section: 'water',
      items:
        a.water || b.water
          ? [
              compareItem(
                'Source water',
                flat(a.water && { volumeL: a.water.volumeL, ...a.water.source }),
                flat(b.water && { volumeL: b.water.volumeL, ...b.water.source }),
              ),
            ]
          : [],
    },
    {
      section: 'salts',
      items: pairByKey(
        a.water?.salts ?? [],
        b.water?.salts ?? [],
        (s) => s.salt,
        (s) => s.salt.replace('_', ' '),
      ),
    },
    {
      section: 'carbonation',
      items:
        a.carbonation || b.carbonation ? [compareItem('Carbonation', flat(a.carbonation), flat(b.carbonation))] : [],
    },
  ];
  const notes = diffWords(a.notes ?? '', b.notes ?? '').map((p) => ({
    value: p.value,
    added: Boolean(p.added),
    removed: Boolean(p.removed),
  }));
  const changeCount = sections.reduce((n, s) => n + s.items.filter((i) => i.status !== 'same').length, 0);
  return { sections, stats: statDeltas(statsA, statsB), notes, changeCount };
}
