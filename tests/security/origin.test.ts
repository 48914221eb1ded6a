import { describe, expect, it } from 'vitest';
import { unsubscribeToken } from '@/lib/notifications/unsubscribe-token';
import { TestClient } from '../helpers/http';
import { createRecipeVia } from '../helpers/recipes';
import { createUser, signedInClient } from '../helpers/users';

describe('state changes must prove they come from our own pages', { timeout: 60_000 }, () => {
  it('refuses a signed-in write with no Origin, or with another site’s', async () => {
    const { client } = await signedInClient();
    const recipe = await createRecipeVia(client);
    const star = `/api/recipes/${recipe.recipe.id}/star`;
    const noOrigin = await client.json('PUT', star, undefined, { origin: '' });
    expect(noOrigin.status).toBe(403);
    expect((await client.json('PUT', star, undefined, { origin: 'https://elsewhere.example' })).status).toBe(403);
    expect((await client.json('PUT', star, undefined, { origin: '', 'sec-fetch-site': 'cross-site' })).status).toBe(
      403,
    );
    expect((await client.get<{ viewer: unknown }>('/api/me')).body.viewer).not.toBeNull();
  });

  it('lets a same-origin write through, by Origin or by Sec-Fetch-Site', async () => {
    const { client } = await signedInClient();
    const recipe = await createRecipeVia(client);
    const star = `/api/recipes/${recipe.recipe.id}/star`;
    expect((await client.put(star)).status).toBe(200);
    expect((await client.json('DELETE', star, undefined, { origin: '', 'sec-fetch-site': 'same-origin' })).status).toBe(
      200,
    );
  });

  it('keeps the one-click unsubscribe working for mail clients (no cookie, no Origin)', async () => {
    const member = await createUser();
    const mailClient = new TestClient();
    const res = await mailClient.json(
      'POST',
      `/api/unsubscribe?token=${encodeURIComponent(unsubscribeToken(member.id, 'star'))}`,
      undefined,
      { origin: '' },
    );
    expect(res.status).toBe(200);
  });
});
