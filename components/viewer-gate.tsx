'use client';

import type { ReactNode } from 'react';
import { useMe } from '@/hooks/use-me';

/**
 * A client island that shows `signedIn` or `signedOut` by who /api/me says is reading, so the
 * server's HTML can be the same for everyone (recipe pages are kept and shared, lib/page-cache.ts).
 * Until the answer comes the signed-out shape holds the place, invisible, so a signed-in reader
 * never sees "Sign in" flash by; `className` can reserve the height of the larger shape.
 */
export function ViewerSwitch({
  signedIn,
  signedOut,
  className,
}: {
  signedIn: ReactNode;
  signedOut: ReactNode;
  className?: string;
}) {
  const { data: viewer, isPending } = useMe();
  const shown = isPending ? <div className="invisible">{signedOut}</div> : viewer ? signedIn : signedOut;
  return className ? <div className={className}>{shown}</div> : <>{shown}</>;
}

/** Shows its children to signed-in readers only (nothing while /api/me is on its way). */
export function SignedInOnly({ children }: { children: ReactNode }) {
  const { data: viewer } = useMe();
  return viewer ? <>{children}</> : null;
}

/** Shows its children to the member with this handle only: the owner's actions on a shared page. */
export function OwnerOnly({ ownerHandle, children }: { ownerHandle: string; children: ReactNode }) {
  const { data: viewer } = useMe();
  return viewer?.handle === ownerHandle ? <>{children}</> : null;
}
