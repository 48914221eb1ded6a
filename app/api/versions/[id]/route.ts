import { versionResponse } from '@/lib/http/cache';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { getVersionById } from '@/lib/recipes/versions';

// GET /api/versions/[id] – one immutable version with its document and numbers
export const GET = route({ access: 'public', params: idParams('version') }, async ({ req, viewer, params }) => {
  const { recipe, version } = await getVersionById(viewer, params.id);
  const body = JSON.stringify({
    recipe: {
      id: recipe.id,
      slug: recipe.slug,
      title: recipe.title,
      ownerHandle: recipe.ownerHandle,
      ownerName: recipe.ownerName,
    },
    version,
  });
  // A version never changes; only who may see it can, so any cache keeps public and unlisted ones.
  return versionResponse(req, recipe, body, { 'content-type': 'application/json' });
});
