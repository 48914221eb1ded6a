import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { saveVersionSchema } from '@/lib/recipes/schemas';
import { getHistoryByRecipeId } from '@/lib/recipes/history-lines';
import { getRecipe, saveVersion } from '@/lib/recipes/versions';

// GET /api/recipes/[id]/versions – the recipe's history, newest first, with what moved in each version
export const GET = route({ access: 'public', params: idParams('recipe') }, async ({ viewer, params }) => {
  const recipe = await getRecipe(viewer, { id: params.id });
  return { versions: await getHistoryByRecipeId({ recipeId: recipe.id, units: viewer?.units ?? 'metric' }) };
});

// POST /api/recipes/[id]/versions – save a new version (409 when the head moved since baseVersionId)
export const POST = route(
  { access: 'user', params: idParams('recipe'), body: saveVersionSchema },
  ({ viewer, params, body }) => saveVersion(viewer, params.id, body),
);
