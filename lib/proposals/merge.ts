import type { RecipeDocument } from '@/lib/brewing';
import { describeMergePath } from './merge-words';
import type { FieldIssue } from '@/lib/errors';

/**
 * A field-level three-way merge of two recipe documents that share an ancestor: `base` (the
 * version a fork came from), `ours` (the source recipe's head) and `theirs` (the proposal).
 *
 * - Scalars (batch settings, each yeast's attenuation, a mash step's temperature…) merge field by
 *   field: a field changed on one side only takes that side's value; the same change on both
 *   sides is taken once; different changes on both sides are a conflict.
 * - Ingredient lists are matched by identity, not position: fermentables and yeasts by name, hops
 *   by name and use, salts by salt. Additions and removals on either side merge item by item; an
 *   ingredient removed on one side and changed on the other is a conflict about the whole item.
 * - Mash and fermentation steps are matched by position.
 * - Notes, style, and water or carbonation present on only some sides are whole fields.
 * - The title always stays the source's: a fork's own name is not part of what it proposes.
 *
 * Pure: no I/O. `resolveMerge` applies the owner's pick for every conflict.
 */

type MergeSide = 'ours' | 'theirs';

export interface MergeConflict {
  /** Where in the document, e.g. `batch.volumeL`, `hops[cascade|boil].amountG`, `mash.steps[0].tempC`, `notes`. */
  path: string;
  /** `undefined` when the field or item is absent on that side (added, or removed). */
  base: unknown;
  ours: unknown;
  theirs: unknown;
}

export interface MergeResult {
  /** The merged document, with our side's value wherever a conflict is still open. */
  merged: RecipeDocument;
  conflicts: MergeConflict[];
  /** Paths where the proposal's change was taken without asking. */
  fromTheirs: string[];
  /** The same, with the value before and the proposal's value, for showing them. */
  taken: Omit<MergeConflict, 'ours'>[];
  /** The three documents, kept so picks can be applied later. */
  inputs: { base: RecipeDocument; ours: RecipeDocument; theirs: RecipeDocument };
}

/** A pick that names no conflict, or a conflict left without a pick. */
export class MergePickError extends Error {
  constructor(readonly issues: FieldIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    this.name = 'MergePickError';
  }
}

type Picks = Readonly<Record<string, MergeSide>>;
type Obj = Record<string, unknown>;

interface Ctx {
  picks: Picks;
  conflicts: MergeConflict[];
  fromTheirs: string[];
  taken: Omit<MergeConflict, 'ours'>[];
}

function same(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (a === undefined || b === undefined || a === null || b === null) return false;
  if (typeof a !== 'object' || typeof b !== 'object') return false;
  return stableJson(a) === stableJson(b);
}

function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Obj)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/** The whole-value rule: one side changed → that side; both the same → it; both different → a conflict. */
function mergeValue<T>(
  ctx: Ctx,
  path: string,
  base: T | undefined,
  ours: T | undefined,
  theirs: T | undefined,
): T | undefined {
  if (same(ours, theirs)) return ours;
  if (same(base, ours)) {
    ctx.fromTheirs.push(path);
    ctx.taken.push({ path, base, theirs });
    return theirs;
  }
  if (same(base, theirs)) return ours;
  const pick = ctx.picks[path];
  if (pick) return pick === 'theirs' ? theirs : ours;
  ctx.conflicts.push({ path, base, ours, theirs });
  return ours;
}

/** Field by field over an object whose fields are scalars (a hop, a yeast, the batch settings). */
function mergeFields<T extends object>(ctx: Ctx, path: string, base: T | undefined, ours: T, theirs: T): T {
  const b = (base ?? {}) as Obj;
  const o = ours as Obj;
  const t = theirs as Obj;
  const out: Obj = {};
  const keys = new Set([...Object.keys(o), ...Object.keys(t), ...Object.keys(b)]);
  for (const key of keys) {
    const value = mergeValue(ctx, `${path}.${key}`, b[key], o[key], t[key]);
    if (value !== undefined) out[key] = value;
  }
  return out as T;
}

