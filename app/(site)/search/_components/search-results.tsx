'use client';

import Link from 'next/link';
import type { MouseEvent } from 'react';
import { SrmSwatch } from '@/components/srm-swatch';
import type { LooseningSuggestion, RecipeSearchHit, RecipeSearchResponse } from '@/lib/search/client';
import type { RecipeSearchQuery } from '@/lib/search/schemas';
import { searchHref } from './search-url';

const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en')} ${n === 1 ? one : many}`;

function StatsLine({ hit }: { hit: RecipeSearchHit }) {
  return (
    <p className="kf-data text-sm text-muted">
      OG {hit.og.toFixed(3)} · FG {hit.fg.toFixed(3)} · ABV {hit.abv.toFixed(1)}% · IBU {hit.ibu.toFixed(0)}
    </p>
  );
}

function ResultCard({ hit }: { hit: RecipeSearchHit }) {
  const style = hit.styleName ? `${hit.styleName}${hit.styleCode ? ` (${hit.styleCode})` : ''}` : 'No style given';
  return (
    <li className={`kf-card flex gap-4 p-4 ${hit.hidden ? 'border-danger/60' : ''}`}>
      <SrmSwatch srm={hit.srm} size="lg" className="mt-1" />
      <div className="min-w-0 flex-1">
        <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
          <h3 className="min-w-0 break-words text-lg font-semibold leading-snug">
            <Link href={`/recipes/${hit.slug}`}>{hit.title}</Link>
          </h3>
          {hit.hidden && (
            <span className="rounded border border-danger px-1.5 py-0.5 font-sans text-xs font-semibold text-danger">
              Hidden by moderators
            </span>
          )}
          {hit.visibility !== 'public' && (
            <span className="rounded border border-line px-1.5 py-0.5 font-sans text-xs text-muted">
              {hit.visibility === 'private' ? 'Private: only you see it' : 'Unlisted: only people with the link'}
            </span>
          )}
        </div>
        <p className="mt-0.5 font-sans text-sm">
          {style} · by <Link href={`/members/${hit.authorHandle}`}>{hit.authorName}</Link>
        </p>
        <div className="mt-1 flex flex-wrap items-center justify-between gap-x-4 gap-y-1">
          <StatsLine hit={hit} />
          <p className="kf-data text-sm text-muted">
            {plural(hit.stars, 'star')} · {plural(hit.forks, 'fork')}
          </p>
        </div>
      </div>
    </li>
  );
}

/** Page numbers around the current one, with the first and last; null marks a gap. */
function pageWindow(page: number, pageCount: number): Array<number | null> {
  const pages = new Set([1, pageCount, page - 1, page, page + 1].filter((p) => p >= 1 && p <= pageCount));
  const sorted = [...pages].sort((a, b) => a - b);
  const out: Array<number | null> = [];
  sorted.forEach((p, i) => {
    if (i > 0 && p - sorted[i - 1] > 1) out.push(null);
    out.push(p);
  });
  return out;
}

function Pager({
  query,
  pageCount,
  onNavigate,
}: {
  query: RecipeSearchQuery;
  pageCount: number;
  onNavigate(next: RecipeSearchQuery): void;
}) {
  if (pageCount <= 1) return null;
  const go = (page: number) => (event: MouseEvent<HTMLAnchorElement>) => {
    if (event.metaKey || event.ctrlKey || event.shiftKey || event.button !== 0) return;
    event.preventDefault();
    onNavigate({ ...query, page });
  };
  const linkClass = 'kf-btn-quiet min-w-10 px-3 py-1.5';
  return (
    <nav aria-label="Result pages" className="mt-6 flex flex-wrap items-center gap-2 font-sans text-sm">
      {query.page > 1 ? (
        <a
          href={searchHref({ ...query, page: query.page - 1 })}
          onClick={go(query.page - 1)}
          className={linkClass}
          rel="prev"
        >
          Previous
        </a>
      ) : (
        <span className={`${linkClass} opacity-50`} aria-disabled="true">
          Previous
        </span>
      )}
      <ol className="flex flex-wrap items-center gap-1">
        {pageWindow(query.page, pageCount).map((p, i) =>
          p === null ? (
            <li key={`gap-${i}`} aria-hidden="true" className="px-1 text-muted">
              …
            </li>
          ) : (
            <li key={p}>
              {p === query.page ? (
                <span
                  aria-current="page"
                  className="inline-flex min-w-10 justify-center rounded-md bg-copper px-3 py-1.5 font-semibold text-white"
                >
                  <span className="sr-only">Page </span>
                  {p}
                </span>
              ) : (
                <a href={searchHref({ ...query, page: p })} onClick={go(p)} className={linkClass}>
                  <span className="sr-only">Page </span>
                  {p}
                </a>
              )}
            </li>
          ),
        )}
      </ol>
      {query.page < pageCount ? (
        <a
          href={searchHref({ ...query, page: query.page + 1 })}
          onClick={go(query.page + 1)}
          className={linkClass}
          rel="next"
        >
          Next
        </a>
      ) : (
        <span className={`${linkClass} opacity-50`} aria-disabled="true">
          Next
        </span>
      )}
    </nav>
  );
}

const RANGE_WORDS = { abv: 'ABV', ibu: 'IBU', srm: 'colour', og: 'OG' } as const;

