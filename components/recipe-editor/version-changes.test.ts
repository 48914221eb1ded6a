import { describe, expect, it } from 'vitest';
import type { RecipeDocumentInput } from '@/lib/brewing/schema';
import paleAle from '@/lib/brewing/examples/pale-ale.json';
import { compareVersions, hasChanges } from './version-changes';

const base = paleAle as RecipeDocumentInput;

function edited(change: (doc: RecipeDocumentInput) => void): RecipeDocumentInput {
  const doc = structuredClone(base);
  change(doc);
  return doc;
}

describe('compareVersions', () => {
  it('finds nothing between a version and itself, even with defaults written out or left out', () => {
    const spelledOut = edited((doc) => {
      delete doc.batch.boilOffLPerHour;
      doc.notes = `${doc.notes}\n`;
    });
    const changes = compareVersions(base, spelledOut, 'metric');
    expect(hasChanges(changes)).toBe(false);
  });

  it('names fermentables added, removed and changed', () => {
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
    const { fermentables } = compareVersions(base, head, 'metric');
    expect(fermentables).toEqual([
      { change: 'changed', name: 'Pale ale malt, 2-row', fields: [{ label: 'amount', from: '4.2 kg', to: '4.5 kg' }] },
      { change: 'added', name: 'Flaked oats', fields: [] },
      { change: 'removed', name: 'Crystal malt 40 °L', fields: [] },
    ]);
  });

  it('tells two additions of the same hop apart by use', () => {
    const head = edited((doc) => {
      doc.hops[3].amountG = 75;
      doc.hops[2].tempC = 75;
    });
    const { hops } = compareVersions(base, head, 'metric');
    expect(hops).toEqual([
      {
        change: 'changed',
        name: 'Centennial (whirlpool)',
        fields: [{ label: 'temperature', from: '80 °C', to: '75 °C' }],
      },
      { change: 'changed', name: 'Cascade (dry hop)', fields: [{ label: 'amount', from: '50 g', to: '75 g' }] },
    ]);
  });

  it('pairs repeated names in order, so one removal reads as one removal', () => {
    const head = edited((doc) => {
      doc.hops.push({ ...doc.hops[1] });
    });
    const { hops } = compareVersions(head, base, 'metric');
    expect(hops).toEqual([{ change: 'removed', name: 'Cascade (boil)', fields: [] }]);
  });

  it('lists batch, mash and fermentation numbers in the member’s units', () => {
    const head = edited((doc) => {
      doc.batch.volumeL = 18.92705892;
      doc.mash.steps[0].tempC = 68;
      doc.mash.steps.pop();
      doc.fermentation.steps[0].days = 14;
    });
    const changes = compareVersions(base, head, 'us');
    expect(changes.batch).toEqual([{ label: 'Batch volume', from: '5.28 gal', to: '5 gal' }]);
    expect(changes.mash).toEqual([
      { label: 'Mash steps', from: '2 steps', to: '1 step' },
      { label: 'Mash step 1 temperature', from: '150.8 °F', to: '154.4 °F' },
    ]);
    expect(changes.fermentation).toEqual([{ label: 'Fermentation step 1 days', from: '10', to: '14' }]);
  });

  it('says whether notes, water, carbonation, title and style changed', () => {
    const head = edited((doc) => {
      doc.notes = 'Shorter notes.';
      doc.water!.salts = [{ salt: 'gypsum', grams: 8 }];
      delete doc.carbonation;
      doc.title = 'Hillside Pale Ale, drier';
      delete doc.style;
    });
    const changes = compareVersions(base, head, 'metric');
    expect(changes.notesChanged).toBe(true);
    expect(changes.waterChanged).toBe(true);
    expect(changes.carbonationChanged).toBe(true);
    expect(changes.title).toEqual({ label: 'Title', from: 'Hillside Pale Ale', to: 'Hillside Pale Ale, drier' });
    expect(changes.style).toEqual({ label: 'Style', from: '18B American Pale Ale', to: 'none' });
  });
});
