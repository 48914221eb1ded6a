import { formatDistanceToNow } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getFeed, type FeedItem } from '@/lib/community/feed';

export const metadata: Metadata = { title: 'From brewers you follow' };

type Props = { searchParams: Promise<{ before?: string }> };

function what(item: FeedItem) {
  const recipe = <Link href={item.url}>{item.recipeTitle}</Link>;
  switch (item.kind) {
    case 'recipe':
      return <>published a new recipe, {recipe}</>;
    case 'fork':
      return <>forked a recipe into {recipe}</>;
    case 'brew_day':
      return (
        <>
          brewed {recipe} (version {item.versionNumber})
        </>
      );
    case 'version':
      return (
        <>
          saved version {item.versionNumber} of {recipe}
        </>
      );
  }
}

export default async function FeedPage({ searchParams }: Props) {
  const viewer = await requirePageViewer('/feed');
  const beforeText = (await searchParams).before;
  const before = beforeText && !Number.isNaN(Date.parse(beforeText)) ? new Date(beforeText) : undefined;
  const { items, next } = await getFeed(viewer, { before });
  return (
    <div className="max-w-3xl">
      <h1 className="text-3xl font-semibold">From brewers you follow</h1>
      <p className="mt-1 font-sans text-sm text-muted">
        New versions, forks and brew days from the members and recipes you follow.
      </p>
      {items.length === 0 ? (
        <p className="kf-card mt-6">
          Nothing here yet. Follow members on their pages, or recipes on theirs, and what they brew shows up here.{' '}
          <Link href="/recipes">See the newest recipes.</Link>
        </p>
      ) : (
        <ul className="mt-6 divide-y divide-line">
          {items.map((item) => (
            <li key={`${item.kind}-${item.id}`} className="py-3">
              <Link href={`/members/${item.actorHandle}`} className="font-semibold">
                {item.actorName}
              </Link>{' '}
              {what(item)}
              {item.message && item.kind === 'version' && <p className="mt-1 text-muted">“{item.message}”</p>}
              <p className="mt-1 font-sans text-xs text-muted">{formatDistanceToNow(item.at, { addSuffix: true })}</p>
            </li>
          ))}
        </ul>
      )}
      {next && (
        <nav aria-label="Pages" className="mt-8 font-sans text-sm">
          <Link href={`/feed?before=${encodeURIComponent(next.toISOString())}`} className="kf-btn-quiet">
            Older
          </Link>
        </nav>
      )}
    </div>
  );
}
