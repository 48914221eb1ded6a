import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { brewDayEntries } from '@/db/schema';
import { openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import { signedInClient } from '../helpers/users';
import { brewDayRow, brewDayVia, today } from '../brew-days/fixtures';

/** The browser's own complaints, less those a deliberately cut connection causes. */
const realProblems = (s: BrowserSession) => s.problems.filter((p) => !/ERR_INTERNET_DISCONNECTED/.test(p));

interface CalendarComponent {
  name: string;
  props: { name: string; params: Record<string, string>; value: string }[];
  children: CalendarComponent[];
}

/**
 * A small iCalendar reader (RFC 5545 §3.1: unfold lines, NAME;PARAM=V:VALUE, BEGIN/END nesting).
 * Throws on anything a calendar application would reject.
 */
function parseCalendar(text: string): CalendarComponent {
  if (!text.includes('\r\n')) throw new Error('lines must end in CRLF');
  const lines = text
    .replace(/\r\n[ \t]/g, '')
    .split('\r\n')
    .filter(Boolean);
  const stack: CalendarComponent[] = [];
  let root: CalendarComponent | null = null;
  for (const line of lines) {
    const colon = line.indexOf(':');
    if (colon < 1) throw new Error(`not a content line: ${line}`);
    const [name, ...paramParts] = line.slice(0, colon).split(';');
    const value = line.slice(colon + 1);
    if (!/^[A-Z0-9-]+$/i.test(name)) throw new Error(`bad property name: ${name}`);
    const params = Object.fromEntries(paramParts.map((p) => p.split('=') as [string, string]));
    if (name === 'BEGIN') {
      const component: CalendarComponent = { name: value, props: [], children: [] };
      if (stack.length) stack[stack.length - 1].children.push(component);
      else if (root) throw new Error('more than one top-level component');
      else root = component;
      stack.push(component);
    } else if (name === 'END') {
      const open = stack.pop();
      if (!open || open.name !== value) throw new Error(`END:${value} does not close ${open?.name}`);
    } else {
      if (!stack.length) throw new Error(`property outside a component: ${name}`);
      stack[stack.length - 1].props.push({ name, params, value });
    }
  }
  if (stack.length || !root) throw new Error('unclosed component');
  return root;
}

const prop = (c: CalendarComponent, name: string) => c.props.find((p) => p.name === name);

function dateOf(value: string): number {
  const m = /^(\d{4})(\d{2})(\d{2})(T(\d{2})(\d{2})(\d{2})Z?)?$/.exec(value);
  if (!m) throw new Error(`not an iCalendar date: ${value}`);
  const d = Date.UTC(+m[1], +m[2] - 1, +m[3], +(m[5] ?? 0), +(m[6] ?? 0), +(m[7] ?? 0));
  if (new Date(d).getUTCDate() !== +m[3]) throw new Error(`not a real date: ${value}`);
  return d;
}

describe('brew-day mode in a real browser', { timeout: 180_000 }, () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser({ width: 390, height: 844 });
  });
  afterAll(async () => s?.close());

  it('calls the 10-minute hop addition at 50 minutes into a 60-minute boil (fake clock)', async () => {
    // A browser of its own: the fake clock stays paused once set.
    const session = await openBrowser({ width: 390, height: 844 });
    try {
      const { client } = await signedInClient();
      const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(), og: null } });
      await shareSessionOf(session, client);
      const { page } = session;
      await page.clock.install();
      await page.goto(`/brew-days/${brewDayId}/live`);
      await page.getByRole('heading', { name: /Heat the strike water to 72 °C/ }).waitFor();
      await session.shot('live-strike-phone');

      await page.getByRole('button', { name: 'Boil for 60 min' }).click();
      await page.getByRole('heading', { name: 'Boil for 60 min' }).waitFor();
      await page.clock.pauseAt(Date.now() + 60_000);
      await page.getByRole('button', { name: 'Start timer' }).click();
      const calls = page.getByTestId('announcements');
      await page.clock.runFor(1_000);
      await calls.getByText('Start of the boil: add 20 g Magnum').waitFor();

      // 49 min 58.5 s in: not yet.
      await page.clock.fastForward(50 * 60_000 - 3_000);
      await page.clock.runFor(500);
      expect(await calls.getByText(/10 minutes left/).count()).toBe(0);
      expect(await page.getByTestId('timer').textContent()).toMatch(/^10:0[12]$/);

      // 50 min 0.5 s in: called, with 10:00 on the clock.
      await page.clock.runFor(2_000);
      await calls.getByText('10 minutes left: add 25 g Cascade').waitFor();
      expect(await page.getByTestId('timer').textContent()).toMatch(/^(10:00|9:59)$/);
      await session.shot('live-boil-addition-phone');
      expect(realProblems(session)).toEqual([]);
    } finally {
      await session.close();
    }
  });

  it('keeps an OG and a ticked step made offline, and saves each exactly once when back online', async () => {
    const session = await openBrowser({ width: 390, height: 844 });
    try {
      const { client } = await signedInClient();
      const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(), og: null } });
      await shareSessionOf(session, client);
      const { page, context } = session;
      await page.goto(`/brew-days/${brewDayId}/live`);
      await page.getByText('Kept for offline use.').waitFor();
      await page.getByText('Online · everything entered is saved').waitFor();

      await context.setOffline(true);
      await page.getByText(/^Offline\./).waitFor();
      await page.getByRole('button', { name: 'Transfer to the fermenter' }).click();
      const og = page.getByTestId('live-field-og');
      await og.getByLabel(/^OG/).fill('1.048');
      await og.getByRole('button', { name: 'Save OG' }).click();
      await page.getByTestId('waiting-og').getByText('1.048').waitFor();
      await page.getByRole('checkbox', { name: 'Done: Chill to 18 °C' }).check();
      await page.getByText('Offline. 2 waiting on this phone until the connection returns.').waitFor();
      expect(await db.select().from(brewDayEntries).where(eq(brewDayEntries.brewDayId, brewDayId))).toHaveLength(0);

      // Reopened without a connection: the service worker's copy, with what waits in IndexedDB.
      await page.reload();
      await page.getByRole('heading', { name: /Heat the strike water/ }).waitFor();
      await page.getByTestId('outbox').getByText('OG 1.048 · waiting to send').waitFor();
      await session.shot('live-offline-phone');

      await context.setOffline(false);
      await page.getByText('Online · everything entered is saved').waitFor({ timeout: 30_000 });
      await page.getByRole('button', { name: 'Transfer to the fermenter' }).click();
      await page.getByTestId('saved-og').getByText('1.048').waitFor();

      const rows = await db.select().from(brewDayEntries).where(eq(brewDayEntries.brewDayId, brewDayId));
      expect(rows.map((r) => `${r.kind}:${r.name}:${r.outcome}`).sort()).toEqual([
        'field:og:saved',
        'step:chill:saved',
      ]);
      const day = await brewDayRow(brewDayId);
      expect(day.og).toBeCloseTo(1.048, 4);
      expect(Object.keys(day.checkedSteps)).toEqual(['chill']);
      await page.setViewportSize({ width: 1280, height: 900 });
      await session.shot('live-saved-desktop');
      expect(realProblems(session)).toEqual([]);
    } finally {
      await session.close();
    }
  });

  it('offers the saved plan as a calendar file that parses as valid iCalendar', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(1) } });
    const plan = await client.put(`/api/brew-days/${brewDayId}/plan`, { pourOn: today(40), carbonation: 'burst' });
    expect(plan.status).toBe(200);
    await shareSessionOf(s, client);
    await s.page.goto(`/brew-days/${brewDayId}`);
    const [download] = await Promise.all([
      s.page.waitForEvent('download'),
      s.page.getByRole('link', { name: /Add to my calendar/ }).click(),
    ]);
    const stream = await download.createReadStream();
    const chunks: Buffer[] = [];
    for await (const chunk of stream) chunks.push(chunk as Buffer);
    const calendar = parseCalendar(Buffer.concat(chunks).toString('utf8'));
    expect(calendar.name).toBe('VCALENDAR');
    expect(prop(calendar, 'VERSION')?.value).toBe('2.0');
    expect(prop(calendar, 'PRODID')?.value).toBeTruthy();
    const events = calendar.children.filter((c) => c.name === 'VEVENT');
    expect(events.length).toBeGreaterThan(3);
    const uids = new Set<string>();
    for (const event of events) {
      for (const required of ['UID', 'DTSTAMP', 'DTSTART', 'SUMMARY']) expect(prop(event, required)).toBeTruthy();
      uids.add(prop(event, 'UID')!.value);
      const start = prop(event, 'DTSTART')!;
      const end = prop(event, 'DTEND')!;
      expect(start.params.VALUE).toBe('DATE');
      expect(dateOf(end.value)).toBeGreaterThan(dateOf(start.value));
      dateOf(prop(event, 'DTSTAMP')!.value);
      for (const alarm of event.children) {
        expect(alarm.name).toBe('VALARM');
        expect(prop(alarm, 'ACTION')?.value).toBe('DISPLAY');
        expect(prop(alarm, 'TRIGGER')?.value).toMatch(/^-P/);
      }
    }
    expect(uids.size).toBe(events.length);
    expect(prop(events[0], 'DTSTART')!.value).toBe(today(1).replaceAll('-', ''));
    expect(realProblems(s)).toEqual([]);
  });

  it('shows predicted against measured on the member’s brew-days page', async () => {
    const { client } = await signedInClient();
    await brewDayVia(client, { fields: { brewedOn: today(-40), og: { method: 'hydrometer', value: 1.049 } } });
    await brewDayVia(client, {
      fields: {
        brewedOn: today(-5),
        og: { method: 'hydrometer', value: 1.053 },
        fg: { method: 'hydrometer', value: 1.012 },
      },
    });
    await s.context.clearCookies();
    await shareSessionOf(s, client);
    await s.page.goto('/brew-days');
    await s.page.getByRole('heading', { name: 'Predicted and measured, brew by brew' }).waitFor();
    for (const key of ['og', 'fg', 'efficiency'])
      expect(await s.page.getByTestId(`calibration-${key}`).count()).toBe(1);
    await s.page
      .getByText(/Brewhouse efficiency/)
      .first()
      .waitFor();
    expect(await s.page.getByTestId('calibration-og').locator('circle.fill-copper').count()).toBe(2);
    await s.shot('brew-days-calibration-phone');
    await s.page.setViewportSize({ width: 1280, height: 900 });
    await s.shot('brew-days-calibration-desktop');
    await s.page.setViewportSize({ width: 390, height: 844 });
    expect(realProblems(s)).toEqual([]);
  });
});
