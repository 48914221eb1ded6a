import { eq } from 'drizzle-orm';
import { afterEach, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { users } from '@/db/schema';
import { editorReady, openBrowser, signInThroughPage, type BrowserSession } from '../helpers/browser';
import { createRecipeVia, paleAle, saveVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';

describe('the editor when a newer version was saved meanwhile', { timeout: 120_000 }, () => {
  let s: BrowserSession | undefined;
  afterEach(async () => {
    await s?.close();
    s = undefined;
  });

  it('lists what the newer version changed with labelled fields in the member’s US units, no document keys', async () => {
    const { client, user } = await signedInClient();
    await db.update(users).set({ units: 'us' }).where(eq(users.id, user.id));
    const created = await createRecipeVia(client, { document: paleAle({ title: `Conflict Pale ${Date.now()}` }) });

    s = await openBrowser();
    await signInThroughPage(s, user.email);
    await s.page.goto(`/recipes/${created.recipe.slug}/edit`);
    await editorReady(s.page);

    // Meanwhile, from another tab: a yeast swap and more late Cascade.
    const other = paleAle({ title: 'Conflict Pale' });
    other.yeasts = [{ name: 'Kveik', kind: 'kveik', attenuationPct: 80, tempMinC: 25, tempMaxC: 37 }];
    other.hops[1].amountG = 30;
    expect((await saveVia(client, created.recipe.id, created.version.id, other, 'From the other tab')).status).toBe(
      201,
    );

    await s.page.locator('#kf-message').fill('My edit');
    await s.page.getByRole('button', { name: 'Save new version' }).click();
    const panel = s.page.locator('section[aria-labelledby="kf-conflict-title"]');
    await panel.waitFor();
    const text = await panel.innerText();
    expect(text).toContain('Yeast: Clean ale yeast → Kveik');
    expect(text).toContain('Cascade (boil, 10 min) +0.18 oz (0.88 oz → 1.06 oz)');
    expect(text).toMatch(/lowest temperature 59 °F → 77 °F/);
    expect(text.match(/\b[a-z]+[A-Z][a-zA-Z]*\b/g) ?? []).toEqual([]);
    await s.shot('editor-conflict-us');
    expect(s.problems.filter((p) => !p.includes('HTTP 409'))).toEqual([]);
  });
});
