import type { Metadata } from 'next';
import Link from 'next/link';
import { getViewer } from '@/lib/auth/session';
import { getLineageByRecipeId, type LineageRecipe } from '@/lib/recipes/lineage';
import { orNotFound } from '@/lib/recipes/pages';
import { getRecipe } from '@/lib/recipes/versions';
import { LineagePicture } from './_components/lineage-picture';

export const metadata: Metadata = { title: 'Forks' };

type Props = { params: Promise<{ slug: string }> };

function LineageList({
  recipes,
  parentVersionIds,
}: {
  recipes: LineageRecipe[];
  parentVersionIds: Set<string> | null;
}) {
  const level = recipes.filter((r) =>
    parentVersionIds
      ? r.forkedFromVersionId && parentVersionIds.has(r.forkedFromVersionId)
      : r.depth === Math.min(...recipes.map((x) => x.depth)),
  );
  if (!level.length) return null;
  return (
    <ul className="ml-5 list-disc space-y-1">
      {level.map((r) => (
        <li key={r.id}>
          {r.slug ? <Link href={`/recipes/${r.slug}`}>{r.title}</Link> : 'Hidden recipe'}{' '}
          {r.ownerName && <span className="text-muted">by {r.ownerName}</span>} · {r.versions.length} version
          {r.versions.length === 1 ? '' : 's'}
          <LineageList recipes={recipes} parentVersionIds={new Set(r.versions.map((v) => v.id))} />
        </li>
      ))}
    </ul>
  );
}

export default async function LineagePage({ params }: Props) {
  const { slug } = await params;
  const viewer = await getViewer();
  const recipe = await orNotFound(() => getRecipe(viewer, { slug }));
  const family = await getLineageByRecipeId(viewer, { recipeId: recipe.id });
  return (
    <div>
      <p className="font-sans text-sm">
        <Link href={`/recipes/${recipe.slug}`}>← {recipe.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">Forks of {recipe.title}</h1>
      <p className="mt-2 font-sans text-sm text-muted">
        Each lane is a recipe and each dot a version; a green curve joins a fork to the exact version it came from.
        Select a dot to read that version.
      </p>
      <div className="kf-card mt-6 overflow-x-auto">
        <LineagePicture recipes={family} currentId={recipe.id} />
      </div>
      <details className="mt-6 font-sans text-sm">
        <summary className="cursor-pointer">The same forks as a list</summary>
        <div className="mt-3">
          <LineageList recipes={family} parentVersionIds={null} />
        </div>
      </details>
    </div>
  );
}
