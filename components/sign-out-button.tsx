'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { forgetBrewDaysOnThisDevice } from '@/lib/brew-days/forget-device';
import { countUnsent } from '@/lib/brew-days/outbox';

/**
 * Signs out, first removing brew-day mode's copies, outbox and timers from this browser so the next
 * person on a shared phone finds nothing of this member's. Readings not yet sent are lost with them,
 * so the member is asked first.
 */
export function SignOutButton() {
  const [busy, setBusy] = useState(false);
  const [unsent, setUnsent] = useState<number | null>(null);

  const signOutHere = async (asked: boolean) => {
    setBusy(true);
    if (!asked) {
      const waiting = await countUnsent().catch(() => null);
      if (waiting) {
        setUnsent(waiting);
        setBusy(false);
        return;
      }
    }
    await forgetBrewDaysOnThisDevice().catch(() => undefined);
    await signOut({ callbackUrl: '/' });
  };

  if (unsent !== null && !busy)
    return (
      <div role="alertdialog" aria-labelledby="sign-out-unsent" className="flex flex-wrap items-center gap-2">
        <p id="sign-out-unsent" className="text-caution">
          {unsent === 1 ? '1 brew-day entry has' : `${unsent} brew-day entries have`} not been sent from this device.
          Signing out deletes {unsent === 1 ? 'it' : 'them'}.
        </p>
        <button type="button" className="kf-btn-quiet" onClick={() => setUnsent(null)}>
          Stay signed in
        </button>
        <button type="button" className="kf-btn" onClick={() => void signOutHere(true)}>
          Sign out anyway
        </button>
      </div>
    );
  return (
    <button type="button" className="kf-btn-quiet" disabled={busy} onClick={() => void signOutHere(false)}>
      {busy ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
