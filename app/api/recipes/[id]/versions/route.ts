import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { saveVersionSchema } from '@/lib/recipes/schemas';
import { getRecipe, getVersionsByRecipeId, saveVersion } from '@/lib/recipes/versions';

// GET /api/recipes/[id]/versions – the recipe's history, newest first
export const GET = route({ access: 'public', params: idParams('recipe') }, async ({ viewer, params }) => {
  const recipe = await getRecipe(viewer, { id: params.id });
  return { versions: await getVersionsByRecipeId({ recipeId: recipe.id }) };
});

// POST /api/recipes/[id]/versions – save a new version (409 when the head moved since baseVersionId)
export const POST = route(
  { access: 'user', params: idParams('recipe'), body: saveVersionSchema },
  ({ viewer, params, body }) => saveVersion(viewer, params.id, body),
);
