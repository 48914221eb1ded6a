import { describe, expect, it } from 'vitest';
import {
  openAccountMenu,
  openBrowser,
  signInThroughPage,
  shareSessionOf,
  type BrowserSession,
} from '../helpers/browser';
import { BASE_URL } from '../helpers/env';
import { TestClient } from '../helpers/http';
import { signedInClient, TEST_PASSWORD } from '../helpers/users';
import { brewDayRow, brewDayVia, today } from '../brew-days/fixtures';

/**
 * The browser's own complaints, less those a deliberately cut connection causes, the worker's
 * offline page (503) and the conflict answer (409) brew-day mode expects and shows.
 */
const realProblems = (s: BrowserSession) =>
  s.problems.filter((p) => !/ERR_INTERNET_DISCONNECTED|HTTP (503|409): .*\/live$/.test(p));

/** What brew-day mode may have left in this browser: caches, IndexedDB, workers, its cookie and timers. */
async function leftBehind(s: BrowserSession) {
  const stored = await s.page.evaluate(async () => ({
    caches: await caches.keys(),
    databases: (await indexedDB.databases()).map((d) => d.name),
    workers: (await navigator.serviceWorker.getRegistrations()).map((r) => r.scope),
    timers: Object.keys(localStorage).filter((k) => k.startsWith('kettlefork-brew-day')),
  }));
  const cookies = (await s.context.cookies()).map((c) => c.name).filter((n) => n === 'kf-offline-tag');
  return { ...stored, cookies };
}

