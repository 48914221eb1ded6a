import { getBrewerAverages } from '@/lib/brew-days/brew-days';
import { route } from '@/lib/http/route';

// GET /api/me/brew-averages – the signed-in brewer's measured efficiency and attenuation per yeast kind
export const GET = route({ access: 'user' }, async ({ viewer }) => getBrewerAverages({ brewer: viewer }));
export const dynamic = 'force-dynamic';
