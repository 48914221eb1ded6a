import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import type { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

const AXE_SOURCE = readFileSync(path.resolve('node_modules/axe-core/axe.min.js'), 'utf8');

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  helpUrl: string;
  nodes: { target: string; summary: string }[];
}

/**
 * Runs axe-core in the page (injected once per document) and returns its violations, flattened for
 * printing. It is evaluated through the browser's debugging protocol, which the page's script policy
 * does not govern: a kept page allows only its own inline scripts by hash, so a script tag would be refused.
 */
async function axeViolations(page: Page): Promise<AxeViolation[]> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(AXE_SOURCE);
  return page.evaluate(async () => {
    type Result = {
      violations: {
        id: string;
        impact: string | null;
        help: string;
        helpUrl: string;
        nodes: { target: unknown[]; failureSummary?: string }[];
      }[];
    };
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<Result> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      helpUrl: v.helpUrl,
      nodes: v.nodes.map((n) => ({
        target: n.target.map(String).join(' '),
        summary: (n.failureSummary ?? '').replace(/\s+/g, ' '),
      })),
    }));
  });
}

function describeViolations(violations: AxeViolation[]): string {
  return violations
    .map((v) =>
      [
        `${v.id} (${v.impact}): ${v.help} — ${v.helpUrl}`,
        ...v.nodes.slice(0, 8).map((n) => `    at ${n.target}: ${n.summary}`),
      ].join('\n'),
    )
    .join('\n');
}

/** Elements that reach past the right edge of the window, so the page would scroll sideways. */
async function sidewaysOverflow(
  page: Page,
): Promise<{ scrollWidth: number; innerWidth: number; culprits: string[] } | null> {
  return page.evaluate(() => {
    const { scrollWidth } = document.documentElement;
    if (scrollWidth <= window.innerWidth + 1) return null;
    const culprits = [...document.querySelectorAll<HTMLElement>('body *')]
      .filter((el) => el.getBoundingClientRect().right > window.innerWidth + 1)
      .slice(0, 10)
      .map(
        (el) =>
          `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}.${String(el.className).split(/\s+/).slice(0, 4).join('.')} right=${Math.round(el.getBoundingClientRect().right)}`,
      );
    return { scrollWidth, innerWidth: window.innerWidth, culprits };
  });
}

/** Copies a signed-in API client's session into the browser, so pages open as that member. */
async function signInBrowser(s: BrowserSession, client: TestClient): Promise<void> {
  await shareSessionOf(s, client);
}

/** Polls search until the recipe is in the index (it follows PostgreSQL through the outbox). */
async function waitForSearchHit(client: TestClient, q: string, recipeId: string): Promise<void> {
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    const res = await client.get<{ hits: { id: string }[] }>(`/api/search?q=${encodeURIComponent(q)}`);
    if (res.status === 200 && res.body.hits.some((h) => h.id === recipeId)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`recipe ${recipeId} did not reach the search index`);
}

function isoDay(offsetDays: number): string {
  return new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);
}

interface Fixture {
  slug: string;
  firstVersionId: string;
  secondVersionId: string;
  brewDayId: string;
  ownerHandle: string;
}

interface PageToCheck {
  name: string;
  path: (f: Fixture) => string;
  /** Opened without a session (sign-in and sign-up). */
  anonymous?: boolean;
}

const PAGES: PageToCheck[] = [
  { name: 'home', path: () => '/' },
  { name: 'search', path: () => '/search?q=pale' },
  { name: 'recipe', path: (f) => `/recipes/${f.slug}` },
  { name: 'editor', path: (f) => `/recipes/${f.slug}/edit` },
  { name: 'new-recipe', path: () => '/recipes/new' },
  { name: 'history', path: (f) => `/recipes/${f.slug}/history` },
  { name: 'compare', path: (f) => `/compare?a=${f.firstVersionId}&b=${f.secondVersionId}` },
  { name: 'lineage', path: (f) => `/recipes/${f.slug}/lineage` },
  { name: 'brew-day', path: (f) => `/brew-days/${f.brewDayId}` },
  { name: 'profile', path: (f) => `/members/${f.ownerHandle}` },
  { name: 'moderation', path: () => '/admin/moderation' },
  { name: 'guide', path: () => '/guides/numbers' },
  { name: 'settings', path: () => '/settings' },
  { name: 'sign-in', path: () => '/sign-in', anonymous: true },
  { name: 'sign-up', path: () => '/sign-up', anonymous: true },
];

let fixture: Fixture;
let owner: TestClient;

