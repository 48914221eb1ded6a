'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { FormSubmit, InputField } from '@/components/form-field';
import { emailSchema } from '@/lib/auth/schemas';
import { meKeys } from '@/hooks/use-me';
import { safeCallbackPath } from '@/lib/auth/callback';

const schema = z.object({ email: emailSchema, password: z.string().min(1, 'Enter your password.') });
type Values = z.input<typeof schema>;

export function PasswordSignInForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = await signIn('credentials', { ...values, redirect: false });
    if (!result || result.error) {
      setFormError(
        'That e-mail and password do not match an account that can sign in, or there were too many attempts. Please check and try again.',
      );
      return;
    }
    await queryClient.invalidateQueries({ queryKey: meKeys.all });
    router.push(safeCallbackPath(callbackUrl));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-describedby={formError ? 'signin-error' : undefined}>
      <InputField
        id="signin-email"
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        registration={register('email')}
      />
      <InputField
        id="signin-password"
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        registration={register('password')}
      />
      <FormSubmit
        formError={formError}
        errorId="signin-error"
        submitting={isSubmitting}
        idle="Sign in"
        busy="Signing in…"
        buttonClassName="kf-btn mt-5 w-full"
      />
    </form>
  );
}
