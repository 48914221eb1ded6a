'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useEffect, useId, useRef, useState } from 'react';
import { NotificationBell } from '@/components/community/notification-bell';
import { useMe } from '@/hooks/use-me';
import type { Role } from '@/lib/auth/roles';
import { SignOutButton } from './sign-out-button';

/**
 * The header's signed-in part: brew days and the bell stay in view, everything else about the
 * member opens under their name (a disclosure of links, closed by Escape, a click outside or
 * moving to another page), so the header stays on one line on a laptop.
 */
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
    <div className="flex items-center gap-4 font-sans text-sm">
      <Link href="/brew-days">My brew days</Link>
      <NotificationBell />
      <MemberMenu name={viewer.name} handle={viewer.handle} role={viewer.role} />
    </div>
  );
}

/** The member's own pages, then the moderators' and the admins'. */
function memberLinks(handle: string, role: Role): { href: string; label: string }[] {
  return [
    { href: `/members/${handle}`, label: 'Your member page' },
    { href: '/feed', label: 'From brewers you follow' },
    { href: '/import', label: 'Import' },
    { href: '/settings', label: 'Settings' },
    ...(role === 'member' ? [] : [{ href: '/admin/moderation', label: 'Moderation' }]),
    ...(role === 'admin'
      ? [
          { href: '/admin/users', label: 'Members' },
          { href: '/admin/outbox', label: 'Outbox' },
        ]
      : []),
  ];
}

function MemberMenu({ name, handle, role }: { name: string; handle: string; role: Role }) {
  // The menu is open on the page it was opened on; moving to another page closes it.
  const pathname = usePathname();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const setOpen = (value: boolean) => setOpenOn(value ? pathname : null);
  const panelId = useId();
  const box = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!open) return;
    const onPointer = (event: PointerEvent) => {
      if (!box.current?.contains(event.target as Node)) setOpenOn(null);
    };
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') setOpenOn(null);
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  return (
    <div ref={box} className="relative">
      <button
        type="button"
        className="kf-btn-quiet inline-flex items-center gap-1"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen(!open)}
      >
        <span className="sr-only">Account menu for </span>
        <span className="max-w-[12rem] truncate font-semibold">{name}</span>
        <svg aria-hidden="true" viewBox="0 0 12 12" width="10" height="10" className={open ? 'rotate-180' : ''}>
          <path d="M2 4l4 4 4-4" fill="none" stroke="currentColor" strokeWidth="1.6" />
        </svg>
      </button>
      <div
        id={panelId}
        hidden={!open}
        className="absolute right-0 z-20 mt-2 w-64 rounded border border-line bg-card py-2 shadow-lg"
      >
        <p className="px-4 pb-2 text-muted">
          Signed in as <span className="font-semibold text-ink">{name}</span>
          {role !== 'member' && <span className="ml-1 rounded bg-bine/15 px-1.5 py-0.5 text-xs text-bine">{role}</span>}
        </p>
        <ul className="border-t border-line pt-1">
          {memberLinks(handle, role).map((link) => (
            <li key={link.href}>
              <Link
                href={link.href}
                className="block px-4 py-2 text-ink no-underline hover:bg-paper hover:no-underline"
              >
                {link.label}
              </Link>
            </li>
          ))}
        </ul>
        <div className="mt-1 border-t border-line px-4 pt-2">
          <SignOutButton />
        </div>
      </div>
    </div>
  );
}
