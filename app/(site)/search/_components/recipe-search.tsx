'use client';

import { useSearchParams } from 'next/navigation';
import { useEffect, useMemo, useRef, useState, type FormEvent } from 'react';
import { searchUnavailable, useRecipeSearch } from '@/hooks/use-recipe-search';
import { ApiError } from '@/lib/http/client';
import type { StyleCategory } from '@/lib/brewing/styles';
import {
  MAX_QUERY_LENGTH,
  parseSearchParamsLeniently,
  SEARCH_SORTS,
  serializeSearchQuery,
  type RecipeSearchQuery,
  type SearchSort,
} from '@/lib/search/schemas';
import { SearchFilters } from './search-filters';
import { ResultsSkeleton, SearchFailed, SearchResults, SearchUnavailable } from './search-results';
import { activeFilterCount, FIELD_WORDS, readableMessage, withoutFilters, writeSearchToUrl } from './search-url';

const TYPING_PAUSE_MS = 250;

const SORT_WORDS: Record<SearchSort, string> = {
  relevance: 'Best match',
  newest: 'Newest',
  stars: 'Most starred',
  forks: 'Most forked',
};

interface RecipeSearchProps {
  categories: StyleCategory[];
  /** The server could not reach search for the first render. */
  unavailableAtFirst: boolean;
}

