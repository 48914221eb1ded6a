import { eq } from 'drizzle-orm';
import { describe, expect, it, vi } from 'vitest';
import { db } from '@/db';
import { recipes } from '@/db/schema';
import { recipeDocumentSchema } from '@/lib/brewing';
import { createRecipe } from '@/lib/recipes/versions';
import { paleAle } from '../helpers/recipes';
import { createUser } from '../helpers/users';

// The first two slugs drawn are the same, as two recipes of one title may draw one random tail.
const drawn = vi.hoisted(() => ({ queue: [] as string[] }));
vi.mock('@/lib/recipes/slug', async (original) => {
  const real = await original<typeof import('@/lib/recipes/slug')>();
  return { slugFor: (title: string) => drawn.queue.shift() ?? real.slugFor(title) };
});

describe('a recipe slug that is already taken', () => {
  it('is drawn again inside the same transaction, so the save still lands', async () => {
    const user = await createUser();
    const viewer = { ...user, name: user.name ?? 'Brewer', units: 'metric' as const };
    const document = recipeDocumentSchema.parse(paleAle());
    const taken = `clash-${Date.now().toString(36)}`;
    drawn.queue.push(taken, taken);
    const first = await createRecipe(viewer, { document, visibility: 'public', message: 'One' });
    const second = await createRecipe(viewer, { document, visibility: 'public', message: 'Two' });
    expect(first.recipe.slug).toBe(taken);
    expect(second.recipe.slug).not.toBe(taken);
    expect(second.recipe.slug).toMatch(/-[a-z0-9]{6}$/);
    const [row] = await db
      .select({ headNumber: recipes.headNumber })
      .from(recipes)
      .where(eq(recipes.id, second.recipe.id));
    expect(row.headNumber).toBe(1);
  });
});
