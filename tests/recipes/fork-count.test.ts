import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { createRecipeVia } from '../helpers/recipes';
import { signedInClient } from '../helpers/users';
import { forkVia } from '../proposals/helpers';

type RecipeJson = { recipe: { forkCount: number } };
type ListJson = { recipes: { id: string; forkCount: number }[] };

describe('fork counts count only forks the reader could find', { timeout: 60_000 }, () => {
  it('leaves private forks out for everyone but their owner, in the recipe JSON, listings and the page', async () => {
    const owner = await signedInClient();
    const forker = await signedInClient();
    const source = await createRecipeVia(owner.client);
    await forkVia(forker.client, source.version.id, { visibility: 'private', title: 'Secret take' });
    await forkVia(forker.client, source.version.id, { visibility: 'unlisted', title: 'Quiet take' });
    const count = async (client: TestClient) =>
      (await client.get<RecipeJson>(`/api/recipes/${source.recipe.id}`)).body.recipe.forkCount;
    expect(await count(new TestClient())).toBe(0);
    expect(await count(owner.client)).toBe(0);
    expect(await count(forker.client)).toBe(2);

    await forkVia(forker.client, source.version.id, { visibility: 'public', title: 'Open take' });
    expect(await count(new TestClient())).toBe(1);
    const listing = await new TestClient().get<ListJson>(`/api/recipes?owner=${owner.user.handle}`);
    expect(listing.body.recipes.find((r) => r.id === source.recipe.id)?.forkCount).toBe(1);
    const page = await (await new TestClient().fetch(`/recipes/${source.recipe.slug}`)).text();
    // React marks text boundaries with comments: Forks (<!-- -->1<!-- -->).
    expect(page).toMatch(/Forks \((<!-- -->)?1(<!-- -->)?\)/);
  });
});
