/**
 * Per-attribute lookup structures for one filterable attribute: value → slots for
 * equality, a lazily sorted numeric column for ranges, and per-slot value ids so
 * facet counts are a walk over the matched slots.
 */
import { Bitset } from './bitset';

export function normalizeFacetString(value: string): string {
  return value.trim().toLowerCase();
}

type FacetScalar = string | number;

/** Flattens a document value into the scalar facet values it carries (booleans become "true"/"false"). */
function facetScalars(raw: unknown): FacetScalar[] {
  if (raw === null || raw === undefined) return [];
  if (Array.isArray(raw)) return raw.flatMap(facetScalars);
  if (typeof raw === 'number') return Number.isFinite(raw) ? [raw] : [];
  if (typeof raw === 'boolean') return [String(raw)];
  if (typeof raw === 'string') return [raw];
  return [];
}

function isEmptyValue(raw: unknown): boolean {
  if (raw === '') return true;
  if (Array.isArray(raw)) return raw.length === 0;
  return typeof raw === 'object' && raw !== null && Object.keys(raw).length === 0;
}

interface NumericColumn {
  values: Float64Array;
  slots: Int32Array;
}

export class FacetIndex {
  private readonly bySlotValueIds: Array<number[] | undefined> = [];
  private readonly stringSlots = new Map<string, Set<number>>();
  private readonly numberBySlot = new Map<number, number[]>();
  private readonly existing = new Set<number>();
  private readonly nulls = new Set<number>();
  private readonly empties = new Set<number>();
  /** Facet value table: id → display label (the first spelling seen). */
  private readonly labels: string[] = [];
  /** The number a numeric facet value stands for; NaN for strings. */
  private readonly numericValue: number[] = [];
  private readonly idByKey = new Map<string, number>();
  private column: NumericColumn | null = null;

  add(slot: number, raw: unknown): void {
    if (raw === undefined) return;
    this.existing.add(slot);
    if (raw === null) this.nulls.add(slot);
    if (isEmptyValue(raw)) this.empties.add(slot);
    const ids: number[] = [];
    const numbers: number[] = [];
    for (const scalar of facetScalars(raw)) {
      if (typeof scalar === 'number') {
        numbers.push(scalar);
        ids.push(this.valueId(`n:${scalar}`, String(scalar), scalar));
      } else {
        const key = normalizeFacetString(scalar);
        addToMap(this.stringSlots, key, slot);
        ids.push(this.valueId(`s:${key}`, scalar, NaN));
      }
    }
    if (numbers.length > 0) {
      this.numberBySlot.set(slot, numbers);
      this.column = null;
    }
    this.bySlotValueIds[slot] = ids.length > 0 ? [...new Set(ids)] : undefined;
  }

  remove(slot: number, raw: unknown): void {
    if (raw === undefined) return;
    this.existing.delete(slot);
    this.nulls.delete(slot);
    this.empties.delete(slot);
    for (const scalar of facetScalars(raw)) {
      if (typeof scalar === 'string') this.stringSlots.get(normalizeFacetString(scalar))?.delete(slot);
    }
    if (this.numberBySlot.delete(slot)) this.column = null;
    this.bySlotValueIds[slot] = undefined;
  }

  equals(value: string, capacity: number): Bitset {
    const set = Bitset.fromIterable(capacity, this.stringSlots.get(normalizeFacetString(value)) ?? []);
    const asNumber = parseNumber(value);
    if (asNumber !== null) set.or(this.range(asNumber, true, asNumber, true, capacity));
    return set;
  }

  range(from: number, fromInclusive: boolean, to: number, toInclusive: boolean, capacity: number): Bitset {
    const { values, slots } = this.numericColumn();
    const set = new Bitset(capacity);
    let i = fromInclusive ? lowerBound(values, from) : upperBound(values, from);
    for (; i < values.length; i++) {
      const v = values[i];
      if (v > to || (!toInclusive && v === to)) break;
      set.add(slots[i]);
    }
    return set;
  }

  exists(capacity: number): Bitset {
    return Bitset.fromIterable(capacity, this.existing);
  }

  isNull(capacity: number): Bitset {
    return Bitset.fromIterable(capacity, this.nulls);
  }

  isEmpty(capacity: number): Bitset {
    return Bitset.fromIterable(capacity, this.empties);
  }

  /** Counts facet values over `slots`; numeric values also yield min/max. */
  distribution(slots: ArrayLike<number>): { counts: Map<string, number>; stats: { min: number; max: number } | null } {
    const tally = new Int32Array(this.labels.length);
    let min = Infinity;
    let max = -Infinity;
    for (let i = 0; i < slots.length; i++) {
      const ids = this.bySlotValueIds[slots[i]];
      if (ids === undefined) continue;
      for (const id of ids) {
        tally[id]++;
        const n = this.numericValue[id];
        if (!Number.isNaN(n)) {
          if (n < min) min = n;
          if (n > max) max = n;
        }
      }
    }
    const counts = new Map<string, number>();
    tally.forEach((count, id) => {
      if (count > 0) counts.set(this.labels[id], count);
    });
    return { counts, stats: min <= max ? { min, max } : null };
  }

  private valueId(key: string, label: string, numeric: number): number {
    let id = this.idByKey.get(key);
    if (id === undefined) {
      id = this.labels.length;
      this.idByKey.set(key, id);
      this.labels.push(label);
      this.numericValue.push(numeric);
    }
    return id;
  }

  private numericColumn(): NumericColumn {
    if (this.column) return this.column;
    const pairs: Array<[number, number]> = [];
    for (const [slot, numbers] of this.numberBySlot) for (const n of numbers) pairs.push([n, slot]);
    pairs.sort((a, b) => a[0] - b[0]);
    this.column = {
      values: Float64Array.from(pairs, (p) => p[0]),
      slots: Int32Array.from(pairs, (p) => p[1]),
    };
    return this.column;
  }
}

function addToMap(map: Map<string, Set<number>>, key: string, slot: number): void {
  let set = map.get(key);
  if (!set) {
    set = new Set();
    map.set(key, set);
  }
  set.add(slot);
}

export function parseNumber(text: string): number | null {
  if (text.trim() === '') return null;
  const n = Number(text);
  return Number.isFinite(n) ? n : null;
}

function lowerBound(values: Float64Array, target: number): number {
  let lo = 0;
  let hi = values.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (values[mid] < target) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function upperBound(values: Float64Array, target: number): number {
  let lo = 0;
  let hi = values.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (values[mid] <= target) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