beforeAll(async () => {
  // The owner is a moderator, so one session sees the editor of their own recipe and the moderation queue.
  const ownerSession = await signedInClient('moderator');
  owner = ownerSession.client;
  const { client: brewer } = await signedInClient();
  const stamp = Date.now().toString(36);
  const created = await createRecipeVia(owner, {
    document: paleAle({ title: `Axe Check Pale Ale ${stamp}` }),
    message: 'First brew of the season',
  });
  const v2doc = paleAle({
    title: `Axe Check Pale Ale ${stamp}`,
    notes: 'A bright, bitter pale ale for **long summer evenings**.',
  });
  v2doc.hops[1].amountG = 40;
  v2doc.fermentables.push({ name: 'Wheat malt', amountKg: 0.4, potentialPpg: 37, colorLovibond: 3, kind: 'grain' });
  const v2 = await saveVia(owner, created.recipe.id, created.version.id, v2doc, 'More late Cascade and some wheat');
  expect(v2.status).toBe(201);

  const fork = await brewer.post<{ id: string }>(`/api/versions/${v2.body.version.id}/fork`, {
    title: `Axe Check Fork ${stamp}`,
  });
  expect(fork.status).toBe(201);
  expect(
    (
      await brewer.post(`/api/recipes/${created.recipe.id}/comments`, {
        body: 'Brewed this last weekend: lovely **citrus** aroma.',
      })
    ).status,
  ).toBe(201);
  expect((await brewer.put(`/api/recipes/${created.recipe.id}/star`)).status).toBeLessThan(300);
  expect((await brewer.post('/api/follows', { type: 'member', id: ownerSession.user.id })).status).toBeLessThan(300);
  expect(
    (
      await brewer.post('/api/reports', {
        targetType: 'recipe',
        targetId: created.recipe.id,
        reason: 'other',
        note: 'Checking how the queue reads.',
      })
    ).status,
  ).toBe(201);

  const day = await owner.post<{ id: string }>('/api/brew-days', {
    versionId: v2.body.version.id,
    brewedOn: isoDay(-12),
    mashTempC: 66,
    preBoilVolumeL: 26,
    og: { method: 'hydrometer', value: 1.05, sampleTempC: 20 },
    fermenterVolumeL: 20,
    fg: { method: 'hydrometer', value: 1.011, sampleTempC: 20 },
    packagedOn: isoDay(-2),
    packaging: 'bottles',
    primingSugarG: 110,
    notes: 'Mash ran a little cool; topped up with **hot water**.',
  });
  expect(day.status).toBe(201);
  expect(
    (
      await owner.post(`/api/brew-days/${day.body.id}/readings`, {
        takenOn: isoDay(-8),
        method: 'hydrometer',
        value: 1.02,
        beerTempC: 18,
        note: 'Krausen falling',
      })
    ).status,
  ).toBe(201);
  expect(
    (
      await owner.post(`/api/brew-days/${day.body.id}/tastings`, {
        tastedOn: isoDay(-1),
        aroma: 'Grapefruit and bread crust',
        overall: 'Clean and bright',
        rating: 4,
      })
    ).status,
  ).toBe(201);

  // By its own title: a common word such as "pale" matches more recipes than one page shows.
  await waitForSearchHit(owner, `Axe Check Pale Ale ${stamp}`, created.recipe.id);

  fixture = {
    slug: created.recipe.slug,
    firstVersionId: created.version.id,
    secondVersionId: v2.body.version.id,
    brewDayId: day.body.id,
    ownerHandle: ownerSession.user.handle,
  };
});

type Rgb = [number, number, number];

/** The palette's custom properties (`--kf-ink: 33 28 22;`) inside one CSS block. */
function paletteIn(block: string): Record<string, Rgb> {
  const palette: Record<string, Rgb> = {};
  for (const [, name, rgb] of block.matchAll(/--kf-([a-z-]+):\s*(\d+ \d+ \d+);/g))
    palette[name] = rgb.split(' ').map(Number) as Rgb;
  return palette;
}

