'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { FormField, describedBy } from '@/components/form-field';
import { meKeys } from '@/hooks/use-me';
import { PASSWORD_MIN_LENGTH, signUpSchema, type SignUpInput } from '@/lib/auth/schemas';

interface ApiError {
  error?: { message?: string; fields?: { path: string; message: string }[] };
}

export function SignUpForm() {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string>();
  const { register, handleSubmit, setError, formState } = useForm<SignUpInput>({ resolver: zodResolver(signUpSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(undefined);
    const res = await fetch('/api/accounts', {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(values),
    });
    if (!res.ok) {
      const body = (await res.json().catch(() => ({}))) as ApiError;
      const fields = body.error?.fields ?? [];
      for (const f of fields) {
        if (f.path === 'name' || f.path === 'email' || f.path === 'password') setError(f.path, { message: f.message });
      }
      if (!fields.length) setFormError(body.error?.message ?? 'Signing up did not work. Please try again.');
      return;
    }
    const signedIn = await signIn('credentials', { email: values.email, password: values.password, redirect: false });
    await queryClient.invalidateQueries({ queryKey: meKeys.all });
    router.push(signedIn?.ok ? '/' : '/sign-in');
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
      {field('password', 'Password', 'password', 'new-password', `At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words work well.`)}
      {formError && (
        <p role="alert" className="kf-field-error">
          {formError}
        </p>
      )}
      <button type="submit" className="kf-btn mt-5 w-full" disabled={isSubmitting}>
        {isSubmitting ? 'Creating your account…' : 'Create account'}
      </button>
    </form>
  );
}
