'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { onlyFields, setServerErrors } from '@/components/form-errors';
import { FormField, FormSubmit, describedBy } from '@/components/form-field';
import { meKeys } from '@/hooks/use-me';
import { requestJson } from '@/lib/http/client';
import { PASSWORD_MIN_LENGTH, signUpSchema, type SignUpInput } from '@/lib/auth/schemas';

export function SignUpForm() {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, formState } = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const result = await requestJson('/api/accounts', 'POST', values);
    if (!result.ok) {
      setServerErrors(setError, result.fields, onlyFields('name', 'email', 'password'));
      if (!result.fields.length) setFormError(result.message);
      return;
    }
    const signedIn = await signIn('credentials', { email: values.email, password: values.password, redirect: false });
    if (!signedIn?.ok) {
      // The address already had an account (its owner has been e-mailed), or signing in failed.
      setFormError(
        'We could not sign you in with these details. If this address already has an account, we have e-mailed its owner: sign in, or ask for a sign-in link by e-mail.',
      );
      return;
    }
    await queryClient.invalidateQueries({ queryKey: meKeys.all });
    router.push('/');
    router.refresh();
  });

  const field = (name: keyof SignUpInput, label: string, type: string, autoComplete: string, hint?: string) => (
    <FormField id={`signup-${name}`} label={label} error={errors[name]?.message} hint={hint}>
      <input
        id={`signup-${name}`}
        type={type}
        autoComplete={autoComplete}
        className="kf-input"
        aria-invalid={Boolean(errors[name])}
        aria-describedby={describedBy(`signup-${name}`, errors[name]?.message, hint)}
        {...register(name)}
      />
    </FormField>
  );

  return (
    <form onSubmit={onSubmit} noValidate>
      {field('name', 'Name other brewers will see', 'text', 'nickname')}
      {field('email', 'E-mail', 'email', 'email')}
      {field(
        'password',
        'Password',
        'password',
        'new-password',
        `At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words work well.`,
      )}
      <FormSubmit
        formError={formError}
        submitting={isSubmitting}
        idle="Create account"
        busy="Creating your account…"
        buttonClassName="kf-btn mt-5 w-full"
      />
    </form>
  );
}
