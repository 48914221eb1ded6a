'use client';

import { format } from 'date-fns';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useRecipeHistory, type HistoryItem } from '@/hooks/use-recipe-history';

export function HistoryTimeline({
  recipeId,
  slug,
  initial,
}: {
  recipeId: string;
  slug: string;
  initial: HistoryItem[];
}) {
  const router = useRouter();
  const { data: versions = [], isError, refetch } = useRecipeHistory(recipeId, initial);
  const [picked, setPicked] = useState<string[]>([]);

  const toggle = (id: string) =>
    setPicked((current) => (current.includes(id) ? current.filter((p) => p !== id) : [...current.slice(-1), id]));

  const compare = () => {
    const [first, second] = [...picked].sort(
      (x, y) => versions.findIndex((v) => v.id === y) - versions.findIndex((v) => v.id === x),
    );
    router.push(`/compare?a=${first}&b=${second}`);
  };

  if (isError) {
    return (
      <p role="alert" className="kf-card mt-6 font-sans text-sm">
        The history could not be loaded.{' '}
        <button type="button" className="underline" onClick={() => void refetch()}>
          Try again
        </button>
      </p>
    );
  }

  return (
    <form
      className="mt-6"
      onSubmit={(e) => {
        e.preventDefault();
        compare();
      }}
    >
      <div className="sticky top-0 z-10 flex flex-wrap items-center gap-3 border-b border-line bg-paper/95 py-3 font-sans text-sm">
        <span aria-live="polite">
          {picked.length === 2
            ? 'Two versions picked.'
            : `Pick ${2 - picked.length} more version${picked.length === 1 ? '' : 's'}.`}
        </span>
        <button type="submit" className="kf-btn" disabled={picked.length !== 2}>
          Compare side by side
        </button>
      </div>
      <ol className="mt-4 space-y-3">
        {versions.map((v, i) => {
          const checkboxId = `pick-${v.id}`;
          return (
            <li key={v.id} className={`kf-card flex gap-4 ${picked.includes(v.id) ? 'border-copper' : ''}`}>
              <input
                id={checkboxId}
                type="checkbox"
                className="mt-1.5 h-5 w-5 accent-[rgb(var(--kf-copper))]"
                checked={picked.includes(v.id)}
                onChange={() => toggle(v.id)}
              />
              <div className="min-w-0 flex-1">
                <label htmlFor={checkboxId} className="font-serif text-lg font-semibold">
                  Version {v.number}
                  {i === 0 && (
                    <span className="ml-2 rounded bg-bine/15 px-1.5 py-0.5 font-sans text-xs text-bine">latest</span>
                  )}
                </label>
                <p className="font-sans text-sm text-muted">
                  {format(new Date(v.createdAt), 'd MMM yyyy, HH:mm')} by {v.authorName}
                  {v.coAuthorName && <> with {v.coAuthorName}</>}
                </p>
                {v.message && <p className="mt-1">{v.message}</p>}
                {v.moved && (
                  <p className="mt-1 font-sans text-sm text-copper-strong">
                    <span className="sr-only">What moved since version {v.number - 1}: </span>
                    {v.moved}
                  </p>
                )}
                <p className="mt-1 font-sans text-sm">
                  <Link href={`/recipes/${slug}/v/${v.number}`}>Read version {v.number}</Link>
                </p>
              </div>
            </li>
          );
        })}
      </ol>
    </form>
  );
}
