import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db } from '@/db';
import { brewDayEntries } from '@/db/schema';
import type { LiveConflict, LiveState } from '@/lib/brew-days/live-steps';
import { TestClient } from '../helpers/http';
import { signedInClient, TEST_PASSWORD } from '../helpers/users';
import { brewDayRow, brewDayVia, ogEntry } from './fixtures';

type ErrorBody = {
  error: { code: string; message: string; fields: { path: string; message: string }[]; details?: unknown };
};

/** A second phone signed in as the same brewer. */
async function secondDevice(email: string): Promise<TestClient> {
  const client = new TestClient();
  if (!(await client.signIn(email, TEST_PASSWORD))) throw new Error('second device could not sign in');
  return client;
}

async function stateOf(client: TestClient, brewDayId: string): Promise<LiveState> {
  const res = await client.get<LiveState>(`/api/brew-days/${brewDayId}/live`);
  expect(res.status).toBe(200);
  return res.body;
}

async function entriesOf(brewDayId: string) {
  return db.select().from(brewDayEntries).where(eq(brewDayEntries.brewDayId, brewDayId));
}

const og = ogEntry;

const tick = (stepId: string, checked: boolean, basedOn: string | null) => ({
  idempotencyKey: randomUUID(),
  kind: 'step',
  stepId,
  checked,
  basedOn,
});

const choice = (conflict: LiveConflict, keep: 'entered' | 'saved') => ({
  idempotencyKey: randomUUID(),
  kind: 'resolve',
  conflictId: conflict.id,
  keep,
  savedToken: conflict.savedToken,
});

