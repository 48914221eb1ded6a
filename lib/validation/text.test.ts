import { describe, expect, it } from 'vitest';
import { findUnstorableText, isStorableText } from './text';

// A NUL character cannot be stored in PostgreSQL text or JSONB (PostgreSQL documentation, "Character
// Types" and "JSON Types"), and a lone UTF-16 surrogate is not a Unicode scalar value (The Unicode
// Standard, ch. 3, D76), so neither is storable.
describe('storable text', () => {
  it('accepts ordinary text, accents and characters outside the basic plane (a surrogate pair)', () => {
    expect(isStorableText('Brasserie ale, 5 °P, brewed at Ærø 🍺')).toBe(true);
  });

  it('refuses a NUL byte and a lone surrogate of either kind', () => {
    expect(isStorableText('a\u0000b')).toBe(false);
    expect(isStorableText('a\ud800b')).toBe(false);
    expect(isStorableText('a\udc00b')).toBe(false);
    expect(isStorableText('end \ud83c')).toBe(false);
  });

  it('names the first bad field of a nested value by its dotted path', () => {
    expect(findUnstorableText({ document: { hops: [{ name: 'Cascade' }, { name: 'Fuggle\u0000' }] } })).toBe(
      'document.hops.1.name',
    );
    expect(findUnstorableText({ ok: 'yes', n: 3, list: [null, true] })).toBeNull();
  });

  it('walks very deep values without recursion and reports them as too deep', () => {
    const deep = JSON.parse('['.repeat(50_000) + ']'.repeat(50_000));
    expect(findUnstorableText(deep)).toEqual({ tooDeep: true });
    expect(findUnstorableText(JSON.parse('{"a":'.repeat(20) + '"ok"' + '}'.repeat(20)))).toBeNull();
  });
});
