import type { Metadata } from 'next';
import Link from 'next/link';
import { BrewSheet } from '@/components/print/brew-sheet';
import { PrintButton } from '@/components/print/print-button';
import { loadRecipePage, versionNumberFromPath } from '@/lib/recipes/pages';

type Props = { params: Promise<{ slug: string; number: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, number } = await params;
  const { version } = await loadRecipePage(slug, versionNumberFromPath(number));
  return { title: `Brew sheet: ${version.document.title}, version ${version.number}`, robots: { index: false } };
}

export default async function BrewSheetPage({ params }: Props) {
  const { slug, number } = await params;
  const { viewer, recipe, version } = await loadRecipePage(slug, versionNumberFromPath(number));
  return (
    <>
      <nav aria-label="Brew sheet" className="kf-no-print mb-6 flex flex-wrap items-center gap-3 font-sans text-sm">
        <PrintButton />
        <Link href={`/recipes/${recipe.slug}/v/${version.number}`}>Back to the recipe</Link>
      </nav>
      <BrewSheet
        doc={version.document}
        stats={version.stats}
        units={viewer?.units ?? 'metric'}
        owner={recipe.ownerName}
        number={version.number}
      />
    </>
  );
}
