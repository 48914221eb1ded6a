'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { FormSubmit, InputField } from '@/components/form-field';
import { emailSchema } from '@/lib/auth/schemas';
import { safeCallbackPath } from '@/lib/auth/callback';

const schema = z.object({ email: emailSchema });
type Values = z.input<typeof schema>;

export function MagicLinkForm({ callbackUrl }: { callbackUrl: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async ({ email }) => {
    setFormError(undefined);
    const result = await signIn('email', { email, callbackUrl: safeCallbackPath(callbackUrl), redirect: false });
    if (!result || result.error) {
      setFormError('We could not send the link just now. Please try again in a moment.');
      return;
    }
    router.push('/sign-in/check-email');
  });

  return (
    <form onSubmit={onSubmit} noValidate>
      <InputField
        id="link-email"
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        registration={register('email')}
      />
      <FormSubmit
        formError={formError}
        submitting={isSubmitting}
        idle="E-mail me a sign-in link"
        busy="Sending…"
        buttonClassName="kf-btn-quiet mt-5 w-full"
      />
    </form>
  );
}
