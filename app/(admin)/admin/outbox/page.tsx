import { formatDistanceToNow } from 'date-fns';
import type { Metadata } from 'next';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { listOutbox } from '@/lib/mail/outbox';

export const metadata: Metadata = { title: 'Mail outbox' };

export default async function OutboxPage() {
  await requirePageViewer('/admin/outbox', 'admin');
  const { available, messages } = await listOutbox();
  return (
    <div>
      <h1 className="text-3xl font-semibold">Mail outbox</h1>
      <p className="mt-2 font-sans text-sm text-muted">
        What the local mail server has received. In production, mail goes to the relay named by SMTP_URL and does not
        show here.
      </p>
      {!available && (
        <p role="status" className="kf-card mt-6 font-sans text-sm">
          The local mail server is not reachable, so the outbox cannot be shown.
        </p>
      )}
      {available && messages.length === 0 && <p className="kf-card mt-6 font-sans text-sm">No messages yet.</p>}
      <ul className="mt-6 space-y-4">
        {messages.map((m) => (
          <li key={m.id} className="kf-card">
            <p className="font-sans text-sm text-muted">
              To {m.to.join(', ')} · {formatDistanceToNow(new Date(m.receivedAt), { addSuffix: true })}
            </p>
            <h2 className="mt-1 text-lg font-semibold">{m.subject}</h2>
            <pre className="mt-2 overflow-x-auto whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
          </li>
        ))}
      </ul>
    </div>
  );
}
