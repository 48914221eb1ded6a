import { route } from '@/lib/http/route';
import { listRecipes } from '@/lib/recipes/listing';
import { createRecipeSchema, listRecipesQuerySchema } from '@/lib/recipes/schemas';
import { createRecipe } from '@/lib/recipes/versions';

// GET /api/recipes – public recipes, newest first (or one member's, with ?owner=handle)
export const GET = route({ access: 'public', query: listRecipesQuerySchema }, async ({ viewer, query }) => {
  const { cards, hasMore } = await listRecipes(viewer, { ownerHandle: query.owner, page: query.page });
  return { recipes: cards, page: query.page, hasMore };
});

// POST /api/recipes – create a recipe with its first version
export const POST = route({ access: 'user', body: createRecipeSchema }, ({ viewer, body }) =>
  createRecipe(viewer, body),
);
