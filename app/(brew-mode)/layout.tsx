import type { ReactNode } from 'react';

/** Brew-day mode fills the phone: no site header or footer, one column, room for a thumb. */
export default function BrewModeLayout({ children }: { children: ReactNode }) {
  return (
    <main id="main" className="px-4">
      {children}
    </main>
  );
}
