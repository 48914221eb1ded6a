'use client';

import Link from 'next/link';
import { NotificationBell } from './notification-bell';

/** The signed-in member's community links in the header: feed, moderation (for moderators), settings and the bell. */
export function MemberLinks({ role }: { role: 'member' | 'moderator' | 'admin' }) {
  return (
    <>
      <Link href="/feed">From brewers you follow</Link>
      {role !== 'member' && <Link href="/admin/moderation">Moderation</Link>}
      <Link href="/settings">Settings</Link>
      <NotificationBell />
    </>
  );
}
