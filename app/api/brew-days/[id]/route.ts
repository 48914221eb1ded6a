import { getBrewDayById, updateBrewDay } from '@/lib/brew-days/brew-days';
import { brewDayFieldsSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';

type Params = { id: string };

// GET /api/brew-days/[id] – a brew day with its readings, tastings, photos and measured-against-predicted numbers
export const GET = route<undefined, Params, 'public'>({ access: 'public' }, async ({ viewer, params }) => {
  const view = await getBrewDayById(viewer, params.id);
  return { ...view, version: { id: view.version.id, number: view.version.number, stats: view.version.stats } };
});

// PATCH /api/brew-days/[id] – the brewer corrects or completes the brew day
export const PATCH = route<typeof brewDayFieldsSchema, Params, 'user'>(
  { access: 'user', body: brewDayFieldsSchema },
  async ({ viewer, params, body }) => {
    await updateBrewDay(viewer, params.id, body);
    return { id: params.id };
  },
);
