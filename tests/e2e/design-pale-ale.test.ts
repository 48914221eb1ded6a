import type { Page } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import type { RecipeDocumentInput } from '@/lib/brewing';
import { editorReady, openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import type { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { brewDayVia, today } from '../brew-days/fixtures';

const US_GALLON_L = 3.785411784;
/** The example target: 128 Ca / 10 Mg / 39 Na / 219 Cl / 130 SO4 / 0 HCO3 mg/L. */
const TARGET = { calcium: 128, magnesium: 10, sodium: 39, chloride: 219, sulfate: 130, bicarbonate: 0 };
const DISTILLED = { calcium: 0, magnesium: 0, sodium: 0, chloride: 0, sulfate: 0, bicarbonate: 0 };

/** 8 US gal of a single-malt pale ale mashed at 156 °F with kveik, fermented too cool for it at first. */
function designDocument(title: string): RecipeDocumentInput {
  const volumeL = Math.round(8 * US_GALLON_L * 100) / 100;
  return paleAle({
    title,
    batch: { volumeL, boilTimeMin: 60, efficiencyPct: 72, mashWaterLPerKg: 5 },
    fermentables: [{ name: 'Pale ale malt', amountKg: 6.5, potentialPpg: 38, colorLovibond: 3, kind: 'grain' }],
    yeasts: [
      { name: 'Kveik (Norwegian farmhouse) yeast', kind: 'kveik', attenuationPct: 78, tempMinC: 29, tempMaxC: 35 },
    ],
    mash: { steps: [{ name: 'Main rest', tempC: 68.9, timeMin: 60 }] },
    fermentation: { steps: [{ tempC: 20, days: 4 }] },
    water: { volumeL, source: DISTILLED, salts: [], target: TARGET },
    carbonation: { volumesCO2: 2.4, servingTempC: 4 },
  });
}

async function browserAs(client: TestClient, width = 1280): Promise<BrowserSession> {
  const s = await openBrowser({ width });
  await shareSessionOf(s, client);
  return s;
}

const textOf = async (page: Page, testId: string) =>
  ((await page.getByTestId(testId).first().textContent()) ?? '').trim();

async function waitForText(page: Page, testId: string, wanted: (text: string) => boolean, what: string) {
  for (let i = 0; i < 50; i++) {
    if (wanted(await textOf(page, testId))) return;
    await page.waitForTimeout(100);
  }
  throw new Error(`${what}: ${testId} still reads "${await textOf(page, testId)}"`);
}

describe('designing a pale ale in the editor', { timeout: 240_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('shows the FG the member’s own measured attenuation would give, once two brews of that yeast kind have one', async () => {
    const { client } = await signedInClient();
    const reading = (value: number) => ({ method: 'hydrometer', value });
    // Apparent attenuation (OG − FG)/(OG − 1): 1.050 → 1.010 is 80 %, 1.048 → 1.012 is 75 % (common practice).
    await brewDayVia(client, { fields: { brewedOn: today(-40), og: reading(1.05), fg: reading(1.01) } });
    const created = await createRecipeVia(client, { document: paleAle({ title: 'Own attenuation pale' }) });
    s = await browserAs(client);
    const { page } = s;
    await page.goto(`/recipes/${created.recipe.slug}/edit`, { waitUntil: 'networkidle' });
    await editorReady(page);
    // One brew teaches nothing yet.
    expect(await page.getByTestId('own-attenuation').count()).toBe(0);

    await brewDayVia(client, { fields: { brewedOn: today(-10), og: reading(1.048), fg: reading(1.012) } });
    await page.reload({ waitUntil: 'networkidle' });
    await editorReady(page);
    const own = page.getByTestId('own-attenuation');
    await own.waitFor({ timeout: 10_000 });
    const text = (await own.textContent()) ?? '';
    // Weighted towards the newer brew, the mean lies between the two brews' 75 % and 80 %.
    const pct = Number(/\((\d+) % over 2 brews/.exec(text)?.[1]);
    expect(pct).toBeGreaterThanOrEqual(75);
    expect(pct).toBeLessThanOrEqual(80);
    expect(text).toMatch(/FG 1\.0\d\d, against the recipe’s 1\.0\d\d|FG 1\.0\d\d, against the recipe's 1\.0\d\d/);
  });

  it('proposes salts for a target, writes them in with one button, and the ions, mash pH, rest and spunding follow', async () => {
    const { client } = await signedInClient();
    const title = `Designed Pale ${Date.now().toString(36)}`;
    const created = await createRecipeVia(client, { document: designDocument(title) });
    s = await browserAs(client);
    const { page } = s;
    await page.goto(`/recipes/${created.recipe.slug}/edit`, { waitUntil: 'networkidle' });
    await editorReady(page);

    // The kveik's range is 29–35 °C: a 20 °C step is flagged.
    const flags = page.locator('#yeast-temperature-flags');
    await flags.waitFor();
    expect(await flags.textContent()).toContain('is below Kveik (Norwegian farmhouse) yeast’s lowest 29 °C');

    // Distilled water: no ions yet; the plan for 8 US gal matches the example's 5 / 3 / 3 / 10 g.
    expect(await textOf(page, 'ion-now-calcium')).toBe('0');
    const proposed = (await page.getByLabel('Proposed salts').textContent()) ?? '';
    expect(proposed).toContain('Gypsum: 4.9 g');
    expect(proposed).toContain('Epsom salt: 3.0 g');
    expect(proposed).toContain('Table salt: 3.0 g');
    expect(proposed).toContain('Calcium chloride: 10.0 g');
    expect(await page.getByText('These salts reach every ion of the target.').count()).toBe(1);
    const phBefore = Number(await textOf(page, 'predicted-mash-ph'));
    expect(phBefore).toBeGreaterThan(5.6);

    await page.getByRole('button', { name: 'Use these salts' }).click();
    await waitForText(page, 'ion-now-calcium', (t) => t === '128', 'calcium after the salts');
    expect(await textOf(page, 'ion-now-chloride')).toBe('219');
    // Rounded to 0.1 g the sulfate lands within the plan's 5 % of its 130 mg/L.
    expect(Math.abs(Number(await textOf(page, 'ion-now-sulfate')) - 130)).toBeLessThanOrEqual(6.5);
    expect(await page.locator('#kf-document-water-salts-3-grams').inputValue()).toBe('10');
    // Calcium lowers the mash: the live number follows the salts.
    await waitForText(page, 'predicted-mash-ph', (t) => Number(t) < phBefore - 0.15, 'mash pH after the salts');
    const phAfter = Number(await textOf(page, 'predicted-mash-ph'));
    expect(phAfter).toBeGreaterThan(5.2);
    expect(phAfter).toBeLessThan(5.5);

    // Every gram stays the brewer's: less calcium chloride, less calcium and chloride.
    await page.locator('#kf-document-water-salts-3-grams').fill('8');
    await waitForText(page, 'ion-now-calcium', (t) => t === '110', 'calcium after editing a salt');
    await waitForText(page, 'predicted-mash-ph', (t) => Number(t) > phAfter, 'mash pH with less calcium');
    const phSaved = Number(await textOf(page, 'predicted-mash-ph'));

    // A target salts cannot reach from this water is said plainly, ion by ion.
    await page.getByLabel('Water you start from').selectOption('soft-spring');
    const miss = page.getByText('This target cannot be reached exactly.');
    await miss.waitFor();
    expect(await page.getByText(/Bicarbonate stays 18\.0 mg\/L above target/).count()).toBe(1);
    await page.getByLabel('Water you start from').selectOption('distilled');

    // A named starting point, with its source.
    await page.getByLabel('Water to aim for').selectOption('crisp-bitter');
    await page.getByText(/Source: Ranges for pale beers in Palmer & Kaminski/).waitFor();
    expect(await page.getByLabel('Proposed salts').textContent()).toContain('Gypsum');
    await page.getByLabel('Water to aim for').selectOption('own');
    await page.locator('#kf-document-water-target-calcium').waitFor();

    // The FG wanted → the main rest.
    await page.locator('#kf-target-fg').fill('1.012');
    await page
      .locator('#kf-target-fg-answer')
      .getByText(/Rest at about 6\d\.\d °C/)
      .waitFor();
    await page.locator('#kf-target-fg').fill('1.040');
    await page
      .locator('#kf-target-fg-answer')
      .getByText(/No rest in 62\.0 °C–72\.0 °C reaches it/)
      .waitFor();

    // Spunding at 100 kPa and the ferment's temperature: CO2 volumes, with the pressure cautions.
    await page.locator('#kf-document-fermentation-steps-0-tempC').fill('32');
    await flags.waitFor({ state: 'detached' });
    await page.locator('#kf-spunding-on').check();
    await page.locator('#kf-document-fermentation-spunding-tempC').fill('32');
    await waitForText(page, 'spunding-volumes', (t) => /leaves about 1\.\d\d volumes CO₂/.test(t), 'spunding');
    expect(await page.getByText(/never go past the vessel maker’s rated pressure/).count()).toBeGreaterThan(0);
    await s.shot('design-editor-desktop');
    await page.setViewportSize({ width: 390, height: 844 });
    await page.locator('#salt-plan-title').scrollIntoViewIfNeeded();
    await s.shot('design-editor-phone');
    await page.setViewportSize({ width: 1280, height: 900 });

    await page.locator('#kf-message').fill('Salts for the target, kveik warm, spunded');
    await page.getByRole('button', { name: 'Save new version' }).click();
    await page.waitForURL(`**/recipes/${created.recipe.slug}/v/2`);
    const main = page.locator('main');
    await main.getByText('Spunded: valve at 100 kPa').waitFor();
    expect(await main.textContent()).toContain('Mash pH');
    expect(await textOf(page, 'predicted-mash-ph')).toBe(phSaved.toFixed(2));
    await s.shot('design-recipe-page');
    expect(s.problems).toEqual([]);
  });
});

describe('fitting a fork to my brewhouse', { timeout: 240_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('shows what the fit changes before forking, and forks with the fit as the second version', async () => {
    const owner = await signedInClient();
    const source = await createRecipeVia(owner.client, {
      document: paleAle({ title: `Fit Me Pale ${Date.now().toString(36)}` }),
    });
    const { client } = await signedInClient();
    const settings = await client.put('/api/me/settings', {
      name: 'Fitting Brewer',
      bio: '',
      units: 'metric',
      defaultBatchVolumeL: 30,
      defaultEfficiencyPct: 65,
      emailChoices: {
        fork: true,
        comment: true,
        reply: true,
        star: true,
        brewed: true,
        new_recipe: true,
        proposal: true,
        proposal_decision: true,
      },
    });
    expect(settings.status).toBe(200);

    // Losses and a water report through the settings page, as a member saves them.
    s = await browserAs(client, 390);
    const { page } = s;
    await page.goto('/settings', { waitUntil: 'networkidle' });
    await page.locator('#brewhouse-boilOffLPerHour').fill('3');
    await page.locator('#brewhouse-mashWaterLPerKg').fill('0.4');
    await page.locator('#brewhouse-has-report').check();
    await page.locator('#brewhouse-report-name').fill('Hillside spring');
    await page.locator('#brewhouse-waterReport-calcium').fill('6');
    await page.getByRole('button', { name: 'Save losses and water' }).click();
    await page.getByText('Mash thickness must be at least 1 L per kg').waitFor();
    await page.locator('#brewhouse-mashWaterLPerKg').fill('2.8');
    await page.getByRole('button', { name: 'Save losses and water' }).click();
    await page.getByText('Brewhouse saved.').waitFor();
    await s.shot('brewhouse-settings-phone');
    const saved = await client.get<{ brewhouse: { boilOffLPerHour: number; waterReport: { name: string } } }>(
      '/api/me/brewhouse',
    );
    expect(saved.body.brewhouse).toMatchObject({ boilOffLPerHour: 3, waterReport: { name: 'Hillside spring' } });
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.goto(`/recipes/${source.recipe.slug}`, { waitUntil: 'networkidle' });
    await page.locator('#fork-fit').check();
    const changes = page.getByTestId('fit-changes');
    await changes.waitFor();
    const table = (await changes.textContent()) ?? '';
    expect(table).toMatch(/Batch volume\s*20 L\s*30 L/);
    expect(table).toMatch(/Brewhouse efficiency\s*72 %\s*65 %/);
    expect(table).toMatch(/Boil-off\s*4 L per hour\s*3 L per hour/);
    expect(table).toContain('Efficiency from your settings');
    await s.shot('fit-fork-preview');

    await page.getByRole('button', { name: 'Fork and fit this version' }).click();
    await page.waitForURL('**/edit');
    await editorReady(page);
    expect(await page.getByText('You are editing from').textContent()).toContain('version 2');
    expect(await page.locator('#kf-document-batch-volumeL').inputValue()).toBe('30');
    expect(await page.locator('#kf-document-batch-efficiencyPct').inputValue()).toBe('65');

    // The saved water report is offered as a source water.
    expect(await page.getByLabel('Water you start from').textContent()).toContain('My water report: Hillside spring');

    // Fitted once, the editor's own fit finds nothing left to change.
    await page.getByRole('button', { name: 'Fit to my brewhouse' }).click();
    await page.getByText('This recipe already fits your brewhouse: nothing changes.').waitFor();
    await s.shot('fit-editor-nothing-left');
    expect(s.problems).toEqual([]);
  });
});
