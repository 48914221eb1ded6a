import type { Metadata } from 'next';
import { BrewDayList } from '@/components/brew-days/brew-day-list';
import { BrewerAveragesPanel } from '@/components/brew-days/brewer-averages';
import { CalibrationChart } from '@/components/brew-days/calibration-chart';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getBrewDaysByBrewerId } from '@/lib/brew-days/brew-days';
import { getBrewhouseCalibrationByUserId } from '@/lib/brew-days/calibration';

export const metadata: Metadata = { title: 'My brew days' };

export default async function MyBrewDaysPage() {
  const viewer = await requirePageViewer('/brew-days');
  const [days, calibration] = await Promise.all([
    getBrewDaysByBrewerId({ brewerId: viewer.id, viewer }),
    getBrewhouseCalibrationByUserId({ userId: viewer.id }),
  ]);
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-semibold">My brew days</h1>
      <BrewerAveragesPanel averages={calibration} />
      <CalibrationChart brews={calibration.history} />
      {days.length === 0 ? (
        <p className="font-sans text-sm text-muted">
          No brew days yet. Open a recipe version and choose “Log a brew day”.
        </p>
      ) : (
        <BrewDayList days={days} show="brewer" />
      )}
    </div>
  );
}
