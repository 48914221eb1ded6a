import { route } from '@/lib/http/route';
import { idParam } from '@/lib/recipes/http';
import { restoreVersionSchema } from '@/lib/recipes/schemas';
import { restoreVersion } from '@/lib/recipes/versions';

// POST /api/recipes/[id]/restore – a new version holding an older version's document
export const POST = route<typeof restoreVersionSchema, { id: string }, 'user'>(
  { access: 'user', body: restoreVersionSchema },
  ({ viewer, params, body }) => restoreVersion(viewer, idParam(params.id, 'recipe'), body),
);
