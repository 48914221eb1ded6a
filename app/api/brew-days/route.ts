import { createBrewDay } from '@/lib/brew-days/brew-days';
import { createBrewDaySchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';

// POST /api/brew-days – log a brew of one exact recipe version
export const POST = route({ access: 'user', body: createBrewDaySchema }, ({ viewer, body }) =>
  createBrewDay(viewer, body),
);
