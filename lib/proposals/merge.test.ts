import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, type RecipeDocument } from '@/lib/brewing';
import { examplePaleAle } from '@/lib/brewing/test-fixtures';
import { MergePickError, mergeDocuments, resolveMerge } from './merge';
import { describeConflict, describeMergePath, describeTaken } from './merge-words';

/** Three copies of the example pale ale: the common ancestor, the source's head and the proposal. */
function three(change: { ours?: (d: RecipeDocument) => void; theirs?: (d: RecipeDocument) => void } = {}) {
  const base = examplePaleAle();
  const ours = examplePaleAle();
  const theirs = examplePaleAle();
  change.ours?.(ours);
  change.theirs?.(theirs);
  return { base, ours, theirs };
}

function merge(docs: ReturnType<typeof three>) {
  return mergeDocuments(docs.base, docs.ours, docs.theirs);
}

function expectValid(doc: RecipeDocument) {
  const parsed = recipeDocumentSchema.safeParse(doc);
  expect(parsed.success, parsed.success ? '' : JSON.stringify(parsed.error.issues)).toBe(true);
}

const names = (items: { name: string }[]) => items.map((i) => i.name);

describe('mergeDocuments', () => {
  it('takes a change made on one side only, from either side', () => {
    const docs = three({ ours: (d) => void (d.batch.volumeL = 23), theirs: (d) => void (d.mash.steps[0].tempC = 68) });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.batch.volumeL).toBe(23);
    expect(result.merged.mash.steps[0].tempC).toBe(68);
    expect(result.fromTheirs).toEqual(['mash.steps[0].tempC']);
    expectValid(result.merged);
  });

  it('takes the same change made on both sides once, without a conflict', () => {
    const docs = three({ ours: (d) => void (d.hops[0].amountG = 24), theirs: (d) => void (d.hops[0].amountG = 24) });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.hops[0].amountG).toBe(24);
    expect(result.merged.hops).toHaveLength(4);
    expectValid(result.merged);
  });

  it('lists a field both sides changed differently as a conflict with all three values', () => {
    const docs = three({
      ours: (d) => void (d.mash.steps[0].tempC = 65),
      theirs: (d) => void (d.mash.steps[0].tempC = 68),
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([{ path: 'mash.steps[0].tempC', base: 66, ours: 65, theirs: 68 }]);
    // Until a pick, the merged document keeps the source's value.
    expect(result.merged.mash.steps[0].tempC).toBe(65);
    expectValid(result.merged);
    expect(resolveMerge(result, { 'mash.steps[0].tempC': 'theirs' }).mash.steps[0].tempC).toBe(68);
    expect(resolveMerge(result, { 'mash.steps[0].tempC': 'ours' }).mash.steps[0].tempC).toBe(65);
  });

  it('merges ingredients added and removed on each side item by item', () => {
    const docs = three({
      ours: (d) => {
        d.fermentables.push({ name: 'Wheat malt', amountKg: 0.3, potentialPpg: 37, colorLovibond: 2, kind: 'grain' });
        d.hops = d.hops.filter((h) => h.name !== 'Magnum');
      },
      theirs: (d) => {
        d.fermentables = d.fermentables.filter((f) => f.name !== 'Crystal malt 40 °L');
        d.hops.push({ name: 'Chinook', amountG: 15, alphaPct: 13, use: 'boil', timeMin: 60, form: 'pellet' });
      },
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(names(result.merged.fermentables)).toEqual(['Pale ale malt, 2-row', 'Munich malt', 'Wheat malt']);
    expect(result.merged.hops.map((h) => `${h.name}|${h.use}`)).toEqual([
      'Cascade|boil',
      'Centennial|whirlpool',
      'Cascade|dry_hop',
      'Chinook|boil',
    ]);
    expectValid(result.merged);
  });

  it('matches hops by name and use, so a boil addition and a dry hop of one variety stay apart', () => {
    const docs = three({
      ours: (d) => void (d.hops.find((h) => h.name === 'Cascade' && h.use === 'boil')!.amountG = 30),
      theirs: (d) => void (d.hops.find((h) => h.name === 'Cascade' && h.use === 'dry_hop')!.amountG = 80),
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.hops.find((h) => h.name === 'Cascade' && h.use === 'boil')!.amountG).toBe(30);
    expect(result.merged.hops.find((h) => h.name === 'Cascade' && h.use === 'dry_hop')!.amountG).toBe(80);
  });

  it('keeps an ingredient added identically on both sides once', () => {
    const wheat = { name: 'Wheat malt', amountKg: 0.3, potentialPpg: 37, colorLovibond: 2, kind: 'grain' as const };
    const docs = three({
      ours: (d) => void d.fermentables.push({ ...wheat }),
      theirs: (d) => void d.fermentables.push({ ...wheat }),
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.fermentables.filter((f) => f.name === 'Wheat malt')).toHaveLength(1);
    expectValid(result.merged);
  });

  it('lists the fields of an ingredient added on both sides with different amounts as conflicts', () => {
    const wheat = { name: 'Wheat malt', amountKg: 0.3, potentialPpg: 37, colorLovibond: 2, kind: 'grain' as const };
    const docs = three({
      ours: (d) => void d.fermentables.push({ ...wheat }),
      theirs: (d) => void d.fermentables.push({ ...wheat, amountKg: 0.5 }),
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([
      { path: 'fermentables[wheat malt].amountKg', base: undefined, ours: 0.3, theirs: 0.5 },
    ]);
    const resolved = resolveMerge(result, { 'fermentables[wheat malt].amountKg': 'theirs' });
    expect(resolved.fermentables.find((f) => f.name === 'Wheat malt')!.amountKg).toBe(0.5);
    expectValid(resolved);
  });

  it('treats an ingredient removed on one side and changed on the other as a conflict about the whole item', () => {
    const docs = three({
      ours: (d) => void (d.fermentables = d.fermentables.filter((f) => f.name !== 'Munich malt')),
      theirs: (d) => void (d.fermentables.find((f) => f.name === 'Munich malt')!.amountKg = 0.6),
    });
    const result = merge(docs);
    expect(result.conflicts).toHaveLength(1);
    expect(result.conflicts[0]).toMatchObject({
      path: 'fermentables[munich malt]',
      ours: undefined,
      theirs: { name: 'Munich malt', amountKg: 0.6 },
    });
    expect(names(result.merged.fermentables)).not.toContain('Munich malt');
    expect(names(resolveMerge(result, { 'fermentables[munich malt]': 'theirs' }).fermentables)).toContain(
      'Munich malt',
    );
    const keptOut = resolveMerge(result, { 'fermentables[munich malt]': 'ours' });
    expect(names(keptOut.fermentables)).not.toContain('Munich malt');
    expectValid(keptOut);
  });

  it('drops an ingredient removed on one side when the other side left it alone', () => {
    const docs = three({
      theirs: (d) =>
        void (d.yeasts = [{ name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 38 }]),
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(names(result.merged.yeasts)).toEqual(['Kveik']);
    expectValid(result.merged);
  });

  it('matches mash and fermentation steps by position, with added steps on one side', () => {
    const docs = three({
      ours: (d) => void d.mash.steps.unshift({ name: 'Protein rest', tempC: 52, timeMin: 15 }),
      theirs: (d) => void d.fermentation.steps.push({ tempC: 1, days: 7 }),
    });
    const result = merge(docs);
    // Inserting at the front moves every later step by one: each position changed on our side only.
    expect(result.conflicts).toEqual([]);
    expect(result.merged.mash.steps.map((s) => s.tempC)).toEqual([52, 66, 76]);
    expect(result.merged.fermentation.steps).toHaveLength(3);
    expectValid(result.merged);
  });

  it('treats notes as one field: one side changed merges, both changed is a conflict', () => {
    const oneSide = merge(three({ theirs: (d) => void (d.notes = 'Hotter mash for body.') }));
    expect(oneSide.conflicts).toEqual([]);
    expect(oneSide.merged.notes).toBe('Hotter mash for body.');
    const both = merge(three({ ours: (d) => void (d.notes = 'Ours.'), theirs: (d) => void (d.notes = 'Theirs.') }));
    expect(both.conflicts.map((c) => c.path)).toEqual(['notes']);
    expect(resolveMerge(both, { notes: 'theirs' }).notes).toBe('Theirs.');
  });

  it('merges water salts by salt and source ions field by field', () => {
    const docs = three({
      ours: (d) => void (d.water!.source.calcium = 40),
      theirs: (d) => {
        d.water!.salts.push({ salt: 'epsom', grams: 2 });
        d.water!.salts = d.water!.salts.filter((s) => s.salt !== 'calcium_chloride');
      },
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.water!.source.calcium).toBe(40);
    expect(result.merged.water!.salts.map((s) => s.salt)).toEqual(['gypsum', 'epsom']);
    expectValid(result.merged);
  });

  it('treats water present on one side only as a whole field', () => {
    const docs = three({ theirs: (d) => void delete d.water });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged.water).toBeUndefined();
    expectValid(result.merged);
  });

  it('keeps the source title whatever the fork is called', () => {
    const result = merge(three({ theirs: (d) => void (d.title = 'My kveik take') }));
    expect(result.merged.title).toBe('Hillside Pale Ale');
    expect(result.conflicts).toEqual([]);
  });

  it('gives the proposal whole when the source has not moved', () => {
    const docs = three({
      theirs: (d) => {
        d.yeasts[0] = { name: 'Kveik', kind: 'kveik', attenuationPct: 80 };
        d.fermentation.steps = [{ tempC: 32, days: 5 }];
      },
    });
    const result = merge(docs);
    expect(result.conflicts).toEqual([]);
    expect(result.merged).toEqual({ ...docs.theirs, title: docs.ours.title });
  });
});

describe('resolveMerge', () => {
  const conflicted = () =>
    merge(
      three({
        ours: (d) => {
          d.mash.steps[0].tempC = 65;
          d.notes = 'Ours.';
        },
        theirs: (d) => {
          d.mash.steps[0].tempC = 68;
          d.notes = 'Theirs.';
        },
      }),
    );

  it('refuses a merge with a conflict left unpicked, naming it', () => {
    const error = (() => {
      try {
        resolveMerge(conflicted(), { notes: 'ours' });
      } catch (err) {
        return err as MergePickError;
      }
    })();
    expect(error).toBeInstanceOf(MergePickError);
    expect(error!.issues).toEqual([
      { path: 'mash.steps[0].tempC', message: expect.stringContaining('Choose which side') },
    ]);
  });

  it('refuses a pick for a path that is not a conflict, naming it', () => {
    expect(() =>
      resolveMerge(conflicted(), { notes: 'ours', 'mash.steps[0].tempC': 'ours', 'batch.volumeL': 'theirs' }),
    ).toThrow(/batch\.volumeL.*not a conflict/);
  });

  it('refuses a pick that is neither side', () => {
    expect(() => resolveMerge(conflicted(), { notes: 'both', 'mash.steps[0].tempC': 'ours' })).toThrow(
      /Choose “ours” or “theirs”/,
    );
  });

  it('applies a mix of picks and always gives a valid document', () => {
    const doc = resolveMerge(conflicted(), { notes: 'ours', 'mash.steps[0].tempC': 'theirs' });
    expect(doc.notes).toBe('Ours.');
    expect(doc.mash.steps[0].tempC).toBe(68);
    expectValid(doc);
  });
});

describe('describeMergePath', () => {
  it('reads paths in brewing words, with the labels compare uses and no document key', () => {
    expect(describeMergePath('hops[cascade|dry_hop].amountG')).toBe('Hop Cascade (dry hop) · Amount');
    expect(describeMergePath('mash.steps[0].tempC')).toBe('Mash step 1 · Temperature');
    expect(describeMergePath('notes')).toBe('Notes');
    expect(describeMergePath('batch.volumeL')).toBe('Batch volume');
    expect(describeMergePath('water.source.calcium')).toBe('Source water · Calcium');
    expect(describeMergePath('water.salts[calcium_chloride].grams')).toBe('Water salt Calcium chloride · Amount');
  });
});

describe('describeConflict', () => {
  const hop = { path: 'hops[cascade|boil].amountG', base: 25, ours: 28.35, theirs: 40 };

  it('labels a conflicting hop amount with the hop’s own name, in grams for metric members', () => {
    expect(describeConflict(hop, 'metric')).toEqual({
      path: hop.path,
      label: 'Hop Cascade (boil) · Amount',
      base: '25 g',
      ours: '28 g',
      theirs: '40 g',
    });
  });

  it('shows the same conflict in ounces for US members', () => {
    expect(describeConflict(hop, 'us')).toMatchObject({ base: '0.88 oz', ours: '1 oz', theirs: '1.41 oz' });
  });

  it('shows temperatures and whole items in the member’s units, and an absent item as such', () => {
    const mash = { path: 'mash.steps[0].tempC', base: 66, ours: 65, theirs: 68 };
    expect(describeConflict(mash, 'us')).toMatchObject({
      label: 'Mash step 1 · Temperature',
      base: '151 °F',
      ours: '149 °F',
      theirs: '154 °F',
    });
    expect(describeConflict(mash, 'metric')).toMatchObject({ base: '66 °C', ours: '65 °C', theirs: '68 °C' });
    const munich = {
      path: 'fermentables[munich malt]',
      base: { name: 'Munich malt', amountKg: 0.4, potentialPpg: 35, colorLovibond: 10, kind: 'grain' },
      ours: undefined,
      theirs: { name: 'Munich malt', amountKg: 0.6, potentialPpg: 35, colorLovibond: 10, kind: 'grain' },
    };
    const shown = describeConflict(munich, 'us');
    expect(shown.label).toBe('Fermentable Munich malt');
    expect(shown.ours).toBe('not in the recipe');
    expect(shown.theirs).toMatch(/^Munich malt: Amount 1\.32 lb · Colour 10 °L/);
    for (const text of Object.values(shown).slice(1)) expect(text).not.toMatch(/\b[a-z]+[A-Z][a-zA-Z]*\b/);
  });
});

describe('describeTaken', () => {
  it('says what was taken from the proposal without asking, in the member’s units', () => {
    const mash = { path: 'mash.steps[0].tempC', base: 66, theirs: 68 };
    expect(describeTaken(mash, 'metric')).toBe('Mash step 1 · Temperature 66 °C → 68 °C');
    expect(describeTaken(mash, 'us')).toBe('Mash step 1 · Temperature 151 °F → 154 °F');
    const kveik = { name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 37 };
    expect(describeTaken({ path: 'yeasts[kveik]', base: undefined, theirs: kveik }, 'metric')).toBe(
      'Yeast Kveik (added)',
    );
    expect(
      describeTaken(
        { path: 'yeasts[clean ale yeast]', base: { ...kveik, name: 'Clean ale yeast' }, theirs: undefined },
        'us',
      ),
    ).toBe('Yeast Clean ale yeast (removed)');
  });
});