describe('brew-day mode conflicts on every device', () => {
  it('shows a clash of readings on both devices, with who and when, until one of them chooses', async () => {
    const { client: phone, user } = await signedInClient();
    const tablet = await secondDevice(user.email);
    const { brewDayId } = await brewDayVia(phone, { fields: { og: null } });
    const live = `/api/brew-days/${brewDayId}/live`;

    expect((await phone.post(live, og(1.05, null))).status).toBe(201);
    const clash = await tablet.post<ErrorBody>(live, og(1.054, null));
    expect(clash.status).toBe(409);
    const sent = (clash.body.error.details as { conflict: LiveConflict }).conflict;

    // The phone, whose value was saved first, learns of the second value on its next read.
    const seenByPhone = await stateOf(phone, brewDayId);
    expect(seenByPhone.conflicts).toHaveLength(1);
    const [conflict] = seenByPhone.conflicts;
    expect(conflict).toMatchObject({
      kind: 'field',
      field: 'og',
      entered: { method: 'hydrometer', value: 1.054 },
      saved: { method: 'hydrometer', value: 1.05 },
      enteredBy: user.name,
      savedBy: user.name,
    });
    expect(Date.parse(conflict.enteredAt)).toBeGreaterThanOrEqual(Date.parse(conflict.savedAt!));
    // The answer the tablet got names the same conflict the read shows.
    expect(sent).toEqual(conflict);
    expect((await stateOf(tablet, brewDayId)).conflicts).toEqual([conflict]);

    // Refusals name their field and change nothing.
    for (const [body, path, status] of [
      [{ ...choice(conflict, 'entered'), conflictId: 'nope' }, 'conflictId', 400],
      [{ ...choice(conflict, 'entered'), keep: 'both' }, 'keep', 400],
      [{ ...choice(conflict, 'entered'), savedToken: '' }, 'savedToken', 400],
      [{ ...choice(conflict, 'entered'), conflictId: randomUUID() }, 'conflictId', 404],
      [{ ...choice(conflict, 'entered'), savedToken: 'none|null' }, 'savedToken', 409],
    ] as const) {
      const refused = await phone.post<ErrorBody>(live, body);
      expect(refused.status, path).toBe(status);
      expect(refused.body.error.fields.map((f) => f.path)).toContain(path);
    }
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.05, 4);

    // The phone chooses the tablet's value; sent twice, it is saved once.
    const chosen = choice(conflict, 'entered');
    const first = await phone.post<{ outcome: string; value: unknown }>(live, chosen);
    expect(first.status).toBe(201);
    expect(first.body.value).toMatchObject({ value: 1.054 });
    expect((await phone.post(live, chosen)).body).toEqual(first.body);
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.054, 4);

    // Settled on the phone, it is gone from the tablet too; a choice made there as well is refused.
    const seenByTablet = await stateOf(tablet, brewDayId);
    expect(seenByTablet.conflicts).toEqual([]);
    expect(seenByTablet.fields.og.value).toMatchObject({ value: 1.054 });
    const late = await tablet.post<ErrorBody>(live, choice(conflict, 'saved'));
    expect(late.status).toBe(409);
    expect(late.body.error.fields[0].path).toBe('conflictId');
    expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.054, 4);
    const rows = await entriesOf(brewDayId);
    expect(rows.filter((r) => r.outcome === 'conflict').map((r) => Boolean(r.resolvedAt))).toEqual([true]);
    expect(rows).toHaveLength(3);
  });

  it('keeps the saved value when chosen, and settles a conflict a later reading agrees with', async () => {
    const { client: phone, user } = await signedInClient();
    const tablet = await secondDevice(user.email);
    const { brewDayId } = await brewDayVia(phone, { fields: { og: null } });
    const live = `/api/brew-days/${brewDayId}/live`;
    await phone.post(live, { ...og(5.3, null), field: 'mashPh', value: 5.3 });
    expect((await tablet.post(live, { ...og(5.5, null), field: 'mashPh', value: 5.5 })).status).toBe(409);
    const [ph] = (await stateOf(tablet, brewDayId)).conflicts;
    expect(ph).toMatchObject({ field: 'mashPh', entered: 5.5, saved: 5.3 });
    expect((await tablet.post(live, choice(ph, 'saved'))).status).toBe(201);
    expect((await brewDayRow(brewDayId)).mashPh).toBeCloseTo(5.3, 4);
    expect((await stateOf(phone, brewDayId)).conflicts).toEqual([]);

    // A second clash, then the phone enters the tablet's value itself: the two agree, nothing to ask.
    expect((await tablet.post(live, { ...og(5.6, 5.1), field: 'mashPh', value: 5.6, knownValue: 5.1 })).status).toBe(
      409,
    );
    expect((await stateOf(phone, brewDayId)).conflicts).toHaveLength(1);
    expect((await phone.post(live, { ...og(5.6, 5.3), field: 'mashPh', value: 5.6, knownValue: 5.3 })).status).toBe(
      201,
    );
    expect((await stateOf(tablet, brewDayId)).conflicts).toEqual([]);
  });

  it('asks when a step was ticked on one device and ticked then unticked on another meanwhile', async () => {
    const { client: phone, user } = await signedInClient();
    const tablet = await secondDevice(user.email);
    const { brewDayId } = await brewDayVia(phone);
    const live = `/api/brew-days/${brewDayId}/live`;
    expect((await stateOf(phone, brewDayId)).stepRevisions).toEqual({});

    // The phone is offline: its tick (made when the step had never been ticked) waits.
    const phoneTick = tick('chill', true, null);
    // Meanwhile the tablet ticks the step and unticks it again.
    const tabletTick = tick('chill', true, null);
    expect((await tablet.post(live, tabletTick)).status).toBe(201);
    expect((await tablet.post(live, tick('chill', false, tabletTick.idempotencyKey))).status).toBe(201);
    expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});

    // Back online: the phone's tick does not silently undo the tablet's untick.
    const clash = await phone.post<ErrorBody>(live, phoneTick);
    expect(clash.status).toBe(409);
    expect(clash.body.error.fields[0].path).toBe('checked');
    expect(clash.body.error.message).toMatch(/Chill to 18 °C/);
    expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});
    // A retry gets the same answer and keeps nothing more.
    expect((await phone.post(live, phoneTick)).body).toEqual(clash.body);
    expect(await entriesOf(brewDayId)).toHaveLength(3);

    // Both devices see it: done on the phone, not done as saved from the tablet.
    const [conflict] = (await stateOf(tablet, brewDayId)).conflicts;
    expect(conflict).toMatchObject({ kind: 'step', stepId: 'chill', entered: true, saved: false, savedBy: user.name });
    expect((await stateOf(phone, brewDayId)).conflicts).toEqual([conflict]);

    // The tablet chooses the phone's tick; the phone's next read has it, and nothing left to ask.
    expect((await tablet.post(live, choice(conflict, 'entered'))).status).toBe(201);
    const after = await stateOf(phone, brewDayId);
    expect(after.conflicts).toEqual([]);
    expect(Object.keys(after.checkedSteps)).toEqual(['chill']);

    // An untick that follows what the device saw is saved; one that follows an older write asks.
    const untick = tick('chill', false, after.stepRevisions.chill);
    expect((await phone.post(live, untick)).status).toBe(201);
    expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});
    const stale = await tablet.post<ErrorBody>(live, tick('chill', true, tabletTick.idempotencyKey));
    expect(stale.status).toBe(409);
    expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});
  });

  it('raises no question when devices agree, or a device follows its own waiting tick', async () => {
    const { client: phone, user } = await signedInClient();
    const tablet = await secondDevice(user.email);
    const { brewDayId } = await brewDayVia(phone);
    const live = `/api/brew-days/${brewDayId}/live`;

    // Both tick the boil without having seen each other: the same answer, no conflict.
    expect((await tablet.post(live, tick('boil', true, null))).status).toBe(201);
    expect((await phone.post(live, tick('boil', true, null))).status).toBe(201);

    // Offline, the phone ticks the sparge and unticks it again, the untick naming its own tick.
    const own = tick('sparge', true, null);
    expect((await phone.post(live, own)).status).toBe(201);
    expect((await phone.post(live, tick('sparge', false, own.idempotencyKey))).status).toBe(201);

    const state = await stateOf(tablet, brewDayId);
    expect(state.conflicts).toEqual([]);
    expect(Object.keys(state.checkedSteps)).toEqual(['boil']);

    // A tick naming a write that is not this step's is not trusted blindly.
    const unknown = await phone.post<ErrorBody>(live, tick('boil', false, randomUUID()));
    expect(unknown.status).toBe(409);
    const bad = await phone.post<ErrorBody>(live, { ...tick('boil', false, null), basedOn: 'yesterday' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields[0].path).toBe('basedOn');
    expect(Object.keys((await brewDayRow(brewDayId)).checkedSteps)).toEqual(['boil']);
  });
});
