import { getBrewhouseCalibrationByUserId } from '@/lib/brew-days/calibration';
import { route } from '@/lib/http/route';

// GET /api/me/brew-averages – the signed-in brewer's measured efficiency and attenuation per yeast kind, with the recency-weighted calibration
export const GET = route({ access: 'user' }, async ({ viewer }) =>
  getBrewhouseCalibrationByUserId({ userId: viewer.id }),
);
export const dynamic = 'force-dynamic';
