import { z } from 'zod';
import { deletePhoto } from '@/lib/brew-days/photos';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

const deleteQuery = z.object({ reason: z.string().max(500, 'Reason must be at most 500 characters').optional() });

// DELETE /api/photos/[id] – the brewer or a moderator deletes a photo (row and stored objects)
export const DELETE = route(
  { access: 'user', params: idParams('photo'), query: deleteQuery },
  async ({ viewer, params, query }) => {
    await deletePhoto(viewer, params.id, query.reason ?? '');
    return { ok: true };
  },
);
