import { eq } from 'drizzle-orm';
import { afterEach, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { users } from '@/db/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import { editorReady, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';

/**
 * A document key looks like `attenuationPct` or `tempMinC`; the units mL, kPa and pH are the
 * trade's own spelling and allowed.
 */
function documentKeys(text: string): string[] {
  return (text.match(/\b[a-z]+[A-Z][a-zA-Z]*\b/g) ?? []).filter((word) => !['mL', 'kPa', 'pH'].includes(word));
}

describe('fork a pale ale and swap the yeast, read in brewers’ words', { timeout: 180_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  for (const units of ['us', 'metric'] as UnitSystem[]) {
    it(`compare and history name the yeast swap and what it did to FG, in ${units} units`, async () => {
      const { client: author } = await signedInClient();
      const title = `Yeast Swap Pale ${units} ${Date.now()}`;
      const source = await createRecipeVia(author, { document: paleAle({ title }) });
      const brewer = await createUser({ name: 'Swap Brewer' });
      await db.update(users).set({ units }).where(eq(users.id, brewer.id));

      s = await openBrowser({ width: units === 'us' ? 390 : 1280 });
      await signInThroughPage(s, brewer.email);
      await s.page.goto(`/recipes/${source.recipe.slug}`);
      await s.page.getByLabel('Title of your fork').fill(`${title} kveik`);
      await s.page.getByRole('button', { name: 'Fork this version' }).click();
      await s.page.waitForURL('**/edit');
      await editorReady(s.page);
      await s.page.locator('#kf-document-yeasts-0-name').fill('Kveik, farmhouse');
      await s.page.locator('#kf-document-yeasts-0-kind').selectOption('kveik');
      await s.page.locator('#kf-document-yeasts-0-attenuationPct').fill('82');
      await s.page.locator('#kf-message').fill('Swapped to a kveik strain');
      await s.page.getByRole('button', { name: 'Save new version' }).click();
      await s.page.waitForURL('**/v/2');
      const forkVersion = s.page.url();

      await s.page.getByRole('link', { name: 'What changed since the fork' }).click();
      await s.page.waitForURL('**/compare?**');
      await s.page.getByRole('heading', { name: 'Why the numbers moved' }).waitFor();
      const compare = await s.page.locator('body').innerText();
      expect(compare).toContain('Yeast: Clean ale yeast → Kveik, farmhouse');
      expect(compare).toMatch(/FG 1\.\d{3} → 1\.\d{3}: −0\.\d{3} from the yeast swap/);
      // The numbers in the member's units: keg pressure in psi or kPa.
      expect(compare).toMatch(units === 'us' ? /Keg pressure\s+[\d.]+ psi/ : /Keg pressure\s+\d+ kPa/);
      expect(documentKeys(compare)).toEqual([]);
      await s.shot(`fork-swap-yeast-compare-${units}`);

      await s.page.goto(new URL(forkVersion).pathname.replace(/\/v\/2$/, '/history'));
      await s.page.getByText(/Yeast: Clean ale yeast → Kveik, farmhouse — FG −0\.\d{3}/).waitFor();
      const history = await s.page.locator('body').innerText();
      expect(documentKeys(history)).toEqual([]);
      await s.shot(`fork-swap-yeast-history-${units}`);
      expect(s.problems).toEqual([]);
    });
  }
});
