import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { RecipeEditor } from '@/components/recipe-editor/recipe-editor';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { isOwner } from '@/lib/recipes/access';
import { loadRecipePage } from '@/lib/recipes/pages';

export const metadata: Metadata = { title: 'Edit recipe' };

type Props = { params: Promise<{ slug: string }> };

export default async function EditRecipePage({ params }: Props) {
  const { slug } = await params;
  await requirePageViewer(`/recipes/${slug}/edit`);
  const { viewer, recipe, version } = await loadRecipePage(slug);
  if (!isOwner(recipe, viewer)) notFound();
  return (
    <div>
      <p className="font-sans text-sm">
        <Link href={`/recipes/${recipe.slug}`}>← {recipe.title}</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">Edit {recipe.title}</h1>
      <p className="mt-1 font-sans text-sm text-muted">
        You are editing version {version.number}. Saving makes version {version.number + 1}; version {version.number}{' '}
        stays as it is.
      </p>
      <div className="mt-6">
        <RecipeEditor
          mode="edit"
          recipeId={recipe.id}
          slug={recipe.slug}
          baseVersionId={version.id}
          baseVersionNumber={version.number}
          initialDocument={version.document}
          units={viewer!.units}
        />
      </div>
    </div>
  );
}
