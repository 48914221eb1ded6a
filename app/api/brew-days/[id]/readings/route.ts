import { addReading } from '@/lib/brew-days/brew-days';
import { readingSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';

// POST /api/brew-days/[id]/readings – the brewer adds a fermentation reading
export const POST = route<typeof readingSchema, { id: string }, 'user'>(
  { access: 'user', body: readingSchema },
  ({ viewer, params, body }) => addReading(viewer, params.id, body),
);
