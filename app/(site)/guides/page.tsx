import type { Metadata } from 'next';
import Link from 'next/link';
import { listGuides } from '@/lib/guides';

export const metadata: Metadata = {
  title: 'Guides',
  description:
    'How Kettlefork works out its numbers, and plain guides to water, hops, fermentation, carbonation and brewing safely.',
};

export default async function GuidesPage() {
  const guides = await listGuides();
  return (
    <div className="max-w-3xl">
      <h1 className="text-3xl font-semibold">Guides</h1>
      <p className="mt-2 font-sans text-sm text-muted">
        Short, practical reading for brew day, and the formulas behind every number Kettlefork shows.
      </p>
      <ul className="mt-8 space-y-4">
        {guides.map((g) => (
          <li key={g.slug} className="kf-card">
            <h2 className="text-xl font-semibold">
              <Link href={`/guides/${g.slug}`}>{g.title}</Link>
            </h2>
            <p className="mt-1 font-sans text-sm text-muted">{g.summary}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