// Relative luminance and contrast ratio as defined in W3C, Web Content Accessibility Guidelines (WCAG) 2.1, 2018.
function luminance(rgb: Rgb): number {
  const [r, g, b] = rgb.map((v) => {
    const c = v / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: Rgb, b: Rgb): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** A colour laid at `alpha` over a background, as `bg-bine/15` is over a card. */
function over(colour: Rgb, alpha: number, background: Rgb): Rgb {
  return colour.map((c, i) => c * alpha + background[i] * (1 - alpha)) as Rgb;
}

describe('the palette in app/globals.css', () => {
  const css = readFileSync(path.resolve('app/globals.css'), 'utf8');
  const darkStart = css.indexOf('@media (prefers-color-scheme: dark)');
  const darkButton = css
    .slice(css.lastIndexOf('@media (prefers-color-scheme: dark)'))
    .match(/\.kf-btn\s*{\s*color:\s*rgb\((\d+) (\d+) (\d+)\)/);
  const schemes: { name: string; palette: Record<string, Rgb>; buttonText: Rgb }[] = [
    // The light button's text is Tailwind's text-white.
    { name: 'light', palette: paletteIn(css.slice(0, darkStart)), buttonText: [255, 255, 255] },
    {
      name: 'dark',
      palette: paletteIn(css.slice(darkStart)),
      buttonText: darkButton ? (darkButton.slice(1, 4).map(Number) as Rgb) : [0, 0, 0],
    },
  ];

  it.each(schemes)('keeps WCAG AA contrast for text in the $name scheme', ({ palette, buttonText }) => {
    expect(Object.keys(palette)).toHaveLength(10);
    const pairs: [string, Rgb, Rgb, number][] = [];
    for (const ground of ['paper', 'card']) {
      // Normal-size text needs 4.5:1 (WCAG 2.1, 1.4.3).
      for (const ink of ['ink', 'muted', 'copper', 'copper-strong', 'bine', 'danger', 'caution'])
        pairs.push([`${ink} on ${ground}`, palette[ink], palette[ground], 4.5]);
      // Badges and notices: coloured text on a wash of its own colour.
      pairs.push([`bine on bine/15 over ${ground}`, palette.bine, over(palette.bine, 0.15, palette[ground]), 4.5]);
      pairs.push([
        `danger on danger/10 over ${ground}`,
        palette.danger,
        over(palette.danger, 0.1, palette[ground]),
        4.5,
      ]);
      pairs.push([
        `caution on caution/5 over ${ground}`,
        palette.caution,
        over(palette.caution, 0.05, palette[ground]),
        4.5,
      ]);
      // The focus ring is a non-text indicator: 3:1 (WCAG 2.1, 1.4.11).
      pairs.push([`focus ring (copper) on ${ground}`, palette.copper, palette[ground], 3]);
    }
    pairs.push(['button text on copper', buttonText, palette.copper, 4.5]);
    pairs.push(['button text on copper-strong (hover)', buttonText, palette['copper-strong'], 4.5]);
    const failing = pairs
      .filter(([, a, b, needed]) => contrast(a, b) < needed)
      .map(([name, a, b, needed]) => `${name}: ${contrast(a, b).toFixed(2)} < ${needed}`);
    expect(failing).toEqual([]);
  });
});

for (const colorScheme of ['light', 'dark'] as const) {
  for (const width of [1280, 375]) {
    describe(`every main page in the ${colorScheme} scheme at ${width} px`, { timeout: 180_000 }, () => {
      let s: BrowserSession;
      let signedIn = false;

      beforeAll(async () => {
        s = await openBrowser({ colorScheme, width, height: width > 600 ? 900 : 812 });
      });
      afterAll(async () => {
        await s?.close();
      });

      for (const target of PAGES) {
        it(`${target.name} has no serious or critical axe violations${width < 600 ? ' and no sideways scroll' : ''}`, async () => {
          if (target.anonymous && signedIn) {
            await s.context.clearCookies();
            signedIn = false;
          } else if (!target.anonymous && !signedIn) {
            await signInBrowser(s, owner);
            signedIn = true;
          }
          s.problems.length = 0;
          const url = target.path(fixture);
          const res = await s.page.goto(url, { waitUntil: 'networkidle' });
          expect(res?.status(), `${url} answered`).toBe(200);
          await s.page.evaluate(() => document.fonts.ready);
          await s.shot(`a11y-${target.name}-${colorScheme}-${width}`);

          const violations = await axeViolations(s.page);
          const serious = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
          const minor = violations.filter((v) => !serious.includes(v));
          if (minor.length > 0)
            console.log(`${url} (${colorScheme}, ${width} px), minor axe findings:\n${describeViolations(minor)}`);
          expect(
            serious.map((v) => v.id),
            `${url} (${colorScheme}, ${width} px):\n${describeViolations(serious)}`,
          ).toEqual([]);

          if (width < 600) {
            const overflow = await sidewaysOverflow(s.page);
            expect(overflow, `${url} scrolls sideways at ${width} px: ${JSON.stringify(overflow)}`).toBeNull();
          }
          expect(s.problems).toEqual([]);
        });
      }
    });
  }
}
