'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { toast } from 'sonner';
import { sendJson } from '@/lib/http/client';

export function RestoreButton({
  recipeId,
  versionId,
  number,
  headVersionId,
}: {
  recipeId: string;
  versionId: string;
  number: number;
  headVersionId: string;
}) {
  const router = useRouter();
  const restore = useMutation({
    mutationFn: () =>
      sendJson<{ recipe: { slug: string }; version: { number: number } }>(`/api/recipes/${recipeId}/restore`, 'POST', {
        versionId,
        baseVersionId: headVersionId,
      }),
    onSuccess: (saved) => {
      toast.success(`Version ${number} restored as version ${saved.version.number}.`);
      router.push(`/recipes/${saved.recipe.slug}`);
      router.refresh();
    },
    onError: (err) => toast.error(err.message),
  });
  return (
    <button type="button" className="kf-btn" disabled={restore.isPending} onClick={() => restore.mutate()}>
      {restore.isPending ? 'Restoring…' : `Restore version ${number} as a new version`}
    </button>
  );
}
