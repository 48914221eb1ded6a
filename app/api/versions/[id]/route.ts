import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { getVersionById } from '@/lib/recipes/versions';

// GET /api/versions/[id] – one immutable version with its document and numbers
export const GET = route({ access: 'public', params: idParams('version') }, async ({ viewer, params }) => {
  const { recipe, version } = await getVersionById(viewer, params.id);
  const cacheable = recipe.visibility === 'public' && !recipe.hiddenAt;
  return NextResponse.json(
    {
      recipe: {
        id: recipe.id,
        slug: recipe.slug,
        title: recipe.title,
        ownerHandle: recipe.ownerHandle,
        ownerName: recipe.ownerName,
      },
      version,
    },
    // A version never changes; only who may see it can, so shared caches keep public ones briefly.
    {
      headers: { 'cache-control': cacheable ? 'public, max-age=60, stale-while-revalidate=600' : 'private, no-store' },
    },
  );
});
