import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { correctHydrometerReading } from '@/lib/brewing';
import { brewDayEntries } from '@/db/schema';
import { TestClient } from '../helpers/http';
import { signedInClient, TEST_PASSWORD } from '../helpers/users';
import { brewDayRow, brewDayVia, ogEntry, today } from './fixtures';

type ErrorBody = {
  error: { code: string; message: string; fields: { path: string; message: string }[]; details?: unknown };
};

async function entriesOf(brewDayId: string) {
  return db.select().from(brewDayEntries).where(eq(brewDayEntries.brewDayId, brewDayId));
}

/** A second phone signed in as the same brewer. */
async function secondDevice(email: string): Promise<TestClient> {
  const client = new TestClient();
  if (!(await client.signIn(email, TEST_PASSWORD))) throw new Error('second device could not sign in');
  return client;
}

describe('brew-day mode writes', () => {
  it('saves a reading posted twice with the same idempotency key exactly once, with the same answer', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { og: null } });
    const write = {
      idempotencyKey: randomUUID(),
      kind: 'field',
      field: 'og',
      value: { method: 'hydrometer', value: 1.052, sampleTempC: 20 },
      knownValue: null,
    };
    const first = await client.post(`/api/brew-days/${brewDayId}/live`, write);
    expect(first.status).toBe(201);
    const again = await client.post(`/api/brew-days/${brewDayId}/live`, write);
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    const rows = await entriesOf(brewDayId);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ kind: 'field', name: 'og', outcome: 'saved', status: 201 });
    // Stored corrected for the sample's temperature, as the brew-day form stores it.
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(correctHydrometerReading(1.052, 20), 4);

    // Sent at the same moment (two retries racing): still one row.
    const racing = { ...write, idempotencyKey: randomUUID(), field: 'mashPh', value: 5.3 };
    const answers = await Promise.all([1, 2, 3].map(() => client.post(`/api/brew-days/${brewDayId}/live`, racing)));
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201]);
    expect((await entriesOf(brewDayId)).filter((r) => r.name === 'mashPh')).toHaveLength(1);

    // The same key for a different write is refused rather than answered with the old result.
    const reused = await client.post<ErrorBody>(`/api/brew-days/${brewDayId}/live`, { ...write, value: 5 });
    expect(reused.status).toBe(400);
    const misused = await client.post<ErrorBody>(`/api/brew-days/${brewDayId}/live`, {
      ...write,
      value: { method: 'hydrometer', value: 1.06 },
    });
    expect(misused.status).toBe(409);
    expect(misused.body.error.fields[0].path).toBe('idempotencyKey');
    expect(await entriesOf(brewDayId)).toHaveLength(2);
  });

  it('keeps both values when a second device enters the same field, and overwrites only when asked', async () => {
    const { client: phone, user } = await signedInClient();
    const tablet = await secondDevice(user.email);
    const { brewDayId } = await brewDayVia(phone, { fields: { og: null } });
    const og = ogEntry;
    expect((await phone.post(`/api/brew-days/${brewDayId}/live`, og(1.05, null))).status).toBe(201);
    // The tablet last saw an empty OG: its different value does not replace the phone's.
    const clash = og(1.054, null);
    const conflict = await tablet.post<ErrorBody>(`/api/brew-days/${brewDayId}/live`, clash);
    expect(conflict.status).toBe(409);
    expect(conflict.body.error.message).toMatch(/another device/);
    expect(conflict.body.error.details).toMatchObject({
      field: 'og',
      yours: { method: 'hydrometer', value: 1.054 },
      theirs: { method: 'hydrometer', value: 1.05 },
    });
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.05, 4);
    const rows = await entriesOf(brewDayId);
    expect(rows.map((r) => r.outcome).sort()).toEqual(['conflict', 'saved']);
    expect(rows.find((r) => r.outcome === 'conflict')?.request).toMatchObject({ value: { value: 1.054 } });
    // A retry of the conflicting write gets the same 409, and writes nothing more.
    expect((await tablet.post(`/api/brew-days/${brewDayId}/live`, clash)).status).toBe(409);
    expect(await entriesOf(brewDayId)).toHaveLength(2);

    // The same value from both devices is no conflict.
    expect((await tablet.post(`/api/brew-days/${brewDayId}/live`, og(1.05, null))).status).toBe(201);

    // The brewer chose the tablet's value: sent again knowing the phone's, it is saved.
    const chosen = await tablet.post(
      `/api/brew-days/${brewDayId}/live`,
      og(1.054, { method: 'hydrometer', value: 1.05 }),
    );
    expect(chosen.status).toBe(201);
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.054, 4);
    const state = await phone.get<{ fields: { og: { value: unknown; savedAt: string } } }>(
      `/api/brew-days/${brewDayId}/live`,
    );
    expect(state.status).toBe(200);
    expect(state.body.fields.og.value).toMatchObject({ value: 1.054 });
    expect(state.body.fields.og.savedAt).toBeTruthy();
  });

  it('ticks steps of the version, checks readings like the brew-day form, and is the brewer’s alone', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client);
    const post = (body: Record<string, unknown>) =>
      client.post<ErrorBody>(`/api/brew-days/${brewDayId}/live`, { idempotencyKey: randomUUID(), ...body });
    expect((await post({ kind: 'step', stepId: 'boil', checked: true })).status).toBe(201);
    expect(Object.keys((await brewDayRow(brewDayId)).checkedSteps)).toEqual(['boil']);
    const unknown = await post({ kind: 'step', stepId: 'decoct', checked: true });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields[0].path).toBe('stepId');

    const ph = await post({ kind: 'field', field: 'mashPh', value: 9, knownValue: null });
    expect(ph.status).toBe(400);
    expect(ph.body.error.fields).toEqual([{ path: 'value', message: 'Mash pH must be between 3 and 8' }]);
    const og = await post({ kind: 'field', field: 'og', value: { method: 'hydrometer', value: 1.5 } });
    expect(og.body.error.fields[0]).toMatchObject({ path: 'value.value' });
    const field = await post({ kind: 'field', field: 'fg', value: 1.01 });
    expect(field.status).toBe(400);
    expect(await post({ kind: 'field', field: 'og', value: 'x', idempotencyKey: 'nope' })).toMatchObject({
      status: 400,
    });
    expect(await entriesOf(brewDayId)).toHaveLength(1);

    const { client: other } = await signedInClient();
    const refused = await other.post(`/api/brew-days/${brewDayId}/live`, {
      idempotencyKey: randomUUID(),
      kind: 'step',
      stepId: 'boil',
      checked: false,
    });
    expect(refused.status).toBe(403);
    expect((await other.get(`/api/brew-days/${brewDayId}/live`)).status).toBe(403);
    expect((await new TestClient().get(`/api/brew-days/${brewDayId}/live`)).status).toBe(401);
  });

  it('answers the brewer’s calibration beside the plain averages the earlier answer had', async () => {
    const { client } = await signedInClient();
    await brewDayVia(client, { fields: { brewedOn: today(-30), og: { method: 'hydrometer', value: 1.05 } } });
    const one = await client.get<{ calibration: { efficiency: unknown }; efficiency: { count: number } }>(
      '/api/me/brew-averages',
    );
    // One brew: the plain mean is there, the calibration offers nothing.
    expect(one.body.efficiency.count).toBe(1);
    expect(one.body.calibration.efficiency).toBeNull();
    await brewDayVia(client, { fields: { brewedOn: today(-10), og: { method: 'hydrometer', value: 1.046 } } });
    const two = await client.get<{
      brewDayCount: number;
      calibration: { efficiency: { count: number; weightedMeanPct: number; spreadPct: number } };
      history: { measuredOg: number }[];
    }>('/api/me/brew-averages');
    expect(two.body.brewDayCount).toBe(2);
    expect(two.body.calibration.efficiency.count).toBe(2);
    expect(two.body.calibration.efficiency.spreadPct).toBeGreaterThan(0);
    expect(two.body.history.map((h) => h.measuredOg)).toEqual([1.05, 1.046]);
  });
});
