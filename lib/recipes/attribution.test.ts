import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import example from '@/lib/brewing/examples/pale-ale.json';
import type { UnitSystem } from '@/lib/brewing/units';
import { effectSentence } from './attribution';
import { compareDocuments } from './compare';

function doc(change: (d: RecipeDocumentInput) => void = () => {}) {
  const d = structuredClone(example) as RecipeDocumentInput;
  change(d);
  return recipeDocumentSchema.parse(d);
}

const sentences = (change: (d: RecipeDocumentInput) => void, units: UnitSystem) => {
  const comparison = compareDocuments(doc(), doc(change), { units });
  return comparison.attribution.map((a) => effectSentence(a, 'Accepting this changes', units));
};

const newAddition = (d: RecipeDocumentInput) => {
  d.hops.push({ name: 'Chinook', amountG: 28, alphaPct: 9, use: 'boil', timeMin: 10, form: 'pellet' });
};

describe('effectSentence', () => {
  it('credits a single change by name: the new 10-minute addition moved IBU', () => {
    for (const units of ['metric', 'us'] as const) {
      const ibu = sentences(newAddition, units).find((s) => s.includes(' IBU '));
      expect(ibu).toMatch(/^Accepting this changes IBU by \+\d+: the new 10-minute Chinook addition$/);
    }
  });

  it('words a temperature cause in the member’s units', () => {
    const hotter = (d: RecipeDocumentInput) => {
      d.mash.steps[0].tempC = 68;
    };
    expect(sentences(hotter, 'metric').find((s) => s.includes(' FG '))).toBe(
      'Accepting this changes FG by +0.001: the 2 °C hotter mash',
    );
    expect(sentences(hotter, 'us').find((s) => s.includes(' FG '))).toBe(
      'Accepting this changes FG by +0.001: the 3.6 °F hotter mash',
    );
  });

  it('lists several causes with their own share, and lower-cases a worded number', () => {
    const both = sentences((d) => {
      d.fermentables[0].amountKg = 4.6;
      newAddition(d);
    }, 'metric');
    expect(both.find((s) => s.includes(' IBU '))).toMatch(
      /^Accepting this changes IBU by \+\d+: \+\d+ from the new 10-minute Chinook addition, −\d+ from 0\.4 kg more Pale ale malt, 2-row/,
    );
    expect(both.some((s) => s.startsWith('Accepting this changes colour (EBC) by +'))).toBe(true);
  });
});
