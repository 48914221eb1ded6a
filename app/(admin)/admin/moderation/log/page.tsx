import { format } from 'date-fns';
import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { LOGGED_ACTIONS, listModerationActions } from '@/lib/moderation/log';
import { actionLogQuerySchema } from '@/lib/moderation/schemas';

export const metadata: Metadata = { title: 'Moderation log' };

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

const TARGET_TYPES = ['recipe', 'comment', 'photo', 'user', 'version', 'member'];

export default async function ModerationLogPage({ searchParams }: Props) {
  await requirePageViewer('/admin/moderation/log', 'admin');
  const raw = Object.fromEntries(
    Object.entries(await searchParams)
      .map(([k, v]) => [k, Array.isArray(v) ? v[0] : v])
      .filter(([, v]) => v !== ''),
  );
  const parsed = actionLogQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : { page: 1 };
  const { actions, hasMore } = await listModerationActions(query);
  const pageLink = (page: number) =>
    `/admin/moderation/log?${new URLSearchParams({ ...(query.action ? { action: query.action } : {}), ...(query.actor ? { actor: query.actor } : {}), ...(query.targetType ? { targetType: query.targetType } : {}), page: String(page) })}`;
  return (
    <div>
      <h1 className="text-3xl font-semibold">Moderation log</h1>
      <p className="mt-1 font-sans text-sm text-muted">
        Every action by a moderator or admin, newest first. Entries can be added, never changed or removed.
      </p>
      {!parsed.success && (
        <p role="alert" className="kf-field-error">
          Some filters were not valid and were left out.
        </p>
      )}
      <form method="get" className="kf-card mt-6 flex flex-wrap items-end gap-4 font-sans text-sm">
        <div>
          <label htmlFor="log-action" className="kf-label">
            Action
          </label>
          <select id="log-action" name="action" className="kf-input" defaultValue={query.action ?? ''}>
            <option value="">Any</option>
            {LOGGED_ACTIONS.map((a) => (
              <option key={a} value={a}>
                {a.replaceAll('_', ' ')}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="log-actor" className="kf-label">
            By (handle)
          </label>
          <input id="log-actor" name="actor" className="kf-input" defaultValue={query.actor ?? ''} />
        </div>
        <div>
          <label htmlFor="log-target" className="kf-label">
            On
          </label>
          <select id="log-target" name="targetType" className="kf-input" defaultValue={query.targetType ?? ''}>
            <option value="">Anything</option>
            {TARGET_TYPES.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className="kf-btn">
          Filter
        </button>
      </form>
      {actions.length === 0 ? (
        <p className="kf-card mt-6">No entries match.</p>
      ) : (
        <div className="mt-6 overflow-x-auto">
          <table className="w-full border-collapse font-sans text-sm">
            <caption className="sr-only">Moderation actions</caption>
            <thead>
              <tr className="border-b border-line text-left">
                <th scope="col" className="py-2 pr-4">
                  When
                </th>
                <th scope="col" className="py-2 pr-4">
                  Who
                </th>
                <th scope="col" className="py-2 pr-4">
                  Action
                </th>
                <th scope="col" className="py-2 pr-4">
                  On
                </th>
                <th scope="col" className="py-2">
                  Reason
                </th>
              </tr>
            </thead>
            <tbody>
              {actions.map((a) => (
                <tr key={a.id} className="border-b border-line/60 align-top">
                  <td className="kf-data py-2 pr-4 whitespace-nowrap">{format(a.createdAt, 'd MMM yyyy HH:mm')}</td>
                  <td className="py-2 pr-4">
                    {a.actorName} <span className="text-muted">@{a.actorHandle}</span>
                  </td>
                  <td className="py-2 pr-4">{a.action.replaceAll('_', ' ')}</td>
                  <td className="py-2 pr-4">
                    {a.targetType} <span className="kf-data text-xs text-muted">{a.targetId}</span>
                  </td>
                  <td className="py-2">{a.reason || <span className="text-muted">—</span>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <nav aria-label="Pages" className="mt-6 flex gap-3 font-sans text-sm">
        {query.page > 1 && (
          <Link href={pageLink(query.page - 1)} className="kf-btn-quiet">
            Newer
          </Link>
        )}
        {hasMore && (
          <Link href={pageLink(query.page + 1)} className="kf-btn-quiet">
            Older
          </Link>
        )}
      </nav>
    </div>
  );
}
