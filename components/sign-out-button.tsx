'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';

export function SignOutButton() {
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="kf-btn-quiet"
      disabled={busy}
      onClick={() => {
        setBusy(true);
        void signOut({ callbackUrl: '/' });
      }}
    >
      {busy ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
