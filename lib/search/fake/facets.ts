/**
 * Lookup structures for one filterable attribute, kept compact for tens of thousands
 * of documents: each distinct value gets an id, each slot holds its value id in a typed
 * array (or a small list when it has several), and flags record EXISTS / NULL / EMPTY.
 * Equality, IN and ranges pick the matching value ids first, then scan the slots once;
 * facet counts walk only the matched slots.
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

const NO_VALUE = -1;
const SEVERAL_VALUES = -2;
const EXISTS = 1;
const NULL = 2;
const EMPTY = 4;

export class FacetIndex {
  /** Per slot: a value id, NO_VALUE, or SEVERAL_VALUES (then see `several`). */
  private ids = new Int32Array(1024).fill(NO_VALUE);
  private flags = new Uint8Array(1024);
  private readonly several: Array<number[] | undefined> = [];
  /** Value table: id → display label (the first spelling seen) and the number it stands for (NaN for text). */
  private readonly labels: string[] = [];
  private readonly numbers: number[] = [];
  private readonly idByKey = new Map<string, number>();

  add(slot: number, raw: unknown): void {
    if (raw === undefined) return;
    this.ensureCapacity(slot + 1);
    this.flags[slot] = EXISTS | (raw === null ? NULL : 0) | (isEmptyValue(raw) ? EMPTY : 0);
    const ids = [...new Set(facetScalars(raw).map((scalar) => this.valueId(scalar)))];
    if (ids.length === 1) this.ids[slot] = ids[0];
    else if (ids.length > 1) {
      this.ids[slot] = SEVERAL_VALUES;
      this.several[slot] = ids;
    }
  }

  remove(slot: number): void {
    if (slot >= this.ids.length) return;
    this.ids[slot] = NO_VALUE;
    this.flags[slot] = 0;
    this.several[slot] = undefined;
  }

  /** Slots holding `value`, compared as text (case-insensitive) and, when it reads as a number, as a number. */
  equals(values: string[], capacity: number): Bitset {
    const wanted = new Uint8Array(this.labels.length);
    for (const value of values) {
      const textId = this.idByKey.get(`s:${normalizeFacetString(value)}`);
      if (textId !== undefined) wanted[textId] = 1;
      const n = parseNumber(value);
      const numberId = n === null ? undefined : this.idByKey.get(`n:${n}`);
      if (numberId !== undefined) wanted[numberId] = 1;
    }
    return this.slotsWith(wanted, capacity);
  }

  range(from: number, fromInclusive: boolean, to: number, toInclusive: boolean, capacity: number): Bitset {
    const wanted = new Uint8Array(this.labels.length);
    this.numbers.forEach((n, id) => {
      const aboveFrom = fromInclusive ? n >= from : n > from;
      const belowTo = toInclusive ? n <= to : n < to;
      if (aboveFrom && belowTo) wanted[id] = 1;
    });
    return this.slotsWith(wanted, capacity);
  }

  exists(capacity: number): Bitset {
    return this.slotsFlagged(EXISTS, capacity);
  }

  isNull(capacity: number): Bitset {
    return this.slotsFlagged(NULL, capacity);
  }

  isEmpty(capacity: number): Bitset {
    return this.slotsFlagged(EMPTY, capacity);
  }

  /** Counts facet values over `slots`; numeric values also yield min/max. */
  distribution(slots: ArrayLike<number>): { counts: Map<string, number>; stats: { min: number; max: number } | null } {
    const tally = new Int32Array(this.labels.length);
    for (let i = 0; i < slots.length; i++) {
      const slot = slots[i];
      const id = slot < this.ids.length ? this.ids[slot] : NO_VALUE;
      if (id >= 0) tally[id]++;
      else if (id === SEVERAL_VALUES) for (const each of this.several[slot] ?? []) tally[each]++;
    }
    const counts = new Map<string, number>();
    let min = Infinity;
    let max = -Infinity;
    tally.forEach((count, id) => {
      if (count === 0) return;
      counts.set(this.labels[id], count);
      const n = this.numbers[id];
      if (n < min) min = n;
      if (n > max) max = n;
    });
    return { counts, stats: min <= max ? { min, max } : null };
  }

  private slotsWith(wanted: Uint8Array, capacity: number): Bitset {
    const set = new Bitset(capacity);
    const end = Math.min(capacity, this.ids.length);
    for (let slot = 0; slot < end; slot++) {
      const id = this.ids[slot];
      if (id >= 0) {
        if (wanted[id] === 1) set.add(slot);
      } else if (id === SEVERAL_VALUES && this.several[slot]?.some((each) => wanted[each] === 1)) {
        set.add(slot);
      }
    }
    return set;
  }

  private slotsFlagged(flag: number, capacity: number): Bitset {
    const set = new Bitset(capacity);
    const end = Math.min(capacity, this.flags.length);
    for (let slot = 0; slot < end; slot++) if ((this.flags[slot] & flag) !== 0) set.add(slot);
    return set;
  }

  private valueId(scalar: FacetScalar): number {
    const key = typeof scalar === 'number' ? `n:${scalar}` : `s:${normalizeFacetString(scalar)}`;
    let id = this.idByKey.get(key);
    if (id === undefined) {
      id = this.labels.length;
      this.idByKey.set(key, id);
      this.labels.push(String(scalar));
      this.numbers.push(typeof scalar === 'number' ? scalar : NaN);
    }
    return id;
  }

  private ensureCapacity(size: number): void {
    if (size <= this.ids.length) return;
    const length = Math.max(size, this.ids.length * 2);
    const ids = new Int32Array(length).fill(NO_VALUE);
    ids.set(this.ids);
    const flags = new Uint8Array(length);
    flags.set(this.flags);
    this.ids = ids;
    this.flags = flags;
  }
}

export function parseNumber(text: string): number | null {
  if (text.trim() === '') return null;
  const n = Number(text);
  return Number.isFinite(n) ? n : null;
}
