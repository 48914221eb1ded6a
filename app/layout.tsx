import '@fontsource/literata/400.css';
import '@fontsource/literata/600.css';
import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/600.css';
import './globals.css';
import type { Metadata, Viewport } from 'next';
import { headers } from 'next/headers';
import type { ReactNode } from 'react';
import { Providers } from '@/components/providers';

export const metadata: Metadata = {
  title: { default: 'Kettlefork — homebrew recipes with a history', template: '%s · Kettlefork' },
  description:
    'Publish homebrew recipes as versioned records, fork each other’s, log brew days and find recipes by style and ingredient.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1 };

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request, so each one carries the nonce of its own
  // Content-Security-Policy (set in proxy.ts).
  await headers();
  return (
    <html lang="en">
      <body className="min-h-screen">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
