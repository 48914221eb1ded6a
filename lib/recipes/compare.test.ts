import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import example from '@/lib/brewing/examples/pale-ale.json';
import type { UnitSystem } from '@/lib/brewing/units';
import { changeLines, compareDocuments } from './compare';

function doc(change: (d: RecipeDocumentInput) => void = () => {}) {
  const d = structuredClone(example) as RecipeDocumentInput;
  change(d);
  return recipeDocumentSchema.parse(d);
}

const compare = (a: ReturnType<typeof doc>, b: ReturnType<typeof doc>, units: UnitSystem = 'metric') =>
  compareDocuments(a, b, { units });
const section = (c: ReturnType<typeof compare>, name: string) => c.sections.find((s) => s.section === name)!.items;
const KVEIK = { name: 'Kveik', kind: 'kveik' as const, attenuationPct: 80, tempMinC: 25, tempMaxC: 37 };

describe('compareDocuments', () => {
  it('calls a version compared with itself identical, with no number moved', () => {
    const result = compare(doc(), doc());
    expect(result.identical).toBe(true);
    expect(result.changeCount).toBe(0);
    expect(result.attribution).toEqual([]);
  });

  it('reads a yeast swap as one change', () => {
    const result = compare(
      doc(),
      doc((d) => {
        d.yeasts[0] = KVEIK;
      }),
    );
    const changed = section(result, 'yeasts').filter((i) => i.status !== 'same');
    expect(changed).toHaveLength(1);
    expect(changed[0].kind).toBe('swap');
    expect(changed[0].summary).toMatch(/^Yeast: Clean ale yeast → Kveik/);
    expect(changed[0].changes.find((c) => c.field === 'attenuationPct')).toMatchObject({
      label: 'Attenuation',
      before: '77%',
      after: '80%',
    });
  });

  it('reads a hop addition moved from 10 to 5 minutes as moved, not removed and added', () => {
    const result = compare(
      doc(),
      doc((d) => {
        d.hops[1].timeMin = 5;
      }),
    );
    const changed = section(result, 'hops').filter((i) => i.status !== 'same');
    expect(changed).toHaveLength(1);
    expect(changed[0].kind).toBe('moved');
    expect(changed[0].summary).toContain('moved from 10 min to 5 min');
  });

  it('reads an amount change as a signed amount in the member’s units', () => {
    const b = doc((d) => {
      d.fermentables[0].amountKg = 4.5;
    });
    const metric = section(compare(doc(), b), 'fermentables').find((i) => i.status === 'changed')!;
    expect(metric.changes[0]).toMatchObject({ label: 'Amount', before: '4.2 kg', after: '4.5 kg', delta: '+0.3 kg' });
    const us = section(compare(doc(), b, 'us'), 'fermentables').find((i) => i.status === 'changed')!;
    expect(us.changes[0]).toMatchObject({ before: '9.26 lb', after: '9.92 lb', delta: '+0.66 lb' });
  });

  it('reports an ingredient of another kind as removed and added', () => {
    const result = compare(
      doc(),
      doc((d) => {
        d.hops.splice(2, 1);
        d.hops.push({ name: 'Cascade', amountG: 15, alphaPct: 6, use: 'boil', timeMin: 30, form: 'pellet' });
      }),
    );
    const statuses = changeLines(result).map((i) => i.status);
    expect(statuses.sort()).toEqual(['added', 'removed']);
  });

  it('shows temperatures, volumes and dry-hop times in US units without document keys', () => {
    const result = compare(
      doc(),
      doc((d) => {
        d.mash.steps[0].tempC = 68;
        d.batch.boilOffLPerHour = 5;
        d.hops[3].timeMin = 5760;
      }),
      'us',
    );
    const text = JSON.stringify(changeLines(result).map((i) => [i.summary, i.cause, i.details]));
    expect(text).toContain('3.6 °F hotter');
    expect(text).toContain('gal/h');
    expect(text).toContain('from 3 days to 4 days');
    expect(text).not.toMatch(/\b[a-z]+[A-Z][a-z]+/);
  });

  it('traces each changed number to the changes that moved it, summing to the total within rounding', () => {
    const result = compare(
      doc(),
      doc((d) => {
        d.yeasts[0] = KVEIK;
        d.mash.steps[0].tempC = 68;
        d.fermentables[0].amountKg = 4.5;
        d.hops.push({ name: 'Cascade', amountG: 20, alphaPct: 6, use: 'boil', timeMin: 10, form: 'pellet' });
        d.batch.volumeL = 23;
      }),
    );
    const fg = result.attribution.find((a) => a.stat === 'fg')!;
    expect(fg.parts.map((p) => p.cause)).toEqual(expect.arrayContaining(['the yeast swap', 'the 2 °C hotter mash']));
    for (const a of result.attribution) {
      const sum = a.parts.reduce((n, p) => n + p.delta, 0) + (a.together?.delta ?? 0);
      expect(Math.abs(sum - a.delta)).toBeLessThan(1e-3 * Math.max(1, Math.abs(a.delta)) + 0.2);
    }
    const ibu = result.attribution.find((a) => a.stat === 'ibu')!;
    expect(ibu.sentence).toContain('the new 10-minute Cascade addition');
    // A different batch size is a change of its own, named beside the others.
    expect(result.attribution.find((a) => a.stat === 'og')!.parts.map((p) => p.cause)).toContain(
      'batch volume 20 L → 23 L',
    );
  });
});
