import { addReading } from '@/lib/brew-days/brew-days';
import { readingSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// POST /api/brew-days/[id]/readings – the brewer adds a fermentation reading
export const POST = route(
  { access: 'user', params: idParams('brew day'), body: readingSchema },
  ({ viewer, params, body }) => addReading(viewer, params.id, body),
);
