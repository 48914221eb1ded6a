'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { toast } from 'sonner';
import { notificationKeys } from '@/components/community/notification-bell';
import { sendJson } from '@/lib/http/client';

export function MarkReadButton() {
  const router = useRouter();
  const queryClient = useQueryClient();
  const mark = useMutation({
    mutationFn: () => sendJson('/api/notifications/read', 'POST', {}),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: notificationKeys.unread });
      router.refresh();
    },
    onError: (err) => toast.error(err.message),
  });
  return (
    <button
      type="button"
      className="kf-btn-quiet font-sans text-sm"
      disabled={mark.isPending}
      onClick={() => mark.mutate()}
    >
      Mark all as read
    </button>
  );
}
