import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { LiveBrewDay } from '@/components/brew-days/live-brew-day';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getLiveBrewDayById } from '@/lib/brew-days/live';
import { liveSteps } from '@/lib/brew-days/live-steps';
import { AppError } from '@/lib/errors';
import { orNotFound } from '@/lib/recipes/pages';

type Props = { params: Promise<{ id: string }> };

export const metadata: Metadata = { title: 'Brew-day mode' };

export default async function BrewDayModePage({ params }: Props) {
  const { id } = await params;
  const viewer = await requirePageViewer(`/brew-days/${id}/live`);
  const live = await orNotFound(() =>
    getLiveBrewDayById(viewer, id).catch((err: unknown) => {
      // Someone who may see the brew day but did not brew it reads it on its own page.
      if (err instanceof AppError && err.code === 'forbidden') redirect(`/brew-days/${id}`);
      throw err;
    }),
  );
  return (
    <LiveBrewDay
      brewDayId={live.day.id}
      title={live.document.title}
      versionNumber={live.versionNumber}
      steps={liveSteps(live.document, live.stats, viewer.units)}
      initialState={live.state}
      units={viewer.units}
    />
  );
}
