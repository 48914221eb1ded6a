import { describe, expect, it } from 'vitest';
import { signedInClient } from '../helpers/users';
import { brewDayRow, brewDayVia, today } from './fixtures';
import type { FieldIssue } from '@/lib/errors';

type ErrorBody = { error: { message: string; fields: FieldIssue[] } };

/** Unfolds an iCalendar text (RFC 5545 §3.1) into its content lines, checking each component closes. */
function parseIcs(text: string): { name: string; props: Record<string, string> }[] {
  const lines = text
    .replace(/\r\n[ \t]/g, '')
    .split('\r\n')
    .filter(Boolean);
  const stack: { name: string; props: Record<string, string> }[] = [];
  const done: { name: string; props: Record<string, string> }[] = [];
  for (const line of lines) {
    const colon = line.indexOf(':');
    expect(colon, `content line without a colon: ${line}`).toBeGreaterThan(0);
    const key = line.slice(0, colon);
    const value = line.slice(colon + 1);
    if (key === 'BEGIN') stack.push({ name: value, props: {} });
    else if (key === 'END') {
      const open = stack.pop();
      expect(open?.name).toBe(value);
      done.push(open!);
    } else stack.at(-1)!.props[key] = value;
  }
  expect(stack).toHaveLength(0);
  return done;
}

describe('planning a brew day back from the pour date', () => {
  it('saves the plan with the brew day and exports it as a calendar', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(1) } });
    const res = await client.put<{ readyOn: string; shortfallDays: number; events: { kind: string }[] }>(
      `/api/brew-days/${brewDayId}/plan`,
      { pourOn: today(40), carbonation: 'burst', dryHopIn: 'keg', crash: true },
    );
    expect(res.status).toBe(200);
    expect(res.body.shortfallDays).toBe(0);
    const row = await brewDayRow(brewDayId);
    expect(row.plan?.readyOn).toBe(res.body.readyOn);
    expect(row.plan?.brewOn).toBe(today(1));

    const cal = await client.fetch(`/api/brew-days/${brewDayId}/calendar`);
    expect(cal.status).toBe(200);
    expect(cal.headers.get('content-type')).toMatch(/text\/calendar/);
    const components = parseIcs(await cal.text());
    const calendar = components.find((c) => c.name === 'VCALENDAR')!;
    expect(calendar.props.VERSION).toBe('2.0');
    const events = components.filter((c) => c.name === 'VEVENT');
    expect(events).toHaveLength(res.body.events.length);
    expect(events[0].props['DTSTART;VALUE=DATE']).toBe(today(1).replaceAll('-', ''));
    // RFC 5545 (iCalendar, 2009), 3.8.4.7: every event has a UID, unique to it.
    for (const e of events) expect(e.props.UID).toMatch(/\S/);
    expect(new Set(events.map((e) => e.props.UID)).size).toBe(events.length);
  });

  it('refuses a pour date in the past, naming the field, and keeps the saved plan', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(1) } });
    await client.put(`/api/brew-days/${brewDayId}/plan`, { pourOn: today(30), carbonation: 'burst' });
    const before = (await brewDayRow(brewDayId)).plan;
    const past = await client.put<ErrorBody>(`/api/brew-days/${brewDayId}/plan`, {
      pourOn: today(-3),
      carbonation: 'burst',
    });
    expect(past.status).toBe(400);
    expect(past.body.error.fields[0]).toMatchObject({ path: 'pourOn' });
    expect(past.body.error.fields[0].message).toMatch(/in the past/);
    const bad = await client.put<ErrorBody>(`/api/brew-days/${brewDayId}/plan`, {
      pourOn: today(30),
      carbonation: 'sideways',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.map((f) => f.path)).toContain('carbonation');
    expect((await brewDayRow(brewDayId)).plan).toEqual(before);
  });

  it('has no calendar before a plan is made', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client);
    expect((await client.fetch(`/api/brew-days/${brewDayId}/calendar`)).status).toBe(404);
  });
});
