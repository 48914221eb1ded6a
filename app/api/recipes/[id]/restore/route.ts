import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { restoreVersionSchema } from '@/lib/recipes/schemas';
import { restoreVersion } from '@/lib/recipes/versions';

// POST /api/recipes/[id]/restore – a new version holding an older version's document
export const POST = route(
  { access: 'user', params: idParams('recipe'), body: restoreVersionSchema },
  ({ viewer, params, body }) => restoreVersion(viewer, params.id, body),
);
