import { describe, expect, it } from 'vitest';
import { MAX_INDEXED_NOTES_CHARS, toSearchDocument, type RecipeIndexRow } from './build-document';

function row(overrides: Partial<RecipeIndexRow> = {}): RecipeIndexRow {
  return {
    id: '00000000-0000-4000-8000-000000000001',
    slug: 'hillside-pale-ale-x1',
    title: 'Hillside Pale Ale',
    ownerId: 'user-1',
    ownerName: 'Wren Hollis',
    ownerHandle: 'wren',
    visibility: 'public',
    hiddenAt: null,
    starCount: 3,
    forkCount: 2,
    headNumber: 4,
    createdAt: new Date('2025-03-01T10:00:00Z'),
    updatedAt: new Date('2025-03-05T10:00:00Z'),
    og: 1.0520000457763672,
    fg: 1.0110000371932983,
    abv: 5.381234,
    ibu: 38.46,
    srm: 6.149,
    styleCode: '18B',
    document: {
      style: { code: '18B', name: 'American Pale Ale' },
      fermentables: [{ name: 'Pale ale malt, 2-row' }, { name: 'Munich malt' }, { name: ' Munich malt ' }],
      hops: [{ name: 'Magnum' }, { name: 'Cascade' }, { name: 'Centennial' }, { name: 'cascade' }],
      yeasts: [
        { name: 'Clean ale yeast', kind: 'ale' },
        { name: 'Second ale yeast', kind: 'ale' },
      ],
      notes: 'Dry hop on day 4.',
    },
    ...overrides,
  };
}

describe('toSearchDocument', () => {
  it('builds the index document from the recipe, its head version and its owner', () => {
    expect(toSearchDocument(row())).toEqual({
      id: '00000000-0000-4000-8000-000000000001',
      slug: 'hillside-pale-ale-x1',
      title: 'Hillside Pale Ale',
      ownerId: 'user-1',
      authorName: 'Wren Hollis',
      authorHandle: 'wren',
      styleCode: '18B',
      styleName: 'American Pale Ale',
      styleCategory: 'Pale American Ale',
      fermentables: ['Pale ale malt, 2-row', 'Munich malt'],
      hops: ['Magnum', 'Cascade', 'Centennial'],
      yeasts: ['Clean ale yeast', 'Second ale yeast'],
      yeastKinds: ['ale'],
      notes: 'Dry hop on day 4.',
      og: 1.052,
      fg: 1.011,
      abv: 5.4,
      ibu: 38,
      srm: 6.1,
      stars: 3,
      forks: 2,
      createdAt: Date.parse('2025-03-01T10:00:00Z'),
      updatedAt: Date.parse('2025-03-05T10:00:00Z'),
      visibility: 'public',
      hidden: false,
      headVersion: 4,
    });
  });

  it('marks a hidden recipe and falls back to the handle when the owner has no name', () => {
    const doc = toSearchDocument(row({ hiddenAt: new Date(), ownerName: null }));
    expect(doc.hidden).toBe(true);
    expect(doc.authorName).toBe('wren');
  });

  it('takes the category and canonical code from the style data, whatever the case typed', () => {
    const doc = toSearchDocument(row({ styleCode: '4a', document: { style: { code: '4a', name: 'My helles' } } }));
    expect(doc.styleCode).toBe('4A');
    expect(doc.styleName).toBe('My helles');
    expect(doc.styleCategory).toBe('Pale Malty European Lager');
  });

  it('names the style from the style data when the document gives no name', () => {
    const doc = toSearchDocument(row({ document: { style: { code: '18B' } } }));
    expect(doc.styleName).toBe('American Pale Ale');
  });

  it('indexes a recipe without a style or with an unknown code, leaving the category empty', () => {
    expect(toSearchDocument(row({ styleCode: null, document: {} }))).toMatchObject({
      styleCode: '',
      styleName: '',
      styleCategory: '',
    });
    expect(
      toSearchDocument(row({ styleCode: 'X9', document: { style: { code: 'X9', name: 'House special' } } })),
    ).toMatchObject({
      styleCode: 'X9',
      styleName: 'House special',
      styleCategory: '',
    });
  });

  it('tolerates missing or malformed ingredient lists and caps long notes', () => {
    const doc = toSearchDocument(
      row({
        document: {
          hops: 'none',
          fermentables: [null, { name: 7 }, { name: 'Pilsner malt' }],
          notes: 'x'.repeat(9_000),
        },
      }),
    );
    expect(doc.hops).toEqual([]);
    expect(doc.fermentables).toEqual(['Pilsner malt']);
    expect(doc.yeasts).toEqual([]);
    expect(doc.notes).toHaveLength(MAX_INDEXED_NOTES_CHARS);
  });
});
