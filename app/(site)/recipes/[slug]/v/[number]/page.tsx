import type { Metadata } from 'next';
import { statsLine } from '@/lib/format';
import { loadRecipePage, versionNumberFromPath } from '@/lib/recipes/pages';
import { VersionPage } from '../../_components/version-page';

type Props = { params: Promise<{ slug: string; number: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, number } = await params;
  const { version } = await loadRecipePage(slug, versionNumberFromPath(number));
  const title = `${version.document.title}, version ${version.number}`;
  return { title, description: statsLine(version.stats), openGraph: { title, description: statsLine(version.stats) } };
}

export default async function RecipeVersionPage({ params }: Props) {
  const { slug, number } = await params;
  return <VersionPage {...await loadRecipePage(slug, versionNumberFromPath(number))} />;
}
