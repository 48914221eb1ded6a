import { setStar } from '@/lib/community/stars';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// PUT /api/recipes/[id]/star – star a recipe (again: no change)
export const PUT = route({ access: 'user', params: idParams('recipe') }, ({ viewer, params }) =>
  setStar(viewer, params.id, true),
);

// DELETE /api/recipes/[id]/star – take the star back
export const DELETE = route({ access: 'user', params: idParams('recipe') }, ({ viewer, params }) =>
  setStar(viewer, params.id, false),
);
