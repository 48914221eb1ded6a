import type { Metadata } from 'next';
import Link from 'next/link';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default function CheckEmailPage() {
  return (
    <div className="mx-auto max-w-md">
      <h1 className="text-3xl font-semibold">Check your e-mail</h1>
      <p className="mt-4">
        If that address belongs to a Kettlefork account, a sign-in link is on its way. It works once and expires after
        15 minutes.
      </p>
      <p className="mt-4 font-sans text-sm">
        <Link href="/sign-in">Back to sign in</Link>
      </p>
    </div>
  );
}
