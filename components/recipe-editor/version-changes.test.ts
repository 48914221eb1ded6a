import { describe, expect, it } from 'vitest';
import type { RecipeDocumentInput } from '@/lib/brewing/schema';
import paleAle from '@/lib/brewing/examples/pale-ale.json';
import { compareVersions, hasChanges, type VersionChanges } from './version-changes';

const base = paleAle as RecipeDocumentInput;

function edited(change: (doc: RecipeDocumentInput) => void): RecipeDocumentInput {
  const doc = structuredClone(base);
  change(doc);
  return doc;
}

const group = (changes: VersionChanges, title: string) => changes.groups.find((g) => g.title === title)?.lines;

/** A document key looks like `amountKg` or `boilOffLPerHour`; the units mL, kPa and pH are words a brewer reads. */
const DOCUMENT_KEY = /\b(?!mL\b|kPa\b|pH\b)[a-z]+[A-Z][a-zA-Z]*\b/;

function allText(changes: VersionChanges): string {
  return changes.groups.flatMap((g) => [g.title, ...g.lines]).join('\n');
}

describe('compareVersions (the editor’s conflict panel)', () => {
  it('finds nothing between a version and itself, even with defaults written out or left out', () => {
    const spelledOut = edited((doc) => {
      delete doc.batch.boilOffLPerHour;
      doc.notes = `${doc.notes}\n`;
    });
    expect(hasChanges(compareVersions(base, spelledOut, 'metric'))).toBe(false);
  });

  it('names fermentables added, removed and changed, with labelled amounts in the member’s units', () => {
    const head = edited((doc) => {
      doc.fermentables[0].amountKg = 4.5;
      doc.fermentables.splice(2, 1);
      doc.fermentables.push({
        name: 'Flaked oats',
        amountKg: 0.3,
        potentialPpg: 32,
        colorLovibond: 1,
        kind: 'adjunct',
      });
    });
    expect(group(compareVersions(base, head, 'metric'), 'Fermentables')).toEqual([
      'Pale ale malt, 2-row +0.3 kg (4.2 kg → 4.5 kg)',
      'Removed Crystal malt 40 °L, 0.3 kg',
      'Added Flaked oats, 0.3 kg',
    ]);
    expect(group(compareVersions(base, head, 'us'), 'Fermentables')).toEqual([
      'Pale ale malt, 2-row +0.66 lb (9.26 lb → 9.92 lb)',
      'Removed Crystal malt 40 °L, 0.66 lb',
      'Added Flaked oats, 0.66 lb',
    ]);
  });

  it('reads a yeast swap as one labelled change', () => {
    const head = edited((doc) => {
      doc.yeasts[0] = { name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 37 };
    });
    const [line] = group(compareVersions(base, head, 'us'), 'Yeast')!;
    expect(line).toMatch(
      /^Yeast: Clean ale yeast → Kveik \(kind ale → kveik, attenuation 77% → 80%, lowest temperature 59 °F → 77 °F/,
    );
    const [metric] = group(compareVersions(base, head, 'metric'), 'Yeast')!;
    expect(metric).toContain('lowest temperature 15 °C → 25 °C');
  });

  it('tells two additions of the same hop apart by use and time, in grams or ounces', () => {
    const head = edited((doc) => {
      doc.hops[3].amountG = 75;
      doc.hops[2].tempC = 75;
    });
    expect(group(compareVersions(base, head, 'metric'), 'Hops')).toEqual([
      'Centennial (whirlpool) hop stand temperature 80 °C → 75 °C',
      'Cascade (dry hop, 3 days) +25 g (50 g → 75 g)',
    ]);
    expect(group(compareVersions(base, head, 'us'), 'Hops')).toEqual([
      'Centennial (whirlpool) hop stand temperature 176 °F → 167 °F',
      'Cascade (dry hop, 3 days) +0.88 oz (1.76 oz → 2.65 oz)',
    ]);
  });

  it('lists batch, mash and fermentation changes in the member’s units, with no document key', () => {
    const head = edited((doc) => {
      doc.batch.volumeL = 18.92705892;
      doc.batch.boilOffLPerHour = 5;
      doc.mash.steps[0].tempC = 68;
      doc.mash.steps.pop();
      doc.fermentation.steps[0].days = 14;
    });
    const us = compareVersions(base, head, 'us');
    expect(group(us, 'Batch and style')).toEqual(['Batch volume 5.3 gal → 5 gal', 'Boil-off 1.06 gal/h → 1.32 gal/h']);
    expect(group(us, 'Mash')).toEqual([
      'Mashed 3.6 °F hotter (Mash step 1 (Saccharification): 151 °F → 154 °F)',
      'Removed mash step 2 (mash-out): Temperature 169 °F · Time 10 min',
    ]);
    expect(group(us, 'Fermentation')).toEqual(['Fermentation step 1: days 10 days → 14 days']);
    const metric = compareVersions(base, head, 'metric');
    expect(group(metric, 'Batch and style')).toEqual(['Batch volume 20 L → 18.9 L', 'Boil-off 4 L/h → 5 L/h']);
    expect(allText(us)).not.toMatch(DOCUMENT_KEY);
    expect(allText(metric)).not.toMatch(DOCUMENT_KEY);
  });

  it('labels water, carbonation, title, style and notes changes', () => {
    const head = edited((doc) => {
      doc.notes = 'Shorter notes.';
      doc.water!.salts = [{ salt: 'gypsum', grams: 8 }];
      delete doc.carbonation;
      doc.title = 'Hillside Pale Ale, drier';
      delete doc.style;
    });
    const changes = compareVersions(base, head, 'metric');
    expect(changes.notesChanged).toBe(true);
    expect(group(changes, 'Batch and style')).toEqual([
      'Title: Hillside Pale Ale → Hillside Pale Ale, drier',
      'Style: 18B American Pale Ale → none',
    ]);
    expect(group(changes, 'Water salts')).toEqual(['Gypsum +2 g (6 g → 8 g)', 'Removed calcium chloride, 3 g']);
    expect(group(changes, 'Carbonation')).toEqual(['Removed the carbonation target']);
    expect(allText(changes)).not.toMatch(DOCUMENT_KEY);
  });
});
