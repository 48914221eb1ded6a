'use client';

import { useQuery } from '@tanstack/react-query';
import type { RecipeDocument } from '@/lib/brewing/schema';

const versionKeys = { document: (versionId: string) => ['versions', versionId, 'document'] as const };

/** One version's document; a version never changes, so it is read once. */
export function useVersionDocument(versionId: string, enabled: boolean) {
  return useQuery({
    queryKey: versionKeys.document(versionId),
    enabled,
    staleTime: Number.POSITIVE_INFINITY,
    queryFn: async (): Promise<RecipeDocument> => {
      const res = await fetch(`/api/versions/${versionId}`);
      if (!res.ok) throw new Error('The recipe could not be loaded. Try again in a moment.');
      return ((await res.json()) as { version: { document: RecipeDocument } }).version.document;
    },
  });
}
