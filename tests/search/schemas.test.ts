import { describe, expect, it } from 'vitest';
import {
  parseRecipeSearchQuery,
  parseSearchParams,
  parseSearchParamsLeniently,
  serializeSearchQuery,
} from '../../lib/search/schemas';

const parse = (query: string) => parseSearchParams(new URLSearchParams(query));

function errorsOf(query: string) {
  const result = parse(query);
  if (result.success) throw new Error(`expected ${query} to be refused`);
  return result.fieldErrors;
}

describe('search query parsing', () => {
  it('fills defaults for an empty query', () => {
    expect(parse('')).toEqual({
      success: true,
      data: { q: '', style: [], hop: [], malt: [], yeast: [], sort: 'relevance', page: 1 },
    });
  });

  it('reads repeated keys as lists and numbers from text', () => {
    const result = parse(
      'q=citrus+pale&style=18B&style=21A&hop=Cascade&hop=East+Kent+Golding&yeast=kveik&abvMin=4.5&abvMax=6&ogMin=1.04&sort=stars&page=3',
    );
    expect(result).toEqual({
      success: true,
      data: {
        q: 'citrus pale',
        style: ['18B', '21A'],
        hop: ['Cascade', 'East Kent Golding'],
        malt: [],
        yeast: ['kveik'],
        abvMin: 4.5,
        abvMax: 6,
        ogMin: 1.04,
        sort: 'stars',
        page: 3,
      },
    });
  });

  it('ignores blank values', () => {
    expect(parse('q=&hop=&abvMin=&page=')).toMatchObject({ success: true, data: { q: '', hop: [], page: 1 } });
  });
});

describe('search query refusals name the field', () => {
  it('refuses over-long text', () => {
    expect(errorsOf(`q=${'a'.repeat(201)}`).q).toEqual(['q must be at most 200 characters']);
  });

  it('refuses an inverted range', () => {
    expect(errorsOf('abvMin=7&abvMax=5').abvMin).toEqual(['abvMin must not be greater than abvMax']);
    expect(errorsOf('ibuMin=60&ibuMax=10').ibuMin).toEqual(['ibuMin must not be greater than ibuMax']);
  });

  it('refuses out-of-bounds and non-numeric ranges', () => {
    expect(errorsOf('abvMax=80').abvMax).toEqual(['abvMax must be at most 25']);
    expect(errorsOf('srmMin=-1').srmMin).toEqual(['srmMin must be at least 0']);
    expect(errorsOf('ogMin=strong').ogMin).toEqual(['ogMin must be a number']);
  });

  it.each(['page=0', 'page=1001', 'page=2.5', 'page=next'])('refuses %s', (query) => {
    expect(errorsOf(query).page).toEqual(['page must be a whole number from 1 to 1000']);
  });

  it('refuses an unknown sort', () => {
    expect(errorsOf('sort=cheapest').sort).toEqual(['sort must be one of relevance, newest, stars, forks']);
  });

  it('refuses too many or too long values', () => {
    const many = Array.from({ length: 21 }, (_, i) => `hop=h${i}`).join('&');
    expect(errorsOf(many).hop).toEqual(['hop accepts at most 20 values']);
    expect(errorsOf(`malt=${'m'.repeat(101)}`).malt).toEqual(['malt values must be at most 100 characters']);
    expect(errorsOf('style=21A%22%20OR').style?.[0]).toMatch(/^style values must be style codes/);
  });

  it('returns every field’s error at once', () => {
    const errors = errorsOf(`q=${'a'.repeat(201)}&sort=cheapest&page=0`);
    expect(Object.keys(errors).sort()).toEqual(['page', 'q', 'sort']);
  });

  it('checks JSON input the same way', () => {
    expect(parseRecipeSearchQuery({ page: 2000 })).toMatchObject({
      success: false,
      fieldErrors: { page: ['page must be a whole number from 1 to 1000'] },
    });
  });
});

describe('serializing back to the URL', () => {
  it('round-trips a full query and leaves out defaults', () => {
    const source =
      'q=citrus+pale&style=18B&hop=Cascade&hop=Saaz&malt=Munich&yeast=lager&abvMin=4.5&ibuMax=40&srmMin=3&ogMax=1.06&page=2&sort=newest';
    const parsed = parse(source);
    if (!parsed.success) throw new Error('expected a valid query');
    const serialized = serializeSearchQuery(parsed.data);
    expect(parse(serialized)).toEqual(parsed);
    expect(serializeSearchQuery({ q: '', sort: 'relevance', page: 1 })).toBe('');
  });
});

describe('reading a hand-edited search address', () => {
  it('searches with the usable parts and names the parts left out', () => {
    const { query, ignored } = parseSearchParamsLeniently(
      new URLSearchParams('q=pale&hop=Saaz&abvMin=7&abvMax=4&sort=oldest&page=0'),
    );
    expect(query).toMatchObject({ q: 'pale', hop: ['Saaz'], sort: 'relevance', page: 1 });
    expect([query.abvMin, query.abvMax]).toEqual([undefined, undefined]);
    expect(ignored.map((entry) => entry.field).sort()).toEqual(['abvMin', 'page', 'sort']);
    expect(ignored.find((entry) => entry.field === 'abvMin')?.messages).toEqual([
      'abvMin must not be greater than abvMax',
    ]);
  });

  it('leaves a clean address untouched', () => {
    const params = new URLSearchParams('q=porter&style=20A&ibuMax=40');
    expect(parseSearchParamsLeniently(params)).toEqual({
      query: (parseSearchParams(params) as { data: unknown }).data,
      ignored: [],
    });
  });
});
