import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { BrewDayForm } from '@/components/brew-days/brew-day-form';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { formatGravity } from '@/lib/format';
import { loadRecipePage } from '@/lib/recipes/pages';

type Props = { params: Promise<{ slug: string; number: string }> };

export const metadata: Metadata = { title: 'Log a brew day' };

export default async function LogBrewDayPage({ params }: Props) {
  const { slug, number } = await params;
  const n = Number(number);
  if (!Number.isInteger(n) || n < 1) notFound();
  const viewer = await requirePageViewer(`/recipes/${slug}/v/${n}/brew`);
  const { recipe, version } = await loadRecipePage(slug, n);
  if (recipe.hiddenAt && recipe.ownerId !== viewer.id) notFound();
  return (
    <div className="mx-auto max-w-3xl">
      <p className="font-sans text-sm text-muted">
        <Link href={`/recipes/${recipe.slug}/v/${version.number}`}>
          {version.document.title}, version {version.number}
        </Link>
      </p>
      <h1 className="text-3xl font-semibold">Log a brew day</h1>
      <p className="mb-6 mt-1 font-sans text-sm text-muted">
        Record what you measured; the brew-day page lays it beside this version&apos;s prediction (OG{' '}
        {formatGravity(version.stats.og)}, FG {formatGravity(version.stats.fg)}). Leave blank what you did not measure;
        you can add the FG, packaging and readings later.
      </p>
      <BrewDayForm units={viewer.units} mode={{ kind: 'create', versionId: version.id }} defaults={{}} />
    </div>
  );
}
