import { formatDistanceToNow } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { listNotifications } from '@/lib/notifications/list';
import { MarkReadButton } from './_components/mark-read-button';

export const metadata: Metadata = { title: 'Notifications' };

type Props = { searchParams: Promise<{ page?: string }> };

export default async function NotificationsPage({ searchParams }: Props) {
  const viewer = await requirePageViewer('/notifications');
  const page = Math.min(Math.max(Number.parseInt((await searchParams).page ?? '1', 10) || 1, 1), 1000);
  const { items, hasMore } = await listNotifications(viewer, { page });
  const unread = items.filter((i) => !i.read).length;
  return (
    <div className="max-w-3xl">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold">Notifications</h1>
          <p className="mt-1 font-sans text-sm text-muted">
            Forks, comments, replies, stars and brews of your recipes, and new recipes from members you follow.{' '}
            <Link href="/settings">Choose what we e-mail you.</Link>
          </p>
        </div>
        {unread > 0 && <MarkReadButton />}
      </div>
      {items.length === 0 ? (
        <p className="kf-card mt-6">
          Nothing yet. When someone stars, forks, brews or comments on your recipes, you will see it here.
        </p>
      ) : (
        <ul className="mt-6 divide-y divide-line">
          {items.map((n) => (
            <li key={n.id} className={`py-3 ${n.read ? '' : 'font-semibold'}`}>
              {!n.read && <span className="sr-only">Unread: </span>}
              <Link href={n.url}>{n.text}</Link>
              {n.excerpt && <p className="mt-1 font-normal text-muted">“{n.excerpt}”</p>}
              <p className="mt-1 font-sans text-xs font-normal text-muted">
                {formatDistanceToNow(n.createdAt, { addSuffix: true })}
              </p>
            </li>
          ))}
        </ul>
      )}
      <nav aria-label="Pages" className="mt-8 flex gap-3 font-sans text-sm">
        {page > 1 && (
          <Link href={`/notifications?page=${page - 1}`} className="kf-btn-quiet">
            Newer
          </Link>
        )}
        {hasMore && (
          <Link href={`/notifications?page=${page + 1}`} className="kf-btn-quiet">
            Older
          </Link>
        )}
      </nav>
    </div>
  );
}