/**
 * One list entry present on at least one side. Present on all three (or added on both) merges
 * field by field; removed on one side wins if the other side left it as it was, and is a
 * conflict about the whole entry if the other side changed it.
 */
function mergeEntry<T extends object>(
  ctx: Ctx,
  path: string,
  base: T | undefined,
  ours: T | undefined,
  theirs: T | undefined,
): T | undefined {
  if (ours !== undefined && theirs !== undefined) {
    return same(ours, theirs) ? ours : mergeFields(ctx, path, base, ours, theirs);
  }
  return mergeValue(ctx, path, base, ours, theirs);
}

/** Identity keys for a list: duplicates of one key are told apart by their order (`~2`). */
function keyed<T>(items: readonly T[], key: (item: T) => string): Map<string, T> {
  const out = new Map<string, T>();
  const seen = new Map<string, number>();
  for (const item of items) {
    const k = key(item);
    const n = (seen.get(k) ?? 0) + 1;
    seen.set(k, n);
    out.set(n === 1 ? k : `${k}~${n}`, item);
  }
  return out;
}

/** Entries matched by identity; ours keep their order, entries only the proposal added follow. */
function mergeKeyedList<T extends object>(
  ctx: Ctx,
  path: string,
  base: readonly T[],
  ours: readonly T[],
  theirs: readonly T[],
  key: (item: T) => string,
): T[] {
  const b = keyed(base, key);
  const o = keyed(ours, key);
  const t = keyed(theirs, key);
  const order = [
    ...o.keys(),
    ...[...t.keys()].filter((k) => !o.has(k)),
    ...[...b.keys()].filter((k) => !o.has(k) && !t.has(k)),
  ];
  const out: T[] = [];
  for (const k of order) {
    const merged = mergeEntry(ctx, `${path}[${k}]`, b.get(k), o.get(k), t.get(k));
    if (merged !== undefined) out.push(merged);
  }
  return out;
}

/** Entries matched by position (mash and fermentation steps). */
function mergeByPosition<T extends object>(
  ctx: Ctx,
  path: string,
  base: readonly T[],
  ours: readonly T[],
  theirs: readonly T[],
): T[] {
  const out: T[] = [];
  for (let i = 0; i < Math.max(base.length, ours.length, theirs.length); i++) {
    const merged = mergeEntry(ctx, `${path}[${i}]`, base[i], ours[i], theirs[i]);
    if (merged !== undefined) out.push(merged);
  }
  return out;
}

/** An optional section (water, carbonation): field by field when all three have it, else whole. */
function mergeOptional<T extends object>(
  ctx: Ctx,
  path: string,
  base: T | undefined,
  ours: T | undefined,
  theirs: T | undefined,
  inner: (b: T, o: T, t: T) => T,
): T | undefined {
  if (base && ours && theirs) return inner(base, ours, theirs);
  return mergeValue(ctx, path, base, ours, theirs);
}

/** `{ [key]: value }`, or nothing when the value is absent (an optional field stays left out). */
const present = <K extends string, V>(key: K, value: V | undefined) =>
  (value === undefined ? {} : { [key]: value }) as Partial<Record<K, V>>;

const nameKey = (item: { name: string }) => item.name.trim().toLowerCase();
const hopKey = (hop: { name: string; use: string }) => `${nameKey(hop)}|${hop.use}`;

