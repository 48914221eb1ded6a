import { describe, expect, it } from 'vitest';
import { recipeDocumentSchema, strikeWaterTempC } from '@/lib/brewing';
import { minimalInput } from '@/lib/brewing/test-fixtures';
import { liveSteps, sameLiveValue } from './live-steps';
import { liveEntrySchema } from './schemas';

const doc = recipeDocumentSchema.parse({
  ...minimalInput(),
  hops: [
    { name: 'Bittering hop', amountG: 25, alphaPct: 10, use: 'boil', timeMin: 60, form: 'pellet' },
    { name: 'Aroma hop', amountG: 20, alphaPct: 6, use: 'boil', timeMin: 10, form: 'pellet' },
    { name: 'Late hop', amountG: 15, alphaPct: 6, use: 'boil', timeMin: 0, form: 'pellet' },
    { name: 'Stand hop', amountG: 40, alphaPct: 6, use: 'whirlpool', timeMin: 20, form: 'pellet', tempC: 80 },
  ],
});

describe('brew-day mode checklist', () => {
  const steps = liveSteps(doc, { og: 1.05 }, 'metric');

  it('walks strike water, mash, mash-out, sparge, boil, hop stand, chill, transfer and pitch in order', () => {
    expect(steps.map((s) => s.id)).toEqual([
      'strike',
      'mash-1',
      'mash-out',
      'sparge',
      'boil',
      'hop-stand',
      'chill',
      'transfer',
      'pitch',
      'package',
    ]);
  });

  it('heats the strike water to the engine’s temperature (Palmer, How to Brew: Tw = 0.41/r (T2 − T1) + T2)', () => {
    // 66 °C rest, grain at 20 °C, 3 L/kg: 0.41/3 × 46 + 66 = 72.3 °C.
    expect(strikeWaterTempC(66, 20, 3)).toBeCloseTo(72.29, 2);
    expect(steps[0].title).toBe('Heat the strike water to 72 °C');
  });

  it('calls each boil addition when that many minutes are left', () => {
    const boil = steps.find((s) => s.id === 'boil')!;
    expect(boil.timerMin).toBe(60);
    expect(boil.announcements.map((a) => [a.atMin, a.id])).toEqual([
      [0, 'boil-60'],
      [50, 'boil-10'],
      [60, 'boil-0'],
    ]);
    expect(boil.announcements[1].text).toBe('10 minutes left: add 20 g Aroma hop');
    expect(steps.find((s) => s.id === 'hop-stand')).toMatchObject({ timerMin: 20 });
  });

  it('puts a caution on every step that can hurt', () => {
    const caution = Object.fromEntries(steps.map((s) => [s.id, s.caution]));
    expect(caution).toMatchObject({
      strike: 'hotLiquor',
      boil: 'boil',
      chill: 'chilling',
      transfer: 'lifting',
      package: 'pressure',
    });
  });

  it('asks for each reading at the step where it is taken', () => {
    const fields = Object.fromEntries(steps.map((s) => [s.id, s.fields]));
    expect(fields['mash-1']).toContain('mashPh');
    expect(fields.sparge).toEqual(['preBoilVolumeL', 'preBoilGravity']);
    expect(fields.transfer).toEqual(['og', 'fermenterVolumeL']);
    expect(fields.pitch).toEqual(['pitchTempC']);
  });
});

describe('brew-day mode writes', () => {
  const key = '0b6f3c1e-9a4d-4c57-8e1f-2d3b4a5c6d7e';
  it('checks a reading with the brew-day form’s own field rules', () => {
    const bad = liveEntrySchema.safeParse({ idempotencyKey: key, kind: 'field', field: 'mashPh', value: 9 });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toBe('Mash pH must be between 3 and 8');
    const og = liveEntrySchema.safeParse({
      idempotencyKey: key,
      kind: 'field',
      field: 'og',
      value: { method: 'hydrometer', value: 1.3 },
    });
    expect(og.error?.issues[0].path).toEqual(['value', 'value']);
    expect(
      liveEntrySchema.safeParse({ idempotencyKey: 'not-a-uuid', kind: 'step', stepId: 'boil', checked: true }).success,
    ).toBe(false);
  });
  it('compares stored values to six figures', () => {
    expect(sameLiveValue(1.0520000457763672, 1.052)).toBe(true);
    expect(
      sameLiveValue({ method: 'hydrometer', value: 1.052 }, { method: 'hydrometer', value: 1.052, sampleTempC: null }),
    ).toBe(true);
    expect(sameLiveValue(1.052, 1.053)).toBe(false);
    expect(sameLiveValue(null, 1.05)).toBe(false);
  });
});
