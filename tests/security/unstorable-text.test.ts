import { beforeAll, describe, expect, it } from 'vitest';
import type { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle, saveVia, type Saved } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import type { FieldIssue } from '@/lib/errors';

type ApiError = { error: { code: string; fields?: FieldIssue[] } };

// PostgreSQL stores neither a NUL character in text or JSONB nor a lone UTF-16 surrogate; either
// in any field must be a 400 naming the field, never a 500, and must save nothing.
const NUL = 'Pale\u0000ale';
const LONE = 'Pale \ud800 ale';

describe('text that cannot be stored', () => {
  let client: TestClient;
  let saved: Saved;
  beforeAll(async () => {
    ({ client } = await signedInClient());
    saved = await createRecipeVia(client);
  });

  function expectRefused(res: { status: number; body: unknown }, path: string) {
    expect(res.status).toBe(400);
    expect((res.body as ApiError).error.fields).toEqual([{ path, message: expect.stringMatching(/cannot store/) }]);
  }

  it.each([
    ['a NUL byte', NUL],
    ['a lone surrogate', LONE],
  ])('refuses %s in a recipe title, notes and ingredient names when saving', async (_, bad) => {
    for (const [document, path] of [
      [paleAle({ title: bad }), 'document.title'],
      [paleAle({ notes: bad }), 'document.notes'],
    ] as const) {
      const res = await saveVia(client, saved.recipe.id, saved.version.id, document);
      expectRefused(res, path);
    }
    const doc = paleAle();
    doc.fermentables[0].name = bad;
    expectRefused(await saveVia(client, saved.recipe.id, saved.version.id, doc), 'document.fermentables.0.name');
    const versions = await client.get<{ versions: unknown[] }>(`/api/recipes/${saved.recipe.id}/versions`);
    expect(versions.body.versions).toHaveLength(1);
  });

  it('refuses them in comments, fork titles and report notes', async () => {
    expectRefused(await client.post(`/api/recipes/${saved.recipe.id}/comments`, { body: NUL }), 'body');
    expectRefused(await client.post(`/api/versions/${saved.version.id}/fork`, { title: LONE }), 'title');
    expectRefused(
      await client.post('/api/reports', { targetType: 'recipe', targetId: saved.recipe.id, reason: 'spam', note: NUL }),
      'note',
    );
  });

  it('refuses them in a key of a JSON body too', async () => {
    const res = await client.post(`/api/recipes/${saved.recipe.id}/comments`, { body: 'Fine', ['odd\u0000key']: 1 });
    expect(res.status).toBe(400);
    expect((res.body as ApiError).error.fields?.[0].path).toBe('odd\u0000key');
  });

  it('refuses them in query strings', async () => {
    const res = await client.get<ApiError>('/api/recipes?owner=%00');
    expectRefused(res, 'owner');
  });
});
