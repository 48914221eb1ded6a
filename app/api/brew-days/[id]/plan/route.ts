import { saveBrewDayPlan } from '@/lib/brew-days/plans';
import { planOptionsSchema } from '@/lib/brew-days/schedule';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

// PUT /api/brew-days/[id]/plan – the brewer plans the brew day back from the day it must pour and keeps the plan
export const PUT = route(
  { access: 'user', params: idParams('brew day'), body: planOptionsSchema },
  ({ viewer, params, body }) => saveBrewDayPlan(viewer, params.id, body),
);
