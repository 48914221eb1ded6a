import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';
import { getLineageByRecipeId } from '@/lib/recipes/lineage';

// GET /api/recipes/[id]/lineage – the family tree of forks with their versions
export const GET = route<undefined, { id: string }, 'public'>({ access: 'public' }, async ({ viewer, params }) => ({
  recipes: await getLineageByRecipeId(viewer, { recipeId: idParam(params.id, 'recipe') }),
}));
