import type { Metadata } from 'next';
import Link from 'next/link';
import { MagicLinkForm } from './_components/magic-link-form';
import { PasswordSignInForm } from './_components/password-sign-in-form';
import { safeCallbackPath } from '@/lib/auth/callback';

export const metadata: Metadata = { title: 'Sign in' };

const linkErrors: Record<string, string> = {
  Verification: 'That sign-in link has expired or was already used. Ask for a new one below.',
  AccessDenied: 'This account cannot sign in right now. If you think this is a mistake, contact the moderators.',
  EmailSignin: 'We could not send the sign-in e-mail. Please try again in a moment.',
};

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ error?: string; callbackUrl?: string }>;
}) {
  const { error, callbackUrl } = await searchParams;
  const safeCallback = safeCallbackPath(callbackUrl);
  const message =
    error && error !== 'CredentialsSignin'
      ? (linkErrors[error] ?? 'Signing in did not work. Please try again.')
      : undefined;
  return (
    <div className="mx-auto max-w-md">
      <h1 className="text-3xl font-semibold">Sign in</h1>
      <p className="mt-2 font-sans text-muted">
        New here? <Link href="/sign-up">Create an account</Link>.
      </p>
      {message && (
        <p
          role="alert"
          className="mt-4 rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger"
        >
          {message}
        </p>
      )}
      <section className="kf-card mt-6" aria-labelledby="with-password">
        <h2 id="with-password" className="text-xl font-semibold">
          With your password
        </h2>
        <PasswordSignInForm callbackUrl={safeCallback} />
      </section>
      <section className="kf-card mt-6" aria-labelledby="with-link">
        <h2 id="with-link" className="text-xl font-semibold">
          With a link by e-mail
        </h2>
        <p className="mt-1 font-sans text-sm text-muted">We send a link that signs you in once, within 15 minutes.</p>
        <MagicLinkForm callbackUrl={safeCallback} />
      </section>
    </div>
  );
}
