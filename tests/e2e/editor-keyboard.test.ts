import type { Page } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import { editorReady, openBrowser, shareSessionOf, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

interface Focused {
  id: string;
  tag: string;
  text: string;
  outline: string;
  boxShadow: string;
}

/** What has focus now, with the styles that make focus visible. */
async function focused(page: Page): Promise<Focused> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return { id: '', tag: 'body', text: '', outline: 'none', boxShadow: 'none' };
    const style = getComputedStyle(el);
    const outline =
      style.outlineStyle === 'none' || parseFloat(style.outlineWidth) === 0
        ? 'none'
        : `${style.outlineStyle} ${style.outlineWidth} ${style.outlineColor}`;
    return {
      id: el.id,
      tag: el.tagName.toLowerCase(),
      text: (el.textContent ?? '').trim().slice(0, 60),
      outline,
      boxShadow: style.boxShadow,
    };
  });
}

function describeFocus(f: Focused): string {
  return `<${f.tag}${f.id ? ` id="${f.id}"` : ''}>${f.text}`;
}

/** Fails unless the focused element shows an outline or a box shadow. */
function expectVisibleFocus(f: Focused): void {
  expect(f.tag, 'focus left the page').not.toBe('body');
  expect(f.outline !== 'none' || f.boxShadow !== 'none', `focus is not visible on ${describeFocus(f)}`).toBe(true);
}

/** Presses Tab (or Shift+Tab) until `arrived` holds, checking at every step that focus is visible. */
async function tabUntil(
  page: Page,
  arrived: (f: Focused) => boolean,
  opts: { backwards?: boolean; maxSteps?: number } = {},
): Promise<Focused> {
  const key = opts.backwards ? 'Shift+Tab' : 'Tab';
  const path: string[] = [];
  for (let step = 0; step < (opts.maxSteps ?? 250); step += 1) {
    await page.keyboard.press(key);
    const now = await focused(page);
    path.push(describeFocus(now));
    expectVisibleFocus(now);
    if (arrived(now)) return now;
  }
  throw new Error(`never reached the target; focus went through:\n${path.join('\n')}`);
}

const onId = (id: string) => (f: Focused) => f.id === id;

/** Replaces the text of the focused field by typing, as a keyboard user would. */
async function retype(page: Page, text: string): Promise<void> {
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type(text);
}

describe('the recipe editor from the keyboard alone', { timeout: 180_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('adds a hop, changes an existing hop, writes a message and saves a new version without the mouse, with focus visible throughout', async () => {
    const { client } = await signedInClient();
    const title = `Keyboard Pale ${Date.now().toString(36)}`;
    const created = await createRecipeVia(client, { document: paleAle({ title }) });

    s = await openBrowser();
    await shareSessionOf(s, client);
    const { page } = s;
    await page.goto(`/recipes/${created.recipe.slug}/edit`, { waitUntil: 'networkidle' });
    await editorReady(page);
    await page.locator('#kf-document-hops-3-name').waitFor();

    // From the top of the page to the hops list's Add button.
    await tabUntil(page, (f) => f.tag === 'button' && f.text === 'Add hop');
    await s.shot('keyboard-add-hop-focused');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => document.activeElement?.id === 'kf-document-hops-4-name');
    expectVisibleFocus(await focused(page));
    await page.keyboard.type('Saaz');

    await tabUntil(page, onId('kf-document-hops-4-amountG'), { maxSteps: 1 });
    await retype(page, '28');
    await tabUntil(page, onId('kf-document-hops-4-alphaPct'), { maxSteps: 1 });
    await retype(page, '3.5');
    // Past the use (boil stays), to the time.
    await tabUntil(page, onId('kf-document-hops-4-timeMin'), { maxSteps: 2 });
    await retype(page, '5');
    await s.shot('keyboard-new-hop-typed');

    // Back up to the second hop's (Cascade, 10 min) time and make it 15.
    await tabUntil(page, onId('kf-document-hops-1-timeMin'), { backwards: true, maxSteps: 40 });
    await retype(page, '15');

    await tabUntil(page, onId('kf-message'));
    await page.keyboard.type('Saaz at five minutes, Cascade a little longer');
    const save = await tabUntil(page, (f) => f.tag === 'button' && f.text === 'Save new version', { maxSteps: 5 });
    expect(save.text).toBe('Save new version');
    await s.shot('keyboard-save-focused');
    await page.keyboard.press('Enter');

    await page.waitForURL(`**/recipes/${created.recipe.slug}/v/2`);
    const main = page.locator('main');
    await main.getByText('Saaz').first().waitFor();
    const text = (await main.textContent()) ?? '';
    expect(text).toContain('Saaz at five minutes, Cascade a little longer');
    const saazRow = (await main.locator('tr', { hasText: 'Saaz' }).first().textContent()) ?? '';
    expect(saazRow).toMatch(/28\s*g/);
    expect(saazRow).toMatch(/3\.5\s*%/);
    expect(saazRow).toMatch(/5\s*min/);
    const cascadeRows = await main.locator('tr', { hasText: 'Cascade' }).allTextContents();
    expect(cascadeRows.some((row) => /15\s*min/.test(row))).toBe(true);
    await s.shot('keyboard-saved');
    expect(s.problems).toEqual([]);
  });
});
