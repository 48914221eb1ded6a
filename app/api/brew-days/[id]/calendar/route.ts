import { getBrewDayPlanIcs } from '@/lib/brew-days/plans';
import { env } from '@/lib/env';
import { route } from '@/lib/http/route';

// GET /api/brew-days/[id]/calendar – the brew day's saved plan as an iCalendar (.ics) file
export const GET = route<undefined, { id: string }, 'public'>({ access: 'public' }, async ({ viewer, params }) => {
  const { ics, filename } = await getBrewDayPlanIcs(viewer, params.id, env().NEXTAUTH_URL);
  return new Response(ics, {
    headers: {
      'content-type': 'text/calendar; charset=utf-8',
      'content-disposition': `attachment; filename="${filename}"`,
    },
  });
});
