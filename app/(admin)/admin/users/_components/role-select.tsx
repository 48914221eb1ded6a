'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { toast } from 'sonner';
import { ROLES, type Role } from '@/lib/auth/roles';
import { sendJson } from '@/lib/http/client';

export function RoleSelect({
  userId,
  name,
  role,
  disabled,
}: {
  userId: string;
  name: string;
  role: Role;
  disabled: boolean;
}) {
  const router = useRouter();
  const [value, setValue] = useState<Role>(role);
  const mutation = useMutation({
    mutationFn: (next: Role) => sendJson(`/api/admin/users/${userId}/role`, 'PUT', { role: next }),
    onSuccess: (_data, next) => {
      toast.success(`${name} is now ${next}.`);
      router.refresh();
    },
    onError: (err) => {
      setValue(role);
      toast.error(err.message);
    },
  });
  return (
    <label className="flex items-center gap-2">
      <span className="sr-only">Role of {name}</span>
      <select
        className="kf-input w-36 py-1"
        value={value}
        disabled={disabled || mutation.isPending}
        onChange={(e) => {
          const next = e.target.value as Role;
          setValue(next);
          mutation.mutate(next);
        }}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </select>
    </label>
  );
}
