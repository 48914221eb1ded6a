import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { updateRecipeSchema } from '@/lib/recipes/schemas';
import { getRecipe, getVersionById, setVisibility } from '@/lib/recipes/versions';

// GET /api/recipes/[id] – the recipe with its head version
export const GET = route({ access: 'public', params: idParams('recipe') }, async ({ viewer, params }) => {
  const recipe = await getRecipe(viewer, { id: params.id });
  const { version } = await getVersionById(viewer, recipe.headVersionId!);
  return { recipe: publicRecipe(recipe), head: version };
});

// PATCH /api/recipes/[id] – the owner changes visibility
export const PATCH = route(
  { access: 'user', params: idParams('recipe'), body: updateRecipeSchema },
  async ({ viewer, params, body }) => {
    await setVisibility(viewer, params.id, body.visibility);
    return Response.json({ ok: true, visibility: body.visibility });
  },
);

function publicRecipe(r: Awaited<ReturnType<typeof getRecipe>>) {
  return {
    id: r.id,
    slug: r.slug,
    title: r.title,
    ownerId: r.ownerId,
    visibility: r.visibility,
    hidden: Boolean(r.hiddenAt),
    forkedFromVersionId: r.forkedFromVersionId,
    headVersionId: r.headVersionId,
    headNumber: r.headNumber,
    forkCount: r.forkCount,
    starCount: r.starCount,
    createdAt: r.createdAt,
    updatedAt: r.updatedAt,
  };
}
