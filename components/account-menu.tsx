'use client';

import Link from 'next/link';
import { MemberLinks } from '@/components/community/member-links';
import { useMe } from '@/hooks/use-me';
import { SignOutButton } from './sign-out-button';

export function AccountMenu() {
  const { data: viewer, isPending } = useMe();
  if (isPending) return <div className="h-9 w-40 font-sans text-sm text-muted" aria-hidden="true" />;
  if (!viewer) {
    return (
      <div className="flex items-center gap-3 font-sans text-sm">
        <Link href="/sign-in" className="kf-btn-quiet">
          Sign in
        </Link>
        <Link href="/sign-up" className="kf-btn">
          Join
        </Link>
      </div>
    );
  }
  return (
    <div className="flex flex-wrap items-center gap-3 font-sans text-sm">
      {viewer.role === 'admin' && (
        <>
          <Link href="/admin/users">Members</Link>
          <Link href="/admin/outbox">Outbox</Link>
        </>
      )}
      <MemberLinks role={viewer.role} />
      <Link href="/brew-days">My brew days</Link>
      <Link href="/import">Import</Link>
      <span className="text-muted">
        Signed in as{' '}
        <Link href={`/members/${viewer.handle}`} className="font-semibold text-ink underline" title="Your member page">
          {viewer.name}
        </Link>
        {viewer.role !== 'member' && (
          <span className="ml-1 rounded bg-bine/15 px-1.5 py-0.5 text-xs text-bine">{viewer.role}</span>
        )}
      </span>
      <SignOutButton />
    </div>
  );
}
