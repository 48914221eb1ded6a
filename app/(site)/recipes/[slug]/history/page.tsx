import type { Metadata } from 'next';
import Link from 'next/link';
import { getViewer } from '@/lib/auth/session';
import { orNotFound } from '@/lib/recipes/pages';
import { getHistoryByRecipeId } from '@/lib/recipes/history-lines';
import { getRecipe } from '@/lib/recipes/versions';
import { HistoryTimeline } from './_components/history-timeline';

type Props = { params: Promise<{ slug: string }> };

export const metadata: Metadata = { title: 'History' };

export default async function HistoryPage({ params }: Props) {
  const { slug } = await params;
  const viewer = await getViewer();
  const recipe = await orNotFound(() => getRecipe(viewer, { slug }));
  const versions = await getHistoryByRecipeId({ recipeId: recipe.id, units: viewer?.units ?? 'metric' });
  return (
    <div>
      <p className="font-sans text-sm">
        <Link href={`/recipes/${recipe.slug}`}>← {recipe.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">History of {recipe.title}</h1>
      <p className="mt-2 font-sans text-sm text-muted">
        Every save is kept. Pick any two versions to see them side by side.
      </p>
      <HistoryTimeline recipeId={recipe.id} slug={recipe.slug} initial={JSON.parse(JSON.stringify(versions))} />
    </div>
  );
}
