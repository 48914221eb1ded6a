import Link from 'next/link';
import type { MemberCommunity as MemberCommunityInfo } from '@/lib/community/profile';
import { MemberCommunityBar } from './member-community-bar';

/**
 * A member page's community part: stars received, followers, their forks, and follow and report
 * (a client island, so this part's HTML does not depend on who reads it).
 */
export function MemberCommunity({
  member,
  community: info,
}: {
  member: { id: string; name: string | null; handle: string };
  community: MemberCommunityInfo;
}) {
  return (
    <>
      <div className="mt-4 flex flex-wrap items-center gap-4 font-sans text-sm">
        <p className="text-muted">
          <span className="kf-data text-ink">{info.starsReceived}</span> {info.starsReceived === 1 ? 'star' : 'stars'}{' '}
          received · <span className="kf-data text-ink">{info.followers}</span>{' '}
          {info.followers === 1 ? 'follower' : 'followers'} · following{' '}
          <span className="kf-data text-ink">{info.following}</span>
        </p>
        <MemberCommunityBar member={{ id: member.id, name: member.name, handle: member.handle }} />
      </div>
      {info.forks.length > 0 && (
        <section aria-labelledby="forks-heading">
          <h2 id="forks-heading" className="mt-8 text-xl font-semibold">
            Forks
          </h2>
          <ul className="mt-2 space-y-1">
            {info.forks.map((f) => (
              <li key={f.id}>
                <Link href={`/recipes/${f.slug}`}>{f.title}</Link>
                {f.hidden && <span className="ml-2 font-sans text-xs text-danger">hidden by moderators</span>}
                <span className="font-sans text-sm text-muted">
                  {' '}
                  — forked from{' '}
                  {f.sourceSlug ? <Link href={`/recipes/${f.sourceSlug}`}>{f.sourceTitle}</Link> : f.sourceTitle}
                </span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}
