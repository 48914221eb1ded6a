import { setStar } from '@/lib/community/stars';
import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';

type Params = { id: string };

// PUT /api/recipes/[id]/star – star a recipe (again: no change)
export const PUT = route<undefined, Params, 'user'>({ access: 'user' }, ({ viewer, params }) =>
  setStar(viewer, idParam(params.id, 'recipe'), true),
);

// DELETE /api/recipes/[id]/star – take the star back
export const DELETE = route<undefined, Params, 'user'>({ access: 'user' }, ({ viewer, params }) =>
  setStar(viewer, idParam(params.id, 'recipe'), false),
);
