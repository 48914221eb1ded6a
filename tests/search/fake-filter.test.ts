import { MeilisearchApiError, type Filter } from 'meilisearch';
import { describe, expect, it } from 'vitest';
import { fakeAroundTests } from './fixtures';

const BEERS = [
  {
    id: 'pale',
    title: 'Porch Pale',
    style: 'Pale Ale',
    hops: ['Cascade', 'Centennial'],
    abv: 5.2,
    ibu: 40,
    dry: true,
    notes: 'citrus',
  },
  { id: 'lager', title: 'Meadow Lager', style: 'Lager', hops: ['Saaz'], abv: 4.6, ibu: 22, dry: false, notes: null },
  {
    id: 'stout',
    title: 'Night Stout',
    style: 'Stout',
    hops: ['Fuggle', 'East Kent Golding'],
    abv: 6.8,
    ibu: 35,
    dry: false,
  },
  {
    id: 'ipa',
    title: 'Ridge IPA',
    style: 'IPA',
    hops: ['Chinook', 'Cascade'],
    abv: 7.1,
    ibu: 65,
    dry: true,
    notes: '',
  },
  {
    id: 'weiss',
    title: 'Wheat Field',
    style: 'Weissbier',
    hops: ['Hallertau Mittelfrüh'],
    abv: 5.0,
    ibu: 12,
    dry: false,
    notes: 'banana',
  },
  { id: 'quote', title: 'Odd Name', style: 'Say "hi" \\ bye', hops: [], abv: 3.9, ibu: 18, dry: false },
];

const fake = fakeAroundTests({
  setup: async ({ client }) => {
    const index = client.index('filters');
    await index.updateSettings({ filterableAttributes: ['style', 'hops', 'abv', 'ibu', 'dry', 'notes'] }).waitTask();
    await index.addDocuments(BEERS, { primaryKey: 'id' }).waitTask();
  },
});

async function ids(filter: Filter): Promise<string[]> {
  const { hits } = await fake.client.index('filters').search('', { filter, limit: 100 });
  return hits.map((hit) => hit.id as string).sort();
}

describe('comparison operators', () => {
  it.each([
    ['abv = 5.2', ['pale']],
    ['abv != 5.2', ['ipa', 'lager', 'quote', 'stout', 'weiss']],
    ['abv > 5.2', ['ipa', 'stout']],
    ['abv >= 5.2', ['ipa', 'pale', 'stout']],
    ['abv < 4.6', ['quote']],
    ['abv <= 4.6', ['lager', 'quote']],
    ['ibu 20 TO 40', ['lager', 'pale', 'stout']],
    ['style = Lager', ['lager']],
    ['style = "pale ale"', ['pale']],
    ["style = 'Pale Ale'", ['pale']],
    ['style != Lager', ['ipa', 'pale', 'quote', 'stout', 'weiss']],
    ['hops = cascade', ['ipa', 'pale']],
    ['hops = "East Kent Golding"', ['stout']],
    ['dry = true', ['ipa', 'pale']],
    ['dry = false', ['lager', 'quote', 'stout', 'weiss']],
  ])('%s', async (filter, expected) => {
    expect(await ids(filter)).toEqual(expected);
  });
});

describe('IN, EXISTS, NULL and EMPTY', () => {
  it.each([
    ['style IN [Lager, Stout]', ['lager', 'stout']],
    ['hops IN ["Saaz", "Chinook"]', ['ipa', 'lager']],
    ['abv IN [5, 4.6]', ['lager', 'weiss']],
    ['hops NOT IN [Cascade, Saaz]', ['quote', 'stout', 'weiss']],
    ['notes EXISTS', ['ipa', 'lager', 'pale', 'weiss']],
    ['notes NOT EXISTS', ['quote', 'stout']],
    ['NOT notes EXISTS', ['quote', 'stout']],
    ['notes IS NULL', ['lager']],
    ['notes IS NOT NULL', ['ipa', 'pale', 'quote', 'stout', 'weiss']],
    ['notes IS EMPTY', ['ipa']],
    ['hops IS EMPTY', ['quote']],
  ])('%s', async (filter, expected) => {
    expect(await ids(filter)).toEqual(expected);
  });
});

describe('logical operators', () => {
  it.each([
    ['hops = Cascade AND abv > 6', ['ipa']],
    ['style = Lager OR style = Stout', ['lager', 'stout']],
    ['NOT hops = Cascade', ['lager', 'quote', 'stout', 'weiss']],
    ['NOT (abv > 5 OR ibu < 15)', ['lager', 'quote']],
    ['hops = Cascade OR hops = Saaz AND abv > 5', ['ipa', 'pale']],
    ['(hops = Cascade OR hops = Saaz) AND abv < 5', ['lager']],
    ['dry = false AND NOT style IN [Lager, Stout] AND abv 3 TO 5', ['quote', 'weiss']],
  ])('%s', async (filter, expected) => {
    expect(await ids(filter)).toEqual(expected);
  });

  it('treats the array form as AND of elements and nested arrays as OR', async () => {
    expect(await ids(['dry = false', ['style = Lager', 'style = Stout']])).toEqual(['lager', 'stout']);
    expect(await ids([['hops = Saaz', 'hops = Chinook'], 'abv > 5'])).toEqual(['ipa']);
  });

  it('matches quoted values holding quotes and backslashes', async () => {
    expect(await ids('style = "Say \\"hi\\" \\\\ bye"')).toEqual(['quote']);
  });

  it('matches values with diacritics and in any letter case', async () => {
    expect(await ids('hops = "hallertau mittelfrüh"')).toEqual(['weiss']);
  });
});

describe('invalid filters', () => {
  it.each([
    'abv >',
    'abv = 5 AND',
    '(abv = 5',
    'style = "unterminated',
    'hops IN [Cascade',
    'abv > strong',
    'colour = red',
    'abv == 5',
  ])('%s is refused with invalid_search_filter', async (filter) => {
    const error = await fake.client
      .index('filters')
      .search('', { filter })
      .then(
        () => null,
        (caught: unknown) => caught,
      );
    expect(error).toBeInstanceOf(MeilisearchApiError);
    const apiError = error as MeilisearchApiError;
    expect(apiError.response.status).toBe(400);
    expect(apiError.cause).toMatchObject({ code: 'invalid_search_filter', type: 'invalid_request' });
    expect(apiError.cause?.link).toContain('invalid_search_filter');
  });

  it('names the attribute that is not filterable', async () => {
    await expect(fake.client.index('filters').search('', { filter: 'title = x' })).rejects.toThrow(
      /`title` is not filterable/,
    );
  });
});
