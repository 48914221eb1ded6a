import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BrewDayForm } from '@/components/brew-days/brew-day-form';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getBrewDayById } from '@/lib/brew-days/brew-days';
import { orNotFound } from '@/lib/recipes/pages';

type Props = { params: Promise<{ id: string }> };

export const metadata: Metadata = { title: 'Edit brew day' };

export default async function EditBrewDayPage({ params }: Props) {
  const { id } = await params;
  const viewer = await requirePageViewer(`/brew-days/${id}/edit`);
  const view = await orNotFound(() => getBrewDayById(viewer, id));
  if (!view.canEdit) notFound();
  const { day } = view;
  const entries = day.gravityEntries;
  return (
    <div className="mx-auto max-w-3xl">
      <p className="font-sans text-sm text-muted">
        <Link href={`/brew-days/${day.id}`}>Back to the brew day</Link>
      </p>
      <h1 className="mb-6 text-3xl font-semibold">
        Edit brew day of {view.recipe.title}, version {view.version.number}
      </h1>
      <BrewDayForm
        units={viewer.units}
        mode={{ kind: 'edit', brewDayId: day.id }}
        defaults={{
          brewedOn: day.brewedOn,
          strikeTempC: day.strikeTempC,
          mashTempC: day.mashTempC,
          mashPh: day.mashPh,
          preBoilVolumeL: day.preBoilVolumeL,
          postBoilVolumeL: day.postBoilVolumeL,
          fermenterVolumeL: day.fermenterVolumeL,
          pitchTempC: day.pitchTempC,
          preBoilGravity: entries.preBoil ?? { method: 'hydrometer' },
          og: entries.og ?? { method: 'hydrometer' },
          fg: entries.fg ?? { method: 'hydrometer' },
          packagedOn: day.packagedOn ?? '',
          packaging: day.packaging ?? '',
          kegPressureKPa: day.kegPressureKPa,
          primingSugarG: day.primingSugarG,
          notes: day.notes,
        }}
      />
    </div>
  );
}
