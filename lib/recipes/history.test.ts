import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, type RecipeDocumentInput } from '@/lib/brewing';
import example from '@/lib/brewing/examples/pale-ale.json';
import type { UnitSystem } from '@/lib/brewing/units';
import { compareDocuments } from './compare';
import { historyLine } from './history';

function doc(change: (d: RecipeDocumentInput) => void = () => {}) {
  const d = structuredClone(example) as RecipeDocumentInput;
  change(d);
  return recipeDocumentSchema.parse(d);
}

const line = (change: (d: RecipeDocumentInput) => void, units: UnitSystem = 'metric') =>
  historyLine(compareDocuments(doc(), doc(change), { units }));

const KVEIK = { name: 'Kveik', kind: 'kveik' as const, attenuationPct: 80, tempMinC: 25, tempMaxC: 37 };

describe('historyLine', () => {
  it('credits a cooler mash with the FG it moved, in the member’s units', () => {
    const cooler = (d: RecipeDocumentInput) => {
      d.mash.steps[0].tempC = 65;
    };
    expect(line(cooler, 'metric')).toMatch(/^Mashed 1 °C cooler → FG −0\.001/);
    expect(line(cooler, 'us')).toMatch(/^Mashed 1\.8 °F cooler → FG −0\.001/);
  });

  it('names a yeast swap once, with the numbers it moved', () => {
    expect(
      line((d) => {
        d.yeasts[0] = KVEIK;
      }),
    ).toMatch(/^Yeast: Clean ale yeast → Kveik — FG −0\.\d{3}/);
  });

  it('says a new hop addition moved IBU, with its amount in ounces for US members', () => {
    const added = (d: RecipeDocumentInput) => {
      d.hops.push({ name: 'Chinook', amountG: 28, alphaPct: 9, use: 'boil', timeMin: 10, form: 'pellet' });
    };
    expect(line(added, 'us')).toMatch(/^Added Chinook \(boil, 10 min\), 0\.99 oz → IBU \+\d+/);
    expect(line(added, 'metric')).toMatch(/^Added Chinook \(boil, 10 min\), 28 g → IBU \+\d+/);
  });

  it('lists each change with its own numbers, the ones that moved a number first', () => {
    const text = line((d) => {
      d.title = 'Hillside Pale, second take';
      d.fermentables[0].amountKg = 4.5;
    });
    expect(text).toMatch(
      /^Pale ale malt, 2-row \+0\.3 kg → OG \+0\.003, .*; Title: Hillside Pale Ale → Hillside Pale, second take$/,
    );
  });

  it('says no number changed when none did', () => {
    expect(
      line((d) => {
        d.title = 'Hillside Pale, renamed';
      }),
    ).toBe('Title: Hillside Pale Ale → Hillside Pale, renamed; no number changed');
    expect(
      line((d) => {
        d.notes = 'Shorter notes.';
      }),
    ).toBe('Only the notes changed; no number changed');
    expect(line(() => {})).toBe('Nothing changed');
  });

  it('names four changes and counts the rest', () => {
    const text = line((d) => {
      d.batch.boilTimeMin = 75;
      d.fermentables[1].amountKg = 0.5;
      d.fermentables[2].amountKg = 0.2;
      d.hops[0].amountG = 22;
      d.hops[1].amountG = 30;
      d.title = 'Renamed';
    });
    expect(text.split('; ')).toHaveLength(5);
    expect(text).toMatch(/; 2 more changes$/);
  });

  it('never shows a document key', () => {
    const text = line((d) => {
      d.batch.boilOffLPerHour = 5;
      d.carbonation = { volumesCO2: 2.6, servingTempC: 4 };
      d.water!.salts![0].grams = 8;
    }, 'us');
    expect(text).not.toMatch(/\b[a-z]+[A-Z][a-zA-Z]*\b/);
  });
});
