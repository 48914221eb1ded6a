import { brewhouseSchema } from '@/lib/community/brewhouse-schema';
import { getBrewhouse, updateBrewhouse } from '@/lib/community/brewhouse';
import { route } from '@/lib/http/route';

// GET /api/me/brewhouse – the member's batch volume, efficiency, losses and water report
export const GET = route({ access: 'user' }, async ({ viewer }) => ({ brewhouse: await getBrewhouse(viewer) }));

// PUT /api/me/brewhouse – replace the losses and water report
export const PUT = route({ access: 'user', body: brewhouseSchema }, async ({ viewer, body }) => ({
  brewhouse: await updateBrewhouse(viewer, body),
}));

export const dynamic = 'force-dynamic';
