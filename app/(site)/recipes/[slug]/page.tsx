import type { Metadata } from 'next';
import { statsLine } from '@/lib/format';
import { loadRecipePage } from '@/lib/recipes/pages';
import { VersionPage } from './_components/version-page';

type Props = { params: Promise<{ slug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  const { version, recipe } = await loadRecipePage(slug);
  const description = `${statsLine(version.stats)} — a recipe by ${recipe.ownerName} on Kettlefork`;
  return {
    title: version.document.title,
    description,
    openGraph: { title: version.document.title, description, type: 'article' },
  };
}

export default async function RecipePage({ params }: Props) {
  const { slug } = await params;
  return <VersionPage {...await loadRecipePage(slug)} />;
}
