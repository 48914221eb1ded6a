import { describe, expect, it } from 'vitest';
import {
  brixToGravity,
  correctHydrometerReading,
  fermentingGravityFromBrix,
  measuredEfficiencyPct,
  type RecipeDocument,
} from '@/lib/brewing';
import { signedInClient } from '../helpers/users';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { TestClient } from '../helpers/http';
import { brewDayRow, brewDayVia, today } from './fixtures';
import type { FieldIssue } from '@/lib/errors';

type Fields = FieldIssue[];
type ErrorBody = { error: { message: string; fields: Fields } };
const paths = (body: unknown) => ((body as ErrorBody).error?.fields ?? []).map((f) => f.path);

describe('logging a brew day', () => {
  it('records a brew of one exact version, corrects gravities and compares with the prediction', async () => {
    const { client } = await signedInClient();
    const saved = await createRecipeVia(client, { document: paleAle() });
    const res = await client.post<{ id: string }>('/api/brew-days', {
      versionId: saved.version.id,
      brewedOn: today(-14),
      strikeTempC: 74,
      mashTempC: 66,
      mashPh: 5.4,
      preBoilVolumeL: 26,
      preBoilGravity: { method: 'refractometer', value: 11 },
      postBoilVolumeL: 23,
      fermenterVolumeL: 20,
      og: { method: 'hydrometer', value: 1.048, sampleTempC: 30 },
      pitchTempC: 18,
      fg: { method: 'refractometer', value: 6.5 },
      packagedOn: today(-1),
      packaging: 'keg',
      kegPressureKPa: 240,
      notes: 'Smelled of **bread** all day.',
    });
    expect(res.status).toBe(201);
    const row = await brewDayRow(res.body.id);
    // Hydrometer temperature correction: check values from Burch, Brewing Quality Beers (1986), via the engine.
    expect(row.og).toBeCloseTo(correctHydrometerReading(1.048, 30), 6);
    expect(row.og!).toBeGreaterThan(1.048);
    // Unfermented wort: Brix over the wort correction factor (common practice).
    expect(row.preBoilGravity).toBeCloseTo(brixToGravity(11), 6);
    // FG by refractometer needs the alcohol correction (Terrill, "Refractometer FG Results", 2011); the OG
    // was a hydrometer reading, so its Brix is taken from the corrected OG.
    expect(row.fg!).toBeLessThan(brixToGravity(6.5));
    expect(row.fg!).toBeGreaterThan(0.99);

    const view = await client.get<{
      version: { number: number; stats: { og: number; fg: number; mash: { predictedPh: number | null } } };
      outcome: {
        efficiencyPct: number;
        abv: number;
        kegPressureAboveTypicalRating: boolean;
        comparisons: { key: string; measured: number | null; predicted: number | null; difference: number | null }[];
      };
    }>(`/api/brew-days/${res.body.id}`);
    expect(view.status).toBe(200);
    expect(view.body.version.number).toBe(1);
    const og = view.body.outcome.comparisons.find((c) => c.key === 'og')!;
    expect(og.predicted).toBeCloseTo(view.body.version.stats.og, 6);
    expect(og.difference).toBeCloseTo(og.measured! - og.predicted!, 9);
    // The measured mash pH lies beside the version's predicted one (Troester 2009 model, lib/brewing/mash-ph.ts).
    const ph = view.body.outcome.comparisons.find((c) => c.key === 'mashPh')!;
    expect(ph.predicted).not.toBeNull();
    expect(ph.predicted).toBeCloseTo(view.body.version.stats.mash.predictedPh!, 9);
    expect(ph.difference).toBeCloseTo(5.4 - ph.predicted!, 9);
    const doc = paleAle() as unknown as RecipeDocument;
    // Efficiency from measured OG and volume into the fermenter (common practice), via the engine.
    expect(view.body.outcome.efficiencyPct).toBeCloseTo(measuredEfficiencyPct(doc.fermentables, row.og!, 20), 6);
    expect(view.body.outcome.kegPressureAboveTypicalRating).toBe(true);

    // The recipe changes later; the brew day still points at version 1.
    const doc2 = paleAle({ title: 'Changed pale' });
    const saved2 = await saveVia(client, saved.recipe.id, saved.version.id, doc2);
    expect(saved2.status).toBe(201);
    const again = await client.get<{ version: { number: number } }>(`/api/brew-days/${res.body.id}`);
    expect(again.body.version.number).toBe(1);
  });

  it('refuses gravities out of physical range, impossible temperatures and dates before the brew, naming each field', async () => {
    const { client } = await signedInClient();
    const saved = await createRecipeVia(client);
    const bad = await client.post('/api/brew-days', {
      versionId: saved.version.id,
      brewedOn: today(-3),
      strikeTempC: 104,
      mashTempC: -2,
      pitchTempC: 120,
      og: { method: 'hydrometer', value: 1.25 },
      fg: { method: 'hydrometer', value: 0.97 },
      preBoilGravity: { method: 'refractometer', value: 55 },
    });
    expect(bad.status).toBe(400);
    expect(paths(bad.body)).toEqual(
      expect.arrayContaining([
        'strikeTempC',
        'mashTempC',
        'pitchTempC',
        'og.value',
        'fg.value',
        'preBoilGravity.value',
      ]),
    );
    const packaging = await client.post('/api/brew-days', {
      versionId: saved.version.id,
      brewedOn: today(-3),
      packagedOn: today(-5),
      packaging: 'bottles',
      kegPressureKPa: 100,
    });
    expect(packaging.status).toBe(400);
    expect(paths(packaging.body)).toEqual(expect.arrayContaining(['packagedOn', 'kegPressureKPa']));
    const messages = (bad.body as ErrorBody).error.fields.map((f) => f.message).join(' | ');
    expect(messages).toContain('between 0.980 and 1.200');
    expect(messages).toContain('0 and 100 °C');

    const fgAboveOg = await client.post('/api/brew-days', {
      versionId: saved.version.id,
      brewedOn: today(),
      og: { method: 'hydrometer', value: 1.04 },
      fg: { method: 'hydrometer', value: 1.05 },
    });
    expect(fgAboveOg.status).toBe(400);
    expect(paths(fgAboveOg.body)).toContain('fg.value');

    // A hydrometer reading in range whose temperature correction takes it out of range is refused too.
    const corrected = await client.post('/api/brew-days', {
      versionId: saved.version.id,
      brewedOn: today(),
      og: { method: 'hydrometer', value: 1.195, sampleTempC: 90 },
    });
    expect(corrected.status).toBe(400);
    expect(paths(corrected.body)).toContain('og.value');

    const badDate = await client.post('/api/brew-days', { versionId: saved.version.id, brewedOn: '2025-02-30' });
    expect(badDate.status).toBe(400);
    expect(paths(badDate.body)).toContain('brewedOn');
  });

  it('adds fermentation readings after the brew date only, with the Terrill correction for refractometer readings', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { og: { method: 'refractometer', value: 12.5 } } });
    const row = await brewDayRow(brewDayId);
    const reading = await client.post<{ id: string }>(`/api/brew-days/${brewDayId}/readings`, {
      takenOn: today(-15),
      method: 'refractometer',
      value: 7.2,
      beerTempC: 19,
    });
    expect(reading.status).toBe(201);
    const view = await client.get<{ readings: { id: string; gravity: number; beerTempC: number }[] }>(
      `/api/brew-days/${brewDayId}`,
    );
    const stored = view.body.readings.find((r) => r.id === reading.body.id)!;
    // Terrill, "Refractometer FG Results" (2011): fermenting gravity from original and current Brix.
    expect(stored.gravity).toBeCloseTo(fermentingGravityFromBrix(12.5, 7.2), 6);
    expect(row.og).toBeCloseTo(brixToGravity(12.5), 6);

    const tempOnly = await client.post(`/api/brew-days/${brewDayId}/readings`, {
      takenOn: today(-14),
      beerTempC: 20.5,
    });
    expect(tempOnly.status).toBe(201);

    const early = await client.post(`/api/brew-days/${brewDayId}/readings`, {
      takenOn: today(-40),
      method: 'hydrometer',
      value: 1.02,
    });
    expect(early.status).toBe(400);
    expect(paths(early.body)).toEqual(['takenOn']);
    const outOfRange = await client.post(`/api/brew-days/${brewDayId}/readings`, {
      takenOn: today(-10),
      method: 'hydrometer',
      value: 1.3,
      beerTempC: 130,
    });
    expect(outOfRange.status).toBe(400);
    expect(paths(outOfRange.body)).toEqual(expect.arrayContaining(['value', 'beerTempC']));
    const nothing = await client.post(`/api/brew-days/${brewDayId}/readings`, { takenOn: today(-10) });
    expect(nothing.status).toBe(400);

    const other = (await signedInClient()).client;
    const foreign = await other.post(`/api/brew-days/${brewDayId}/readings`, { takenOn: today(-10), beerTempC: 19 });
    expect(foreign.status).toBe(403);
    const after = await client.get<{ readings: unknown[] }>(`/api/brew-days/${brewDayId}`);
    expect(after.body.readings).toHaveLength(2);
  });

  it('takes tastings from other members who can see the brew day, with a 1–5 rating', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client);
    const friend = (await signedInClient()).client;
    const tasting = await friend.post(`/api/brew-days/${brewDayId}/tastings`, {
      tastedOn: today(),
      appearance: 'Hazy gold',
      aroma: 'Citrus and bread',
      flavour: 'Soft bitterness',
      mouthfeel: 'Medium',
      overall: 'Would drink again',
      rating: 4,
    });
    expect(tasting.status).toBe(201);
    const bad = await friend.post(`/api/brew-days/${brewDayId}/tastings`, { tastedOn: today(-60), rating: 6 });
    expect(bad.status).toBe(400);
    expect(paths(bad.body)).toEqual(expect.arrayContaining(['rating', 'overall']));
    const early = await friend.post(`/api/brew-days/${brewDayId}/tastings`, {
      tastedOn: today(-60),
      overall: 'Early',
      rating: 3,
    });
    expect(early.status).toBe(400);
    expect(paths(early.body)).toEqual(['tastedOn']);
    const anonymous = await new TestClient().post(`/api/brew-days/${brewDayId}/tastings`, {
      tastedOn: today(),
      overall: 'x',
      rating: 3,
    });
    expect(anonymous.status).toBe(401);
    const view = await client.get<{ tastings: { rating: number; aroma: string }[] }>(`/api/brew-days/${brewDayId}`);
    expect(view.body.tastings).toHaveLength(1);
    expect(view.body.tastings[0].aroma).toBe('Citrus and bread');
  });

  it('hides brew days of a recipe the viewer cannot see, exactly like a missing one', async () => {
    const { client } = await signedInClient();
    const { brewDayId, version } = await brewDayVia(client, { visibility: 'private' });
    const other = (await signedInClient()).client;
    const missing = await other.get(`/api/brew-days/00000000-0000-4000-8000-000000000000`);
    const hidden = await other.get(`/api/brew-days/${brewDayId}`);
    expect(hidden.status).toBe(404);
    expect(missing.status).toBe(404);
    expect((hidden.body as ErrorBody).error.message).toBe((missing.body as ErrorBody).error.message);
    expect((await new TestClient().get(`/api/brew-days/${brewDayId}`)).status).toBe(404);
    expect(
      (await other.post(`/api/brew-days/${brewDayId}/tastings`, { tastedOn: today(), overall: 'x', rating: 3 })).status,
    ).toBe(404);
    expect((await other.post('/api/brew-days', { versionId: version.id, brewedOn: today() })).status).toBe(404);
    expect((await client.get(`/api/brew-days/${brewDayId}`)).status).toBe(200);
  });

  it('lets the brewer complete the brew day later and nobody else', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client);
    const done = await client.patch(`/api/brew-days/${brewDayId}`, {
      brewedOn: today(-20),
      og: { method: 'hydrometer', value: 1.05 },
      fg: { method: 'hydrometer', value: 1.011 },
      packagedOn: today(-2),
      packaging: 'bottles',
      primingSugarG: 120,
    });
    expect(done.status).toBe(200);
    expect((await brewDayRow(brewDayId)).fg).toBeCloseTo(1.011, 6);
    const other = (await signedInClient()).client;
    expect((await other.patch(`/api/brew-days/${brewDayId}`, { brewedOn: today() })).status).toBe(403);
    expect((await brewDayRow(brewDayId)).brewedOn).toBe(today(-20));
  });

  it('offers the brewer their averages: efficiency and attenuation per yeast kind', async () => {
    const { client } = await signedInClient();
    await brewDayVia(client, {
      fields: { og: { method: 'hydrometer', value: 1.05 }, fg: { method: 'hydrometer', value: 1.01 } },
    });
    await brewDayVia(client, {
      fields: { og: { method: 'hydrometer', value: 1.048 }, fg: { method: 'hydrometer', value: 1.012 } },
    });
    const res = await client.get<{
      brewDayCount: number;
      efficiency: { meanPct: number; count: number };
      attenuationByYeastKind: { yeastKind: string; meanPct: number; count: number }[];
    }>('/api/me/brew-averages');
    expect(res.status).toBe(200);
    expect(res.body.brewDayCount).toBe(2);
    expect(res.body.efficiency.count).toBe(2);
    // Apparent attenuation = (OG − FG) / (OG − 1) (common practice): 80 % and 75 %.
    expect(res.body.attenuationByYeastKind).toHaveLength(1);
    expect(res.body.attenuationByYeastKind[0].meanPct).toBeCloseTo((80 + 75) / 2, 6);
    expect((await new TestClient().get('/api/me/brew-averages')).status).toBe(401);
  });
});
