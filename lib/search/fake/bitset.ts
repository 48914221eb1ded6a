/** A fixed-size set of document slots, so AND/OR/NOT over filter results are word operations. */
export class Bitset {
  readonly words: Uint32Array;

  constructor(readonly size: number) {
    this.words = new Uint32Array(Math.ceil(size / 32));
  }

  static full(size: number): Bitset {
    const set = new Bitset(size);
    set.words.fill(0xffffffff);
    set.clearTail();
    return set;
  }

  static fromIterable(size: number, slots: Iterable<number>): Bitset {
    const set = new Bitset(size);
    for (const slot of slots) set.add(slot);
    return set;
  }

  add(slot: number): void {
    this.words[slot >>> 5] |= 1 << (slot & 31);
  }

  has(slot: number): boolean {
    return (this.words[slot >>> 5] & (1 << (slot & 31))) !== 0;
  }

  and(other: Bitset): Bitset {
    for (let i = 0; i < this.words.length; i++) this.words[i] &= other.words[i];
    return this;
  }

  or(other: Bitset): Bitset {
    for (let i = 0; i < this.words.length; i++) this.words[i] |= other.words[i];
    return this;
  }

  not(): Bitset {
    for (let i = 0; i < this.words.length; i++) this.words[i] = ~this.words[i];
    this.clearTail();
    return this;
  }

  count(): number {
    let total = 0;
    for (let i = 0; i < this.words.length; i++) total += popcount(this.words[i]);
    return total;
  }

  /** Calls `visit` for each member in ascending order. */
  forEach(visit: (slot: number) => void): void {
    for (let i = 0; i < this.words.length; i++) {
      let word = this.words[i];
      while (word !== 0) {
        const low = word & -word;
        visit((i << 5) + (31 - Math.clz32(low)));
        word ^= low;
      }
    }
  }

  private clearTail(): void {
    const extra = this.words.length * 32 - this.size;
    if (extra > 0) this.words[this.words.length - 1] &= 0xffffffff >>> extra;
  }
}

function popcount(word: number): number {
  let v = word - ((word >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24;
}