function mergeWith(base: RecipeDocument, ours: RecipeDocument, theirs: RecipeDocument, picks: Picks): MergeResult {
  const ctx: Ctx = { picks, conflicts: [], fromTheirs: [], taken: [] };
  const merged: RecipeDocument = {
    title: ours.title,
    batch: mergeFields(ctx, 'batch', base.batch, ours.batch, theirs.batch),
    fermentables: mergeKeyedList(
      ctx,
      'fermentables',
      base.fermentables,
      ours.fermentables,
      theirs.fermentables,
      nameKey,
    ),
    hops: mergeKeyedList(ctx, 'hops', base.hops, ours.hops, theirs.hops, hopKey),
    yeasts: mergeKeyedList(ctx, 'yeasts', base.yeasts, ours.yeasts, theirs.yeasts, nameKey),
    mash: { steps: mergeByPosition(ctx, 'mash.steps', base.mash.steps, ours.mash.steps, theirs.mash.steps) },
    fermentation: {
      steps: mergeByPosition(
        ctx,
        'fermentation.steps',
        base.fermentation.steps,
        ours.fermentation.steps,
        theirs.fermentation.steps,
      ),
    },
    notes: mergeValue(ctx, 'notes', base.notes, ours.notes, theirs.notes) ?? '',
  };
  const water = mergeOptional(ctx, 'water', base.water, ours.water, theirs.water, (b, o, t) => ({
    volumeL: mergeValue(ctx, 'water.volumeL', b.volumeL, o.volumeL, t.volumeL)!,
    source: mergeFields(ctx, 'water.source', b.source, o.source, t.source),
    salts: mergeKeyedList(ctx, 'water.salts', b.salts, o.salts, t.salts, (s) => s.salt),
    ...present('target', mergeValue(ctx, 'water.target', b.target, o.target, t.target)),
    ...present('acid', mergeValue(ctx, 'water.acid', b.acid, o.acid, t.acid)),
  }));
  const carbonation = mergeOptional(
    ctx,
    'carbonation',
    base.carbonation,
    ours.carbonation,
    theirs.carbonation,
    (b, o, t) => mergeFields(ctx, 'carbonation', b, o, t),
  );
  const style = mergeValue(ctx, 'style', base.style, ours.style, theirs.style);
  if (water) merged.water = water;
  if (carbonation) merged.carbonation = carbonation;
  if (style) merged.style = style;
  return {
    merged,
    conflicts: ctx.conflicts,
    fromTheirs: ctx.fromTheirs,
    taken: ctx.taken,
    inputs: { base, ours, theirs },
  };
}

/** Merges the proposal (`theirs`) into the source's head (`ours`) over their common ancestor (`base`). */
export function mergeDocuments(base: RecipeDocument, ours: RecipeDocument, theirs: RecipeDocument): MergeResult {
  return mergeWith(base, ours, theirs, {});
}

/**
 * The merged document with one pick per conflict. A pick for a path that is not a conflict, or a
 * conflict without a pick, throws a MergePickError naming each path.
 */
export function resolveMerge(result: MergeResult, picks: Readonly<Record<string, string>>): RecipeDocument {
  const open = new Set(result.conflicts.map((c) => c.path));
  const issues: FieldIssue[] = [];
  for (const [path, side] of Object.entries(picks)) {
    if (!open.has(path))
      issues.push({
        path,
        message: `“${describeMergePath(path)}” is not a conflict in this merge; there is nothing to choose there.`,
      });
    else if (side !== 'ours' && side !== 'theirs')
      issues.push({ path, message: `Choose “ours” or “theirs” for ${describeMergePath(path)}.` });
  }
  for (const path of open)
    if (!(path in picks)) issues.push({ path, message: `Choose which side to keep for ${describeMergePath(path)}.` });
  if (issues.length) throw new MergePickError(issues);
  const { base, ours, theirs } = result.inputs;
  const resolved = mergeWith(base, ours, theirs, picks as Picks);
  // Every conflict had a pick, so none is left open (a pick can only settle, never raise one).
  if (resolved.conflicts.length)
    throw new MergePickError(
      resolved.conflicts.map((c) => ({
        path: c.path,
        message: `Choose which side to keep for ${describeMergePath(c.path, c)}.`,
      })),
    );
  return resolved.merged;
}
