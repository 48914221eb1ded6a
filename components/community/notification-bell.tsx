'use client';

import { useQuery } from '@tanstack/react-query';
import Link from 'next/link';
import { requestJson } from '@/lib/http/client';

export const notificationKeys = { unread: ['notifications', 'unread'] as const };

/** The bell in the header: a link to /notifications with the number of unread ones. */
export function NotificationBell() {
  const { data: unread = 0 } = useQuery({
    queryKey: notificationKeys.unread,
    queryFn: async (): Promise<number> => {
      // A count that cannot be read shows as none; the bell is a hint, not a place to report errors.
      const result = await requestJson<{ unread: number }>('/api/notifications/unread', 'GET', undefined, {
        cache: 'no-store',
      });
      return result.ok ? result.data.unread : 0;
    },
    refetchInterval: 60_000,
  });
  const label = unread ? `Notifications, ${unread} unread` : 'Notifications';
  return (
    <Link
      href="/notifications"
      aria-label={label}
      title={label}
      className="relative inline-flex items-center text-ink no-underline hover:no-underline"
    >
      <svg
        aria-hidden="true"
        viewBox="0 0 24 24"
        width="22"
        height="22"
        fill="none"
        stroke="currentColor"
        strokeWidth="1.8"
        strokeLinecap="round"
        strokeLinejoin="round"
      >
        <path d="M6 16V11a6 6 0 1 1 12 0v5l1.5 2h-15z" />
        <path d="M10 20a2 2 0 0 0 4 0" />
      </svg>
      {unread > 0 && (
        <span
          data-testid="unread-count"
          className="absolute -right-2 -top-1.5 min-w-[1.1rem] rounded-full bg-copper px-1 text-center text-[0.7rem] font-semibold leading-[1.1rem] text-white"
        >
          {unread > 99 ? '99+' : unread}
        </span>
      )}
    </Link>
  );
}
