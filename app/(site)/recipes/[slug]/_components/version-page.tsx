import { format } from 'date-fns';
import Link from 'next/link';
import { RecipeBrewDays } from '@/components/brew-days/recipe-brew-days';
import { RecipeCommunityBar } from '@/components/community/recipe-community-bar';
import { RecipeComments } from '@/components/community/recipe-comments';
import { Markdown } from '@/components/markdown';
import { RecipeProposals } from '@/components/proposals/recipe-proposals';
import { VersionDocument, VersionStats } from '@/components/version-body';
import { OwnerOnly, SignedInOnly, ViewerSwitch } from '@/components/viewer-gate';
import type { Viewer } from '@/lib/auth/session';
import { getBrewDaysByRecipeId } from '@/lib/brew-days/brew-days';
import { listComments } from '@/lib/community/comments';
import { isOwner } from '@/lib/recipes/access';
import { loadRecipeProposals } from '@/lib/recipes/pages';
import type { RecipeActivity, VersionView } from '@/lib/recipes/versions';
import { getForkSource } from '@/lib/recipes/versions';
import { ForkForm } from './fork-form';
import { RestoreButton } from './restore-button';
import { VisibilitySelect } from './visibility-select';

const VISIBILITY_WORDS = {
  public: 'Public',
  unlisted: 'Unlisted: only people with the link',
  private: 'Private: only you',
} as const;

/**
 * A recipe version, read-only, with what its owner and readers can do from here. A public or
 * unlisted recipe's page is rendered signed out once and shared with every reader who would see
 * the same (lib/page-cache.ts), so what depends on the reader (their star and follow, the owner's
 * actions, the fork and comment forms) is a client island that asks /api/me; the server's part
 * uses the viewer only for what the state query there sends to a render of its own.
 */
