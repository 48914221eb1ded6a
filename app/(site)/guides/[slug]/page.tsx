import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { listGuideSlugs, loadGuide } from '@/lib/guides';

type Props = { params: Promise<{ slug: string }> };

export const dynamicParams = false;

export async function generateStaticParams() {
  return (await listGuideSlugs()).map((slug) => ({ slug }));
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const guide = await loadGuide((await params).slug);
  return guide ? { title: guide.meta.title, description: guide.meta.summary } : {};
}

export default async function GuidePage({ params }: Props) {
  const guide = await loadGuide((await params).slug);
  if (!guide) notFound();
  return (
    <article className="max-w-3xl">
      <p className="font-sans text-sm">
        <Link href="/guides">All guides</Link>
      </p>
      <h1 className="mt-2 text-3xl font-semibold md:text-4xl">{guide.meta.title}</h1>
      <p className="mt-2 font-sans text-muted">{guide.meta.summary}</p>
      <div className="mt-6">{guide.content}</div>
    </article>
  );
}
