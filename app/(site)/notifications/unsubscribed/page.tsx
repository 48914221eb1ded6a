import type { Metadata } from 'next';
import Link from 'next/link';
import { KIND_LABELS } from '@/lib/notifications/kinds';
import { readUnsubscribeToken } from '@/lib/notifications/unsubscribe-token';
import { ResubscribeButton } from '../_components/resubscribe-button';

export const metadata: Metadata = { title: 'Unsubscribed', robots: { index: false } };

type Props = { searchParams: Promise<{ token?: string }> };

// Reached from the unsubscribe link in an e-mail; works without signing in.
export default async function UnsubscribedPage({ searchParams }: Props) {
  const token = (await searchParams).token ?? '';
  const scope = readUnsubscribeToken(token.slice(0, 300));
  if (!scope) {
    return (
      <div className="max-w-2xl">
        <h1 className="text-3xl font-semibold">This link does not work</h1>
        <p className="mt-3">
          The unsubscribe link is incomplete or was changed. You can choose what we e-mail you on the{' '}
          <Link href="/settings">settings page</Link>.
        </p>
      </div>
    );
  }
  const what = scope.scope === 'all' ? 'any notifications' : `“${KIND_LABELS[scope.scope].toLowerCase()}”`;
  return (
    <div className="max-w-2xl">
      <h1 className="text-3xl font-semibold">You are unsubscribed</h1>
      <p className="mt-3">
        We will not e-mail you about {what} any more. You still see them under the bell when you sign in.
      </p>
      <ResubscribeButton token={token} />
      <p className="mt-6 font-sans text-sm text-muted">
        Every kind of notification e-mail can be turned on or off on the <Link href="/settings">settings page</Link>.
      </p>
    </div>
  );
}
