import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';
import { forkSchema } from '@/lib/recipes/schemas';
import { forkRecipe } from '@/lib/recipes/versions';

// POST /api/versions/[id]/fork – fork this version into a new recipe of the viewer's
export const POST = route<typeof forkSchema, { id: string }, 'user'>(
  { access: 'user', body: forkSchema },
  ({ viewer, params, body }) => forkRecipe(viewer, idParam(params.id, 'version'), body),
);