describe('brew-day mode across devices and members', { timeout: 240_000 }, () => {
  it('leaves nothing of the brew day on a shared phone once the member signs out', async () => {
    const s = await openBrowser({ width: 390, height: 844 });
    try {
      const { client, user } = await signedInClient();
      const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(), og: null } });
      await signInThroughPage(s, user.email);
      const { page, context } = s;
      await page.goto(`/brew-days/${brewDayId}/live`);
      await page.getByText('Kept for offline use.').waitFor();
      await page.getByRole('button', { name: 'Boil for 60 min' }).click();
      await page.getByRole('button', { name: 'Start timer' }).click();

      // A tick made while Kettlefork cannot be reached waits in IndexedDB.
      await context.route('**/api/brew-days/*/live', (route) =>
        route.request().method() === 'POST' ? route.abort('internetdisconnected') : route.continue(),
      );
      await context.setOffline(true);
      await page.getByRole('checkbox', { name: 'Done: Chill to 18 °C' }).check();
      await page.getByText('Offline. 1 waiting on this phone until the connection returns.').waitFor();
      const kept = await leftBehind(s);
      expect(kept.caches).toEqual(['kettlefork-brew-day-v2']);
      expect(kept.databases).toContain('kettlefork-brew-day');
      expect(kept.workers).toEqual([`${BASE_URL}/brew-days/`]);
      expect(kept.cookies).toEqual(['kf-offline-tag']);
      expect(kept.timers.length).toBeGreaterThan(0);

      // Back online (the tick still cannot get through), the member signs out from the site's header.
      await context.setOffline(false);
      await page.goto('/brew-days');
      await (await openAccountMenu(page)).getByRole('button', { name: 'Sign out' }).click();
      await page.getByText('1 brew-day entry has not been sent from this device.').waitFor();
      await s.shot('sign-out-unsent-phone');
      await page.getByRole('button', { name: 'Sign out anyway' }).click();
      await page.getByRole('link', { name: 'Sign in' }).waitFor();
      expect(await leftBehind(s)).toEqual({ caches: [], databases: [], workers: [], timers: [], cookies: [] });

      // Offline, the next person finds no brew-day mode to open.
      await context.setOffline(true);
      await expect(page.goto(`/brew-days/${brewDayId}/live`)).rejects.toThrow(/ERR_INTERNET_DISCONNECTED/);
      expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});
      expect(realProblems(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('answers a kept brew-day page offline only to the session it was kept for', async () => {
    const s = await openBrowser({ width: 390, height: 844 });
    try {
      const { client } = await signedInClient();
      const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(), og: null } });
      await shareSessionOf(s, client);
      const { page, context } = s;
      await page.goto(`/brew-days/${brewDayId}/live`);
      await page.getByText('Kept for offline use.').waitFor();

      // The session is gone without signing out here (cookies cleared, or ended): the kept copy is not shown.
      await context.clearCookies();
      await context.setOffline(true);
      await page.goto(`/brew-days/${brewDayId}/live`);
      await page.getByRole('heading', { name: 'No connection' }).waitFor();
      expect(await page.getByText(/Heat the strike water/).count()).toBe(0);
      await s.shot('live-offline-other-session-phone');
      expect(realProblems(s)).toEqual([]);
    } finally {
      await s.close();
    }
  });

  it('shows a clash of OG readings on both devices and settles it on both from either', async () => {
    const { client, user } = await signedInClient();
    const other = new TestClient();
    expect(await other.signIn(user.email, TEST_PASSWORD)).toBe(true);
    const { brewDayId } = await brewDayVia(client, { fields: { brewedOn: today(), og: null } });
    const phone = await openBrowser({ width: 390, height: 844 });
    const tablet = await openBrowser({ width: 1280, height: 900 });
    try {
      await shareSessionOf(phone, client);
      await shareSessionOf(tablet, other);
      for (const s of [phone, tablet]) {
        await s.page.goto(`/brew-days/${brewDayId}/live`);
        await s.page.getByText('Kept for offline use.').waitFor();
        await s.page.getByRole('button', { name: 'Transfer to the fermenter' }).click();
      }

      // The phone takes its OG without a connection; the tablet saves a different one meanwhile.
      await phone.context.setOffline(true);
      const phoneOg = phone.page.getByTestId('live-field-og');
      await phoneOg.getByLabel(/^OG/).fill('1.048');
      await phoneOg.getByRole('button', { name: 'Save OG' }).click();
      await phone.page.getByTestId('waiting-og').getByText('1.048').waitFor();
      const tabletOg = tablet.page.getByTestId('live-field-og');
      await tabletOg.getByLabel(/^OG/).fill('1.052');
      await tabletOg.getByRole('button', { name: 'Save OG' }).click();
      await tablet.page.getByTestId('saved-og').getByText('1.052').waitFor();

      // Back online, the phone's OG clashes: both values, who and when, and a choice.
      await phone.context.setOffline(false);
      const onPhone = phone.page.getByTestId('conflict-og');
      await onPhone.getByText(/Saved: 1\.052/).waitFor({ timeout: 30_000 });
      await onPhone.getByText(/Also entered: 1\.048 by .+ at .+ on this device/).waitFor();
      await phone.shot('live-conflict-phone');

      // The tablet, whose OG was saved first, is shown the same clash on its next read.
      const onTablet = tablet.page.getByTestId('conflict-og');
      await onTablet.getByText(/Also entered: 1\.048 by .+ on another device/).waitFor({ timeout: 30_000 });
      await tablet.page.getByText('Two values for OG: choose one above.').waitFor();
      await tablet.shot('live-conflict-desktop');

      // Chosen on the tablet, it is settled on the phone too.
      await onTablet.getByRole('button', { name: 'Keep 1.048' }).click();
      await tablet.page.getByTestId('saved-og').getByText('1.048').waitFor();
      expect(await onTablet.count()).toBe(0);
      await phone.page.getByTestId('saved-og').getByText('1.048').waitFor({ timeout: 30_000 });
      expect(await onPhone.count()).toBe(0);
      expect((await brewDayRow(brewDayId)).og).toBeCloseTo(1.048, 4);
      await phone.page.getByText('Online · everything entered is saved').waitFor();
      await phone.shot('live-conflict-settled-phone');

      // Offline, the phone ticks the chill; the tablet ticks it and unticks it again meanwhile.
      await phone.context.setOffline(true);
      await phone.page.getByRole('checkbox', { name: 'Done: Chill to 18 °C' }).check();
      await phone.page.getByText('Offline. 1 waiting on this phone until the connection returns.').waitFor();
      const tabletChill = tablet.page.getByRole('checkbox', { name: 'Done: Chill to 18 °C' });
      await tabletChill.check();
      await tablet.page.getByText('Online · everything entered is saved').waitFor();
      await tabletChill.uncheck();
      await tablet.page.getByText('Online · everything entered is saved').waitFor();
      await expect.poll(async () => (await brewDayRow(brewDayId)).checkedSteps).toEqual({});

      // Back online, the phone's tick does not undo the untick silently: it asks.
      await phone.context.setOffline(false);
      const chill = phone.page.getByTestId('conflict-chill');
      await chill.getByText('“Chill to 18 °C”: done or not done?').waitFor({ timeout: 30_000 });
      await chill.getByText(/Saved: not done/).waitFor();
      await chill.getByText(/Also entered: done .* on this device/).waitFor();
      expect(await phone.page.getByRole('checkbox', { name: 'Done: Chill to 18 °C' }).isChecked()).toBe(false);
      await phone.shot('live-step-conflict-phone');
      await chill.getByRole('button', { name: 'Keep not done' }).click();
      await chill.waitFor({ state: 'detached' });
      expect((await brewDayRow(brewDayId)).checkedSteps).toEqual({});
      expect(realProblems(phone)).toEqual([]);
      expect(realProblems(tablet)).toEqual([]);
    } finally {
      await phone.close();
      await tablet.close();
    }
  });
});
