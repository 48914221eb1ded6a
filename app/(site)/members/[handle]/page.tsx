import { format } from 'date-fns';
import type { Metadata } from 'next';
import { MemberBrewDays } from '@/components/brew-days/member-brew-days';
import { MemberCommunity } from '@/components/community/member-community';
import { Markdown } from '@/components/markdown';
import { RecipeCard } from '@/components/recipe-card';
import { loadMember, loadMemberPage } from '@/lib/community/member-page';

type Props = { params: Promise<{ handle: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const member = await loadMember((await params).handle);
  return { title: member.name ?? member.handle };
}

export default async function MemberPage({ params }: Props) {
  const { member, viewer, cards, community, brewDays } = await loadMemberPage((await params).handle);
  return (
    <div>
      <h1 className="text-3xl font-semibold">{member.name ?? member.handle}</h1>
      <p className="font-sans text-sm text-muted">
        @{member.handle} · brewing with Kettlefork since {format(member.createdAt, 'MMMM yyyy')}
      </p>
      {member.bio && <Markdown source={member.bio} className="mt-3 max-w-2xl" />}
      <MemberCommunity member={member} community={community} />
      <h2 className="mt-8 text-xl font-semibold">Recipes</h2>
      {cards.length === 0 ? (
        <p className="mt-2 text-muted">No public recipes yet.</p>
      ) : (
        <ul className="mt-4 grid gap-4 md:grid-cols-2">
          {cards.map((card) => (
            <RecipeCard key={card.id} card={card} />
          ))}
        </ul>
      )}
      <MemberBrewDays own={viewer?.id === member.id} days={brewDays} />
    </div>
  );
}