export async function VersionPage({
  viewer,
  recipe,
  version,
  activity,
  coAuthorName,
}: { viewer: Viewer | null; activity: RecipeActivity; coAuthorName: string | null } & VersionView) {
  const units = viewer?.units ?? 'metric';
  const owner = isOwner(recipe, viewer);
  const isHead = version.id === recipe.headVersionId;
  // Everything else the page shows, read at once rather than one section after another; a list the
  // version query already knows to be empty is not asked for.
  const [source, days, proposals, comments] = await Promise.all([
    recipe.forkedFromVersionId ? getForkSource(viewer, recipe.forkedFromVersionId) : null,
    activity.brewDays ? getBrewDaysByRecipeId({ recipeId: recipe.id, viewer }) : [],
    loadRecipeProposals(viewer, recipe, activity.proposals),
    activity.comments ? listComments(viewer, recipe.id) : [],
  ]);
  const base = `/recipes/${recipe.slug}`;
  return (
    <article>
      {recipe.hiddenAt && (
        <p
          role="status"
          className="mb-6 rounded-md border border-danger/40 bg-danger/5 p-3 font-sans text-sm text-danger"
        >
          Moderators hid this recipe{recipe.hiddenReason ? `: ${recipe.hiddenReason}` : '.'}{' '}
          {owner ? 'Only you and the moderators can see it.' : ''}
        </p>
      )}
      {!isHead && (
        <p role="status" className="mb-6 rounded-md border border-caution/40 bg-caution/5 p-3 font-sans text-sm">
          You are reading version {version.number}. The latest is <Link href={base}>version {recipe.headNumber}</Link>.{' '}
          <Link href={`/compare?a=${version.id}&b=${recipe.headVersionId}`}>Compare with the latest</Link>
        </p>
      )}
      <header className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <h1 className="text-3xl font-semibold md:text-4xl">{version.document.title}</h1>
          <p className="mt-2 font-sans text-sm text-muted">
            by <Link href={`/members/${recipe.ownerHandle}`}>{recipe.ownerName}</Link>
            {version.document.style && (
              <>
                {' '}
                · {version.document.style.code} {version.document.style.name}
              </>
            )}{' '}
            · version {version.number} of {recipe.headNumber} · {VISIBILITY_WORDS[recipe.visibility]}
          </p>
          {source && (
            <p className="mt-1 font-sans text-sm text-muted">
              Forked from{' '}
              {source.slug ? (
                <Link href={`/recipes/${source.slug}/v/${source.number}`}>
                  {source.title} (version {source.number}) by {source.ownerName}
                </Link>
              ) : (
                source.title
              )}
              {source.slug && (
                <>
                  {' '}
                  ·{' '}
                  <Link href={`/compare?a=${recipe.forkedFromVersionId}&b=${recipe.headVersionId}`}>
                    What changed since the fork
                  </Link>
                </>
              )}
            </p>
          )}
          <p className="mt-1 font-sans text-sm text-muted">
            Saved {format(version.createdAt, 'd MMM yyyy')} by {version.authorName}
            {coAuthorName && <> with {coAuthorName}</>}
            {version.message && <> · “{version.message}”</>}
          </p>
        </div>
        <nav aria-label="Recipe actions" className="flex flex-wrap items-center gap-2 font-sans text-sm">
          <OwnerOnly ownerHandle={recipe.ownerHandle}>
            {isHead ? (
              <Link href={`${base}/edit`} className="kf-btn">
                Edit
              </Link>
            ) : (
              <RestoreButton
                recipeId={recipe.id}
                versionId={version.id}
                number={version.number}
                headVersionId={recipe.headVersionId!}
              />
            )}
          </OwnerOnly>
          <Link href={`${base}/history`} className="kf-btn-quiet">
            History ({recipe.headNumber})
          </Link>
          <Link href={`${base}/lineage`} className="kf-btn-quiet">
            Forks ({recipe.forkCount})
          </Link>
          {!recipe.hiddenAt && (
            <SignedInOnly>
              <Link href={`${base}/v/${version.number}/brew`} className="kf-btn-quiet">
                Log a brew day
              </Link>
            </SignedInOnly>
          )}
          <Link href={`/print/recipes/${recipe.slug}/v/${version.number}`} className="kf-btn-quiet">
            Print brew sheet
          </Link>
          <span className="inline-flex flex-wrap items-center gap-2">
            Download:
            {(['beerxml', 'beerjson', 'kettlefork'] as const).map((format) => (
              <a key={format} href={`/api/versions/${version.id}/export?format=${format}`} download>
                {{ beerxml: 'BeerXML', beerjson: 'BeerJSON', kettlefork: 'JSON' }[format]}
              </a>
            ))}
          </span>
          <RecipeCommunityBar
            recipe={{
              id: recipe.id,
              slug: recipe.slug,
              title: recipe.title,
              ownerHandle: recipe.ownerHandle,
              starCount: recipe.starCount,
              hidden: Boolean(recipe.hiddenAt),
            }}
          />
        </nav>
      </header>

      <div className="mt-8 grid gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <VersionDocument
          doc={version.document}
          units={units}
          notes={<Markdown source={version.document.notes} className="mt-2 leading-relaxed" />}
        />
        <aside className="space-y-6">
          <VersionStats stats={version.stats} units={units} />
          <ViewerSwitch
            signedIn={
              !recipe.hiddenAt && (
                <ForkForm
                  versionId={version.id}
                  defaultTitle={`${version.document.title} (my take)`}
                  number={version.number}
                  units={units}
                />
              )
            }
            signedOut={
              <p className="kf-card font-sans text-sm">
                <Link href={`/sign-in?callbackUrl=${encodeURIComponent(`${base}/v/${version.number}`)}`}>Sign in</Link>{' '}
                to fork this recipe and brew it your way.
              </p>
            }
          />
          <OwnerOnly ownerHandle={recipe.ownerHandle}>
            <VisibilitySelect recipeId={recipe.id} visibility={recipe.visibility} />
          </OwnerOnly>
        </aside>
      </div>
      <RecipeBrewDays days={days} brewHref={recipe.hiddenAt ? null : `${base}/v/${version.number}/brew`} />
      <RecipeProposals version={version} proposals={proposals} />
      <RecipeComments recipe={recipe} versionNumber={version.number} comments={comments} />
    </article>
  );
}
