import { addTasting } from '@/lib/brew-days/brew-days';
import { tastingSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// POST /api/brew-days/[id]/tastings – any member who can see the brew day adds their tasting notes
export const POST = route(
  { access: 'user', params: idParams('brew day'), body: tastingSchema },
  ({ viewer, params, body }) => addTasting(viewer, params.id, body),
);
