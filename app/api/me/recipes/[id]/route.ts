import { loadCommunityState } from '@/lib/community/recipe-standing';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/me/recipes/[id] – whether the signed-in member stars and follows this recipe
export const GET = route({ access: 'user', params: idParams('recipe') }, ({ viewer, params }) =>
  loadCommunityState(viewer, params.id),
);

export const dynamic = 'force-dynamic';
