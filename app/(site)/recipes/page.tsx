import type { Metadata } from 'next';
import Link from 'next/link';
import { RecipeCard } from '@/components/recipe-card';
import { getViewer } from '@/lib/auth/session';
import { listRecipes } from '@/lib/recipes/listing';

export const metadata: Metadata = { title: 'Newest recipes' };

type Props = { searchParams: Promise<{ page?: string }> };

export default async function RecipesPage({ searchParams }: Props) {
  const { page: pageText } = await searchParams;
  const page = Math.min(Math.max(Number.parseInt(pageText ?? '1', 10) || 1, 1), 1000);
  const viewer = await getViewer();
  const { cards, hasMore } = await listRecipes(viewer, { page });
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold">Newest recipes</h1>
          <p className="mt-1 font-sans text-sm text-muted">Public recipes, most recently saved first.</p>
        </div>
        {viewer && (
          <Link href="/recipes/new" className="kf-btn">
            New recipe
          </Link>
        )}
      </div>
      {cards.length === 0 ? (
        <p className="kf-card mt-6">
          No recipes here yet.{' '}
          {viewer ? (
            <Link href="/recipes/new">Write the first one.</Link>
          ) : (
            <Link href="/sign-up">Join and write the first one.</Link>
          )}
        </p>
      ) : (
        <ul className="mt-6 grid gap-4 md:grid-cols-2">
          {cards.map((card) => (
            <RecipeCard key={card.id} card={card} />
          ))}
        </ul>
      )}
      <nav aria-label="Pages" className="mt-8 flex gap-3 font-sans text-sm">
        {page > 1 && (
          <Link href={`/recipes?page=${page - 1}`} className="kf-btn-quiet">
            Newer
          </Link>
        )}
        {hasMore && (
          <Link href={`/recipes?page=${page + 1}`} className="kf-btn-quiet">
            Older
          </Link>
        )}
      </nav>
    </div>
  );
}
