import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';
import { saveVersionSchema } from '@/lib/recipes/schemas';
import { getRecipe, getVersionsByRecipeId, saveVersion } from '@/lib/recipes/versions';

type Params = { id: string };

// GET /api/recipes/[id]/versions – the recipe's history, newest first
export const GET = route<undefined, Params, 'public'>({ access: 'public' }, async ({ viewer, params }) => {
  const recipe = await getRecipe(viewer, { id: idParam(params.id, 'recipe') });
  return { versions: await getVersionsByRecipeId({ recipeId: recipe.id }) };
});

// POST /api/recipes/[id]/versions – save a new version (409 when the head moved since baseVersionId)
export const POST = route<typeof saveVersionSchema, Params, 'user'>(
  { access: 'user', body: saveVersionSchema },
  ({ viewer, params, body }) => saveVersion(viewer, idParam(params.id, 'recipe'), body),
);
