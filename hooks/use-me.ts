'use client';

import { useQuery } from '@tanstack/react-query';
import type { Viewer } from '@/lib/auth/session';
import { sendJson } from '@/lib/http/client';

export const meKeys = { all: ['me'] as const };

export function useMe() {
  return useQuery({
    queryKey: meKeys.all,
    queryFn: async ({ signal }): Promise<Viewer | null> =>
      (await sendJson<{ viewer: Viewer | null }>('/api/me', 'GET', undefined, { signal, cache: 'no-store' })).viewer,
  });
}
