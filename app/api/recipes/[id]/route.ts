import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';
import { updateRecipeSchema } from '@/lib/recipes/schemas';
import { getRecipe, getVersionById, setVisibility } from '@/lib/recipes/versions';

type Params = { id: string };

// GET /api/recipes/[id] – the recipe with its head version
export const GET = route<undefined, Params, 'public'>({ access: 'public' }, async ({ viewer, params }) => {
  const recipe = await getRecipe(viewer, { id: idParam(params.id, 'recipe') });
  const { version } = await getVersionById(viewer, recipe.headVersionId!);
  return { recipe: publicRecipe(recipe), head: version };
});

// PATCH /api/recipes/[id] – the owner changes visibility
export const PATCH = route<typeof updateRecipeSchema, Params, 'user'>(
  { access: 'user', body: updateRecipeSchema },
  async ({ viewer, params, body }) => {
    await setVisibility(viewer, idParam(params.id, 'recipe'), body.visibility);
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
