import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { computeStats, recipeDocumentSchema, type RecipeDocument, type RecipeStats } from '@/lib/brewing';
import { checkBeerJsonSchema } from '@/lib/interchange/beerjson/schema';
import { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import type { FieldIssue } from '@/lib/errors';

const example = (name: string) =>
  readFileSync(new URL(`../../lib/interchange/examples/${name}`, import.meta.url), 'utf8');

interface Preview {
  format: string;
  recipes: { document: RecipeDocument; stats: RecipeStats; dropped: string[]; guessed: string[] }[];
}
interface ErrorBody {
  error: { code: string; message: string; fields?: FieldIssue[] };
}

async function recipeCount(client: TestClient, handle: string): Promise<number> {
  const res = await client.get<{ recipes: unknown[] }>(`/api/recipes?owner=${handle}`);
  return res.body.recipes.length;
}

describe('POST /api/import', () => {
  it('asks visitors to sign in first', async () => {
    const res = await new TestClient().post('/api/import', { text: example('beerxml-spec-dry-stout.xml') });
    expect(res.status).toBe(401);
  });

  // BeerXML 1.0 specification, 2004: the example dry stout, written by hand.
  it('previews the BeerXML 1.0 specification example with recomputed numbers and the dropped and guessed lists', async () => {
    const { client, user } = await signedInClient();
    const res = await client.post<Preview>('/api/import', { text: example('beerxml-spec-dry-stout.xml') });
    expect(res.status).toBe(200);
    expect(res.body.format).toBe('beerxml');
    const [recipe] = res.body.recipes;
    expect(recipe.document.title).toBe('Dry Stout');
    expect(recipe.stats.og).toBeCloseTo(computeStats(recipe.document).og, 6);
    expect(recipe.dropped.length).toBeGreaterThan(0);
    expect(recipe.guessed.length).toBeGreaterThan(0);
    expect(await recipeCount(client, user.handle)).toBe(0);
  });

  // BeerJSON 1.0 specification: an example recipe in US units, written by hand.
  it('previews the BeerJSON 1.0 specification example, detecting the format', async () => {
    const { client } = await signedInClient();
    const res = await client.post<Preview>('/api/import', { text: example('beerjson-spec-pale-ale.json') });
    expect(res.status).toBe(200);
    expect(res.body.format).toBe('beerjson');
    expect(res.body.recipes[0].document.style).toEqual({ code: '18B', name: 'American Pale Ale' });
  });

  it('imports a long souring rest and a 21-day dry hop whole, and lists a value past the editor under Assumed', async () => {
    const { client } = await signedInClient();
    const file = JSON.parse(example('beerjson-spec-pale-ale.json'));
    const recipe = file.beerjson.recipes[0];
    recipe.mash.mash_steps.push({
      name: 'Souring rest',
      type: 'souring mash',
      step_temperature: { unit: 'C', value: 42 },
      step_time: { unit: 'hr', value: 48 },
    });
    recipe.ingredients.hop_additions[1].timing.duration = { unit: 'day', value: 21 };
    recipe.ingredients.hop_additions[0].alpha_acid.value = 48;
    const res = await client.post<Preview>('/api/import', { text: JSON.stringify(file) });
    expect(res.status).toBe(200);
    const [back] = res.body.recipes;
    expect(back.document.mash.steps[1]).toEqual({ name: 'Souring rest', tempC: 42, timeMin: 2880 });
    expect(back.document.hops[1].timeMin).toBe(21 * 1440);
    expect(back.document.hops[0].alphaPct).toBe(30);
    expect(back.guessed.join('\n')).toMatch(
      /hop_additions\[0\] \(Cascade\)\.alpha_acid: 48 is outside what the editor takes/,
    );
  });

  describe('refuses bad files with a message naming the problem, and creates nothing', () => {
    const cases: [string, string, RegExp][] = [
      ['malformed XML', '<RECIPES>\n<RECIPE><NAME>Half</RECIPE>\n</RECIPES>', /malformed.*line 2/i],
      [
        'an external entity (XXE)',
        '<?xml version="1.0"?>\n<!DOCTYPE r [<!ENTITY x SYSTEM "file:///etc/passwd">]>\n<RECIPES><RECIPE><NAME>&x;</NAME></RECIPE></RECIPES>',
        /DOCTYPE/,
      ],
      [
        'entity expansion (billion laughs)',
        `<?xml version="1.0"?><!DOCTYPE lolz [<!ENTITY lol "lol">${Array.from({ length: 9 }, (_, i) => `<!ENTITY lol${i + 1} "${`&lol${i || ''};`.repeat(10)}">`).join('')}]><RECIPES><RECIPE><NAME>&lol9;</NAME></RECIPE></RECIPES>`,
        /DOCTYPE/,
      ],
      [
        'a negative amount',
        example('beerxml-spec-dry-stout.xml').replace('<AMOUNT>0.0638</AMOUNT>', '<AMOUNT>-0.0638</AMOUNT>'),
        /HOP 1 \(Goldings, East Kent\) › AMOUNT: must not be negative/,
      ],
      [
        'BeerJSON that fails its schema',
        example('beerjson-spec-pale-ale.json').replace('"batch_size"', '"batch_volume"'),
        /batch_size: is required by the BeerJSON 1\.0 schema/,
      ],
      [
        'an unknown unit',
        example('beerjson-spec-pale-ale.json').replace('"unit": "lb", "value": 10', '"unit": "stone", "value": 10'),
        /fermentable_additions\[0\]\.amount\.unit: "stone" is not allowed/,
      ],
      [
        'a negative BeerJSON amount',
        example('beerjson-spec-pale-ale.json').replace('"unit": "oz", "value": 12', '"unit": "oz", "value": -12'),
        /Crystal 40\)\.amount: must not be negative/,
      ],
    ];
    for (const [what, text, message] of cases) {
      it(what, async () => {
        const { client, user } = await signedInClient();
        const res = await client.post<ErrorBody>('/api/import', { text });
        expect(res.status).toBe(400);
        expect(res.body.error.message).toMatch(message);
        expect(res.body.error.fields?.[0].path).toBeTruthy();
        expect(await recipeCount(client, user.handle)).toBe(0);
      });
    }

    it('a 50 MB file, with 413 before the body is read', async () => {
      const { client } = await signedInClient();
      const huge = JSON.stringify({ text: `<RECIPES>${'x'.repeat(50 * 1024 * 1024)}</RECIPES>` });
      const res = await client.post<ErrorBody>('/api/import', huge);
      expect(res.status).toBe(413);
      expect(res.body.error.message).toMatch(/too large/);
    });

    it('an empty request with field messages', async () => {
      const { client } = await signedInClient();
      const res = await client.post<ErrorBody>('/api/import', { text: '', format: 'yaml' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields?.map((f) => f.path).sort()).toEqual(['format', 'text']);
    });
  });
});

describe('GET /api/versions/[id]/export and the round trip back in', () => {
  for (const format of ['beerxml', 'beerjson'] as const) {
    it(`exports ${format} as a download and imports it to the same document and numbers`, async () => {
      const { client } = await signedInClient();
      const original = recipeDocumentSchema.parse(paleAle({ title: 'Round Trip Pale' }));
      const saved = await createRecipeVia(client, { document: original, visibility: 'private' });
      const res = await client.fetch(`/api/versions/${saved.version.id}/export?format=${format}`);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-disposition')).toBe(
        `attachment; filename="round-trip-pale-v1.${format === 'beerxml' ? 'xml' : 'beer.json'}"`,
      );
      const text = await res.text();
      const preview = await client.post<Preview>('/api/import', { text });
      expect(preview.status).toBe(200);
      const [back] = preview.body.recipes;
      expect(back.document).toEqual(original);
      const stats = computeStats(original);
      expect(back.stats.og).toBeCloseTo(stats.og, 6);
      expect(back.stats.ibu).toBeCloseTo(stats.ibu, 4);
      expect(back.stats.srm).toBeCloseTo(stats.srm, 4);

      // Saving reuses the recipe routes: a new recipe, then a new version of it.
      const created = await client.post<{ recipe: { id: string }; version: { id: string; number: number } }>(
        '/api/recipes',
        {
          document: back.document,
          visibility: 'private',
          message: 'Imported',
        },
      );
      expect(created.status).toBe(201);
      const version = await client.post<{ version: { number: number } }>(
        `/api/recipes/${created.body.recipe.id}/versions`,
        {
          document: { ...back.document, notes: 'Second import' },
          baseVersionId: created.body.version.id,
          message: 'Imported again',
        },
      );
      expect(version.status).toBe(201);
      expect(version.body.version.number).toBe(2);
    });
  }

  it('exports an extract recipe with no mash and no fermentation steps as valid BeerJSON 1.0', async () => {
    const { client } = await signedInClient();
    const document = paleAle({
      title: 'Kitchen Extract',
      fermentables: [{ name: 'Dry malt extract', amountKg: 3, potentialPpg: 44, colorLovibond: 4, kind: 'extract' }],
      mash: { steps: [] },
      fermentation: { steps: [] },
    });
    const saved = await createRecipeVia(client, { document, visibility: 'private' });
    const res = await client.fetch(`/api/versions/${saved.version.id}/export?format=beerjson`);
    expect(res.status).toBe(200);
    const file = (await res.json()) as { beerjson: { recipes: Record<string, unknown>[] } };
    expect(checkBeerJsonSchema(file)).toBeNull();
    expect(file.beerjson.recipes[0]).not.toHaveProperty('mash');
    expect(file.beerjson.recipes[0]).not.toHaveProperty('fermentation');
  });

  it('exports our own JSON document', async () => {
    const { client } = await signedInClient();
    const saved = await createRecipeVia(client, { document: paleAle({ title: 'Plain JSON' }) });
    const res = await client.fetch(`/api/versions/${saved.version.id}/export?format=kettlefork`);
    expect(res.headers.get('content-type')).toMatch(/application\/json/);
    expect(res.headers.get('content-disposition')).toMatch(/attachment; filename="plain-json-v1\.kettlefork\.json"/);
    expect(recipeDocumentSchema.parse(await res.json()).title).toBe('Plain JSON');
  });

  it('answers 404 for a private version of someone else, exactly as for a missing one', async () => {
    const { client: owner } = await signedInClient();
    const saved = await createRecipeVia(owner, { visibility: 'private' });
    const { client: other } = await signedInClient();
    expect((await other.fetch(`/api/versions/${saved.version.id}/export?format=beerxml`)).status).toBe(404);
    expect((await new TestClient().fetch(`/api/versions/${saved.version.id}/export?format=beerxml`)).status).toBe(404);
    expect((await other.fetch('/api/versions/00000000-0000-4000-8000-000000000000/export')).status).toBe(404);
  });

  it('refuses an unknown format with a field message', async () => {
    const { client } = await signedInClient();
    const saved = await createRecipeVia(client);
    const res = await client.get<ErrorBody>(`/api/versions/${saved.version.id}/export?format=pdf`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields?.[0].path).toBe('format');
  });

  it('answers a file nested 200 elements deep with a 400 naming the problem, never a 500', async () => {
    const { client } = await signedInClient();
    for (const depth of [100, 200, 2_000]) {
      const text = '<RECIPES>' + '<RECIPE>'.repeat(depth) + '</RECIPE>'.repeat(depth) + '</RECIPES>';
      const res = await client.post<ErrorBody>('/api/import', { text });
      expect(res.status, `${depth} deep`).toBe(400);
      expect(res.body.error.message).toMatch(/nested more than 32 elements deep/);
    }
  });
});
