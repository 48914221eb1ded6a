'use client';

import { useQuery } from '@tanstack/react-query';
import type { Viewer } from '@/lib/auth/session';

export const meKeys = { all: ['me'] as const };

export function useMe() {
  return useQuery({
    queryKey: meKeys.all,
    queryFn: async (): Promise<Viewer | null> => {
      const res = await fetch('/api/me', { cache: 'no-store' });
      if (!res.ok) throw new Error('Could not load your session.');
      return ((await res.json()) as { viewer: Viewer | null }).viewer;
    },
  });
}