function suggestionText(
  suggestion: LooseningSuggestion,
  query: RecipeSearchQuery,
  styleNames: Record<string, string>,
): string {
  const count = plural(suggestion.total, 'recipe');
  switch (suggestion.field) {
    case 'q':
      return `Search without the words “${query.q}”: ${count}`;
    case 'style':
      return `Remove the ${styleNames[suggestion.value ?? ''] ?? suggestion.value} style: ${count}`;
    case 'hop':
    case 'malt':
    case 'yeast':
      return `Remove the ${suggestion.value} filter: ${count}`;
    default:
      return `Remove the ${RANGE_WORDS[suggestion.field]} range: ${count}`;
  }
}

function loosened(query: RecipeSearchQuery, suggestion: LooseningSuggestion): RecipeSearchQuery {
  const next = { ...query, page: 1 };
  switch (suggestion.field) {
    case 'q':
      return { ...next, q: '' };
    case 'style':
    case 'hop':
    case 'malt':
    case 'yeast':
      return { ...next, [suggestion.field]: query[suggestion.field].filter((v) => v !== suggestion.value) };
    default:
      return { ...next, [`${suggestion.field}Min`]: undefined, [`${suggestion.field}Max`]: undefined };
  }
}

function NoResults({
  data,
  query,
  styleNames,
  filtered,
  onNavigate,
  onClearFilters,
}: {
  data: RecipeSearchResponse;
  query: RecipeSearchQuery;
  styleNames: Record<string, string>;
  filtered: boolean;
  onNavigate(next: RecipeSearchQuery): void;
  onClearFilters(): void;
}) {
  if (!filtered && query.q === '') {
    return (
      <div className="kf-card text-center">
        <h3 className="text-lg font-semibold">No recipes to search yet</h3>
        <p className="mt-2 text-muted">Once brewers publish recipes, they show up here.</p>
      </div>
    );
  }
  return (
    <div className="kf-card">
      <h3 className="text-lg font-semibold">No recipes match this search</h3>
      {data.suggestions.length > 0 ? (
        <>
          <p className="mt-2 text-muted">Loosen it a little:</p>
          <ul className="mt-3 space-y-2">
            {data.suggestions.map((suggestion) => (
              <li key={`${suggestion.field}:${suggestion.value ?? ''}`}>
                <button
                  type="button"
                  className="kf-btn-quiet text-left"
                  onClick={() => onNavigate(loosened(query, suggestion))}
                >
                  {suggestionText(suggestion, query, styleNames)}
                </button>
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="mt-2 text-muted">
          Nothing close either. Try other words{filtered ? ', or clear the filters' : ''}.
        </p>
      )}
      {filtered && (
        <button
          type="button"
          className="mt-4 font-sans text-sm text-copper-strong underline underline-offset-2"
          onClick={onClearFilters}
        >
          Clear all filters
        </button>
      )}
    </div>
  );
}

export function ResultsSkeleton() {
  return (
    <ul className="space-y-3" aria-hidden="true">
      {[0, 1, 2, 3, 4].map((i) => (
        <li key={i} className="kf-card flex animate-pulse gap-4 p-4">
          <span className="h-10 w-10 rounded-sm bg-line" />
          <span className="flex-1 space-y-2">
            <span className="block h-5 w-2/3 rounded bg-line" />
            <span className="block h-4 w-1/3 rounded bg-line" />
            <span className="block h-4 w-1/2 rounded bg-line" />
          </span>
        </li>
      ))}
    </ul>
  );
}

export function SearchUnavailable({ onRetry, retrying }: { onRetry(): void; retrying: boolean }) {
  return (
    <div className="kf-card" role="status">
      <h3 className="text-lg font-semibold">Search is unavailable right now</h3>
      <p className="mt-2 text-muted">
        Recipes and saving still work; only finding them by search is out for the moment.
      </p>
      <div className="mt-4 flex flex-wrap gap-3">
        <Link href="/recipes" className="kf-btn">
          Browse the newest recipes
        </Link>
        <button type="button" className="kf-btn-quiet" onClick={onRetry} disabled={retrying}>
          {retrying ? 'Trying…' : 'Try search again'}
        </button>
      </div>
    </div>
  );
}

export function SearchFailed({ message, onRetry }: { message: string; onRetry(): void }) {
  return (
    <div className="kf-card" role="alert">
      <h3 className="text-lg font-semibold">This search did not work</h3>
      <p className="mt-2 text-muted">{message}</p>
      <button type="button" className="kf-btn-quiet mt-4" onClick={onRetry}>
        Try again
      </button>
    </div>
  );
}

interface SearchResultsProps {
  data: RecipeSearchResponse;
  query: RecipeSearchQuery;
  styleNames: Record<string, string>;
  filtered: boolean;
  onNavigate(next: RecipeSearchQuery): void;
  onClearFilters(): void;
}

export function SearchResults({ data, query, styleNames, filtered, onNavigate, onClearFilters }: SearchResultsProps) {
  if (data.total === 0) {
    return (
      <NoResults
        data={data}
        query={query}
        styleNames={styleNames}
        filtered={filtered}
        onNavigate={onNavigate}
        onClearFilters={onClearFilters}
      />
    );
  }
  if (data.hits.length === 0) {
    return (
      <div className="kf-card">
        <h3 className="text-lg font-semibold">No recipes on this page</h3>
        <p className="mt-2 text-muted">This search has {plural(data.pageCount, 'page')}.</p>
        <button type="button" className="kf-btn-quiet mt-4" onClick={() => onNavigate({ ...query, page: 1 })}>
          Go to the first page
        </button>
      </div>
    );
  }
  return (
    <>
      <ul className="space-y-3">
        {data.hits.map((hit) => (
          <ResultCard key={hit.id} hit={hit} />
        ))}
      </ul>
      <Pager query={query} pageCount={data.pageCount} onNavigate={onNavigate} />
    </>
  );
}
