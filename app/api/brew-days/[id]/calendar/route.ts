import { getBrewDayPlanIcs } from '@/lib/brew-days/plans';
import { env } from '@/lib/env';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// GET /api/brew-days/[id]/calendar – the brew day's saved plan as an iCalendar (.ics) file
export const GET = route({ access: 'public', params: idParams('brew day') }, async ({ viewer, params }) => {
  const { ics, filename } = await getBrewDayPlanIcs(viewer, params.id, env().NEXTAUTH_URL);
  return new Response(ics, {
    headers: {
      'content-type': 'text/calendar; charset=utf-8',
      'content-disposition': `attachment; filename="${filename}"`,
    },
  });
});
