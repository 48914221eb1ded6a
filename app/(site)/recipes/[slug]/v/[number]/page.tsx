import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { statsLine } from '@/lib/format';
import { loadRecipePage } from '@/lib/recipes/pages';
import { VersionPage } from '../../_components/version-page';

type Props = { params: Promise<{ slug: string; number: string }> };

function versionNumber(text: string): number {
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1) notFound();
  return n;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug, number } = await params;
  const { version } = await loadRecipePage(slug, versionNumber(number));
  const title = `${version.document.title}, version ${version.number}`;
  return { title, description: statsLine(version.stats), openGraph: { title, description: statsLine(version.stats) } };
}

export default async function RecipeVersionPage({ params }: Props) {
  const { slug, number } = await params;
  return <VersionPage {...await loadRecipePage(slug, versionNumber(number))} />;
}
