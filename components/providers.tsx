'use client';

import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { Toaster } from 'sonner';
import { makeQueryClient } from '@/lib/query-client';

export function Providers({ children }: { children: ReactNode }) {
  const [client] = useState(makeQueryClient);
  // Marks the document once React has taken over the server's HTML: browser tests wait for it
  // before typing, so nothing typed into the plain HTML is lost when React attaches.
  useEffect(() => {
    document.documentElement.dataset.hydrated = '';
  }, []);
  return (
    <QueryClientProvider client={client}>
      {children}
      <Toaster position="bottom-right" richColors closeButton />
    </QueryClientProvider>
  );
}
