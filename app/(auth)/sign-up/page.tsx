import type { Metadata } from 'next';
import Link from 'next/link';
import { SignUpForm } from './_components/sign-up-form';

export const metadata: Metadata = { title: 'Join Kettlefork' };

export default function SignUpPage() {
  return (
    <div className="mx-auto max-w-md">
      <h1 className="text-3xl font-semibold">Join Kettlefork</h1>
      <p className="mt-2 font-sans text-muted">
        Already brewing with us? <Link href="/sign-in">Sign in</Link>.
      </p>
      <div className="kf-card mt-6">
        <SignUpForm />
      </div>
    </div>
  );
}
