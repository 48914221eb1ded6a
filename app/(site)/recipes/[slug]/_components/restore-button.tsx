'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { toast } from 'sonner';

export function RestoreButton({ recipeId, versionId, number, headVersionId }: { recipeId: string; versionId: string; number: number; headVersionId: string }) {
  const router = useRouter();
  const restore = useMutation({
    mutationFn: async () => {
      const res = await fetch(`/api/recipes/${recipeId}/restore`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ versionId, baseVersionId: headVersionId }),
      });
      const body = (await res.json().catch(() => ({}))) as { recipe: { slug: string }; version: { number: number }; error?: { message: string } };
      if (!res.ok) throw new Error(body.error?.message ?? 'Restoring did not work.');
      return body;
    },
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
