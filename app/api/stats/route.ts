import { computeStats } from '@/lib/brewing';
import { route } from '@/lib/http/route';
import { computeStatsSchema } from '@/lib/recipes/schemas';

// POST /api/stats – the numbers for a recipe document, without saving it
export const POST = route({ access: 'public', body: computeStatsSchema }, ({ body }) =>
  Response.json({ stats: computeStats(body.document) }),
);
