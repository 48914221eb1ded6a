import { getBrewDayById, updateBrewDay } from '@/lib/brew-days/brew-days';
import { brewDayFieldsSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/brew-days/[id] – a brew day with its readings, tastings, photos and measured-against-predicted numbers
export const GET = route({ access: 'public', params: idParams('brew day') }, async ({ viewer, params }) => {
  const view = await getBrewDayById(viewer, params.id);
  return { ...view, version: { id: view.version.id, number: view.version.number, stats: view.version.stats } };
});

// PATCH /api/brew-days/[id] – the brewer corrects or completes the brew day
export const PATCH = route(
  { access: 'user', params: idParams('brew day'), body: brewDayFieldsSchema },
  async ({ viewer, params, body }) => {
    await updateBrewDay(viewer, params.id, body);
    return { id: params.id };
  },
);
