import { describe, expect, it } from 'vitest';
import { FilterSyntaxError, parseFilter, parseFilterString } from './filter';

describe('filter parser', () => {
  it('parses comparisons with bare and quoted values', () => {
    expect(parseFilterString('abv >= 5.5')).toEqual({ kind: 'compare', attribute: 'abv', op: '>=', value: '5.5' });
    expect(parseFilterString(`style = 'Pale Ale'`)).toEqual({
      kind: 'compare',
      attribute: 'style',
      op: '=',
      value: 'Pale Ale',
    });
    expect(parseFilterString('hops="Say \\"hi\\""')).toEqual({
      kind: 'compare',
      attribute: 'hops',
      op: '=',
      value: 'Say "hi"',
    });
  });

  it('binds NOT tighter than AND, and AND tighter than OR', () => {
    expect(parseFilterString('a = 1 OR NOT b = 2 AND c = 3')).toEqual({
      kind: 'or',
      children: [
        { kind: 'compare', attribute: 'a', op: '=', value: '1' },
        {
          kind: 'and',
          children: [
            { kind: 'not', child: { kind: 'compare', attribute: 'b', op: '=', value: '2' } },
            { kind: 'compare', attribute: 'c', op: '=', value: '3' },
          ],
        },
      ],
    });
  });

  it('parses parentheses, TO, IN, EXISTS, IS NULL and IS EMPTY with their negations', () => {
    expect(parseFilterString('(a = 1 OR b = 2) AND c 1 TO 5')).toMatchObject({
      kind: 'and',
      children: [{ kind: 'or' }, { kind: 'range', attribute: 'c', from: '1', to: '5' }],
    });
    expect(parseFilterString('hops IN [Cascade, "East Kent Golding"]')).toEqual({
      kind: 'in',
      attribute: 'hops',
      values: ['Cascade', 'East Kent Golding'],
    });
    expect(parseFilterString('hops NOT IN []')).toEqual({
      kind: 'not',
      child: { kind: 'in', attribute: 'hops', values: [] },
    });
    expect(parseFilterString('notes NOT EXISTS')).toEqual({
      kind: 'not',
      child: { kind: 'exists', attribute: 'notes' },
    });
    expect(parseFilterString('notes IS NOT NULL')).toEqual({
      kind: 'not',
      child: { kind: 'isNull', attribute: 'notes' },
    });
    expect(parseFilterString('notes IS EMPTY')).toEqual({ kind: 'isEmpty', attribute: 'notes' });
  });

  it('treats quoted keywords as values, not operators', () => {
    expect(parseFilterString('hops = "OR"')).toEqual({ kind: 'compare', attribute: 'hops', op: '=', value: 'OR' });
  });

  it('combines the array form: AND of elements, OR inside nested arrays, blanks skipped', () => {
    expect(parseFilter(['a = 1', ['b = 2', 'c = 3'], ''])).toEqual({
      kind: 'and',
      children: [
        { kind: 'compare', attribute: 'a', op: '=', value: '1' },
        {
          kind: 'or',
          children: [
            { kind: 'compare', attribute: 'b', op: '=', value: '2' },
            { kind: 'compare', attribute: 'c', op: '=', value: '3' },
          ],
        },
      ],
    });
    expect(parseFilter('  ')).toBeNull();
  });

  it.each(['a =', 'a = 1 AND', 'a = 1 b = 2', '(a = 1', 'a IN [1, 2', 'a = "open', 'AND a = 1', 'a ! 1', 'a 1 TO'])(
    'refuses %s with its position',
    (source) => {
      expect(() => parseFilterString(source)).toThrow(FilterSyntaxError);
    },
  );

  it('keeps a quoted hostile value as one literal', () => {
    expect(parseFilterString('hops = "Cascade\\" OR hidden = true OR x=\\""')).toEqual({
      kind: 'compare',
      attribute: 'hops',
      op: '=',
      value: 'Cascade" OR hidden = true OR x="',
    });
  });
});
