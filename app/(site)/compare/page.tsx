import type { Metadata } from 'next';
import Link from 'next/link';
import { CompareView } from '@/components/compare-view';
import { getViewer } from '@/lib/auth/session';
import { compareVersions } from '@/lib/recipes/listing';
import { orNotFound } from '@/lib/recipes/pages';
import { compareQuerySchema } from '@/lib/recipes/schemas';

export const metadata: Metadata = { title: 'Compare versions' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function ComparePage({ searchParams }: Props) {
  const params = await searchParams;
  const parsed = compareQuerySchema.safeParse({ a: params.a, b: params.b });
  if (!parsed.success) {
    return (
      <div className="mx-auto max-w-xl">
        <h1 className="text-3xl font-semibold">Compare versions</h1>
        <p className="kf-card mt-6">
          Choose two versions to compare from a recipe’s <strong>History</strong> page, or follow “What changed since
          the fork” on a forked recipe.
        </p>
        <p className="mt-4 font-sans text-sm">
          <Link href="/recipes">Browse recipes</Link>
        </p>
      </div>
    );
  }
  const viewer = await getViewer();
  const { a, b, comparison } = await orNotFound(() =>
    compareVersions(viewer, parsed.data.a, parsed.data.b, viewer?.units ?? 'metric'),
  );
  const side = (v: typeof a) => ({
    title: v.version.document.title,
    slug: v.recipe.slug,
    number: v.version.number,
    ownerName: v.recipe.ownerName,
  });
  return (
    <div>
      <h1 className="text-3xl font-semibold">
        {a.version.document.title} v{a.version.number} → {b.version.document.title} v{b.version.number}
      </h1>
      <p className="mt-2 font-sans text-sm text-muted">
        This page has its own address: share it to show exactly these two versions.
      </p>
      <div className="mt-8">
        <CompareView a={side(a)} b={side(b)} comparison={comparison} showUnchanged={params.all === '1'} />
      </div>
      {params.all !== '1' && (
        <p className="mt-6 font-sans text-sm">
          <Link href={`/compare?a=${a.version.id}&b=${b.version.id}&all=1`}>Show unchanged ingredients too</Link>
        </p>
      )}
    </div>
  );
}
