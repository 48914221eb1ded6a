import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import example from '@/lib/brewing/examples/pale-ale.json';
import { compareDocuments } from './compare';

function doc(change: (d: RecipeDocumentInput) => void = () => {}) {
  const d = structuredClone(example) as RecipeDocumentInput;
  change(d);
  return recipeDocumentSchema.parse(d);
}

function compare(a: ReturnType<typeof doc>, b: ReturnType<typeof doc>) {
  return compareDocuments(a, b, computeStats(a), computeStats(b));
}

describe('compareDocuments', () => {
  it('finds nothing to report between a document and itself', () => {
    const a = doc();
    const result = compare(a, a);
    expect(result.changeCount).toBe(0);
    expect(result.stats.every((s) => s.delta === 0 || s.delta === null)).toBe(true);
    expect(result.notes.every((p) => !p.added && !p.removed)).toBe(true);
  });

  it('pairs hops by name and use, so a dry hop and a boil addition of one variety stay apart', () => {
    const a = doc();
    const b = doc((d) => {
      d.hops[3].amountG = 80;
    });
    const hops = compare(a, b).sections.find((s) => s.section === 'hops')!.items;
    const changed = hops.filter((h) => h.status === 'changed');
    expect(changed).toHaveLength(1);
    expect(changed[0].label).toBe('Cascade (dry hop)');
    expect(changed[0].changes).toEqual([{ field: 'amountG', before: 50, after: 80 }]);
  });

  it('reports an ingredient renamed as one removed and one added', () => {
    const b = doc((d) => {
      d.fermentables[1].name = 'Vienna malt';
    });
    const items = compare(doc(), b).sections.find((s) => s.section === 'fermentables')!.items;
    expect(items.filter((i) => i.status === 'removed').map((i) => i.label)).toEqual(['Munich malt']);
    expect(items.filter((i) => i.status === 'added').map((i) => i.label)).toEqual(['Vienna malt']);
  });

  it('pairs two additions of the same hop and use in order', () => {
    const a = doc((d) => {
      d.hops.push({ name: 'Cascade', amountG: 10, alphaPct: 6, use: 'boil', timeMin: 5, form: 'pellet' });
    });
    const b = doc((d) => {
      d.hops.push({ name: 'Cascade', amountG: 10, alphaPct: 6, use: 'boil', timeMin: 0, form: 'pellet' });
    });
    const hops = compare(a, b).sections.find((s) => s.section === 'hops')!.items;
    const cascadeBoil = hops.filter((h) => h.label === 'Cascade (boil)');
    expect(cascadeBoil.map((h) => h.status)).toEqual(['same', 'changed']);
    expect(cascadeBoil[1].changes).toEqual([{ field: 'timeMin', before: 5, after: 0 }]);
  });

  it('gives each number its delta and the notes as a word diff', () => {
    const a = doc();
    const b = doc((d) => {
      d.fermentables[0].amountKg = 5;
      d.notes = 'A bright, bitter pale ale for summer drinking.';
    });
    const result = compare(a, b);
    const og = result.stats.find((s) => s.stat === 'og')!;
    expect(og.after! - og.before!).toBeCloseTo(og.delta!, 12);
    expect(og.delta).toBeGreaterThan(0);
    expect(result.notes.filter((p) => p.added).map((p) => p.value.trim())).toContain('summer');
    expect(result.notes.filter((p) => p.removed).map((p) => p.value.trim())).toContain('everyday');
  });

  it('shows water and carbonation appearing in the newer version', () => {
    const a = doc((d) => {
      delete d.water;
      delete d.carbonation;
    });
    const result = compare(a, doc());
    expect(result.sections.find((s) => s.section === 'water')!.items[0].status).toBe('added');
    expect(result.sections.find((s) => s.section === 'carbonation')!.items[0].status).toBe('added');
    expect(result.stats.find((s) => s.stat === 'kegPressureKPa')!.before).toBeNull();
  });
});