/** The search page's working part: the words box, filters, results and paging, all held in the address. */
export function RecipeSearch({ categories, unavailableAtFirst }: RecipeSearchProps) {
  const searchParams = useSearchParams();
  const { query, ignored } = useMemo(
    () => parseSearchParamsLeniently(new URLSearchParams(searchParams.toString())),
    [searchParams],
  );
  const queryString = serializeSearchQuery(query);

  // Do not ask again straight away for what the server just found unreachable; "Try again" does.
  const [firstQueryString] = useState(queryString);
  const [retried, setRetried] = useState(false);
  const search = useRecipeSearch(query, {
    enabled: !(unavailableAtFirst && !retried && queryString === firstQueryString),
  });

  const latestQuery = useRef(query);
  useEffect(() => {
    latestQuery.current = query;
  }, [query]);

  const [text, setText] = useState(query.q);
  const sentWords = useRef(query.q);
  const [filtersOpen, setFiltersOpen] = useState(false);

  // Back, Forward or a suggestion changed the words: show them in the box.
  useEffect(() => {
    if (query.q !== sentWords.current) {
      sentWords.current = query.q;
      setText(query.q);
    }
  }, [query.q]);

  function navigate(next: RecipeSearchQuery, mode: 'push' | 'replace' = 'push') {
    sentWords.current = next.q;
    writeSearchToUrl(next, mode);
  }

  // Results follow the words as they are typed, after a short pause. Only typing starts the
  // pause; the filters it builds on are read when it ends, so a click meanwhile is kept.
  useEffect(() => {
    const words = text.trim();
    if (words === latestQuery.current.q) return;
    const timer = setTimeout(() => navigate({ ...latestQuery.current, q: words, page: 1 }, 'replace'), TYPING_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [text]);

  function onSubmit(event: FormEvent) {
    event.preventDefault();
    if (text.trim() !== query.q) navigate({ ...query, q: text.trim(), page: 1 }, 'replace');
  }

  function changePage(next: RecipeSearchQuery) {
    navigate(next);
    document.getElementById('search-results')?.scrollIntoView({ block: 'start' });
  }

  const styleNames = useMemo(
    () => Object.fromEntries(categories.flatMap((c) => c.styles.map((s) => [s.code, s.name]))),
    [categories],
  );
  const filterCount = activeFilterCount(query);
  const error = search.error;
  const unavailable = !search.data && ((unavailableAtFirst && !retried) || searchUnavailable(error));
  const updating = search.isFetching && search.isPlaceholderData;

  function retry() {
    setRetried(true);
    void search.refetch();
  }

  let body;
  if (unavailable) body = <SearchUnavailable onRetry={retry} retrying={search.isFetching} />;
  else if (error && !search.data)
    body = <SearchFailed message={error instanceof ApiError ? error.summary : error.message} onRetry={retry} />;
  else if (!search.data) body = <ResultsSkeleton />;
  else
    body = (
      <SearchResults
        data={search.data}
        query={query}
        styleNames={styleNames}
        filtered={filterCount > 0}
        onNavigate={changePage}
        onClearFilters={() => navigate(withoutFilters(query))}
      />
    );

  const ignoredFields = [...new Set(ignored.map((entry) => FIELD_WORDS[entry.field]))];

  return (
    <div className="mt-6">
      <form role="search" onSubmit={onSubmit} className="max-w-3xl">
        <label htmlFor="search-words" className="kf-label">
          Search recipes
        </label>
        <div className="flex gap-2">
          <input
            id="search-words"
            type="search"
            className="kf-input"
            value={text}
            maxLength={MAX_QUERY_LENGTH}
            placeholder="A name, style, hop, malt or yeast — “porter”, “Saaz”, “kveik”"
            autoComplete="off"
            spellCheck={false}
            onChange={(event) => setText(event.target.value)}
          />
          <button type="submit" className="kf-btn">
            Search
          </button>
        </div>
      </form>

      {ignoredFields.length > 0 && (
        <div className="mt-4 max-w-3xl rounded-md border border-line bg-card p-3 font-sans text-sm" role="status">
          <p>
            Part of this search’s address could not be used, so it was left out: {ignoredFields.join(', ')}. The results
            below use the rest.
          </p>
          <ul className="mt-1 list-disc pl-5 text-muted">
            {ignored.flatMap((entry) =>
              entry.messages.map((message) => <li key={`${entry.field}:${message}`}>{readableMessage(message)}</li>),
            )}
          </ul>
        </div>
      )}

      <div className="mt-6 lg:grid lg:grid-cols-[16rem_minmax(0,1fr)] lg:gap-8">
        <div className="mb-4 lg:hidden">
          <button
            type="button"
            className="kf-btn-quiet w-full justify-between"
            aria-expanded={filtersOpen}
            aria-controls="search-filters"
            onClick={() => setFiltersOpen(!filtersOpen)}
          >
            <span>Filters{filterCount > 0 ? ` (${filterCount} on)` : ''}</span>
            <span aria-hidden="true">{filtersOpen ? '▴' : '▾'}</span>
          </button>
        </div>
        <aside
          id="search-filters"
          aria-label="Filters"
          className={`${filtersOpen ? 'block' : 'hidden'} mb-6 lg:mb-0 lg:block`}
        >
          <div className="kf-card p-4">
            <div className="mb-3 flex items-baseline justify-between gap-2">
              {/* On a phone the disclosure button already says "Filters". */}
              <h2 className="font-sans text-base font-semibold max-lg:sr-only">Filters</h2>
              {filterCount > 0 && (
                <button
                  type="button"
                  className="font-sans text-sm text-copper-strong underline underline-offset-2"
                  onClick={() => navigate(withoutFilters(query))}
                >
                  Clear all
                </button>
              )}
            </div>
            <SearchFilters
              query={query}
              categories={categories}
              data={search.data}
              onChange={(next) => navigate(next)}
            />
          </div>
        </aside>

        <section id="search-results" aria-labelledby="search-results-heading" className="min-w-0 scroll-mt-4">
          <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
            <div aria-live="polite">
              <h2 id="search-results-heading" className="text-xl font-semibold">
                {search.data
                  ? `${search.data.total.toLocaleString('en')} ${search.data.total === 1 ? 'recipe' : 'recipes'}`
                  : 'Recipes'}
              </h2>
              <p className={`font-sans text-xs text-muted ${updating ? '' : 'invisible'}`}>Updating…</p>
            </div>
            <div>
              <label htmlFor="search-sort" className="kf-label">
                Sort by
              </label>
              <select
                id="search-sort"
                className="kf-input w-auto py-1.5 text-sm"
                value={query.sort}
                onChange={(event) => navigate({ ...query, sort: event.target.value as SearchSort, page: 1 })}
              >
                {SEARCH_SORTS.map((sort) => (
                  <option key={sort} value={sort}>
                    {SORT_WORDS[sort]}
                  </option>
                ))}
              </select>
            </div>
          </div>
          <div
            aria-busy={search.isFetching}
            className={updating ? 'opacity-60 transition-opacity' : 'transition-opacity'}
          >
            {body}
          </div>
        </section>
      </div>
    </div>
  );
}
