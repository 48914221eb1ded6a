import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { forkSchema } from '@/lib/recipes/schemas';
import { forkRecipe } from '@/lib/recipes/versions';

// POST /api/versions/[id]/fork – fork this version into a new recipe of the viewer's
export const POST = route(
  { access: 'user', params: idParams('version'), body: forkSchema },
  ({ viewer, params, body }) => forkRecipe(viewer, params.id, body),
);
