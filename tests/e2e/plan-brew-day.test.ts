import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import { signedInClient } from '../helpers/users';
import { brewDayVia, today } from '../brew-days/fixtures';

describe('planning a brew back from the pour date in a real browser', { timeout: 120_000 }, () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser({ width: 375, height: 800 });
  });
  afterAll(async () => s?.close());

  it('shows the shortfall of a date too soon, saves a plan that works and downloads a valid calendar', async () => {
    const { client } = await signedInClient();
    const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(1) } });
    await shareSessionOf(s, client);
    await s.page.goto(`/brew-days/${brewDayId}`);
    await s.page.getByRole('heading', { name: 'When must it pour?' }).waitFor();
    await s.page.getByLabel('Pour date').fill(today(4));
    await s.page
      .getByTestId('plan-summary')
      .getByText(/cannot be met/)
      .waitFor();
    expect(await s.page.getByText(/Spund near the end of fermentation/).count()).toBe(1);
    await s.shot('plan-shortfall-phone');

    await s.page.getByLabel('Pour date').fill(today(40));
    await s.page
      .getByTestId('plan-summary')
      .getByText(/to spare/)
      .waitFor();
    await s.page.getByRole('button', { name: 'Save plan' }).click();
    await s.page.getByRole('status').getByText('Plan saved').waitFor();
    await s.page.reload();
    const link = s.page.getByRole('link', { name: /Add to my calendar/ });
    await link.waitFor();
    await s.page.setViewportSize({ width: 1280, height: 900 });
    await s.shot('plan-saved-desktop');
    const [download] = await Promise.all([s.page.waitForEvent('download'), link.click()]);
    const text = await readFile((await download.path())!, 'utf8');
    const lines = text
      .replace(/\r\n[ \t]/g, '')
      .split('\r\n')
      .filter(Boolean);
    expect(lines[0]).toBe('BEGIN:VCALENDAR');
    expect(lines.at(-1)).toBe('END:VCALENDAR');
    expect(lines.filter((l) => l === 'BEGIN:VEVENT').length).toBe(lines.filter((l) => l === 'END:VEVENT').length);
    expect(lines).toContain(`DTSTART;VALUE=DATE:${today(1).replaceAll('-', '')}`);
    expect(s.problems).toEqual([]);
  });
});
