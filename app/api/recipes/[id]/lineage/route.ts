import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { getLineageByRecipeId } from '@/lib/recipes/lineage';

// GET /api/recipes/[id]/lineage – the family tree of forks with their versions
export const GET = route({ access: 'public', params: idParams('recipe') }, async ({ viewer, params }) => ({
  recipes: await getLineageByRecipeId(viewer, { recipeId: params.id }),
}));
