'use client';

import type { ReactNode } from 'react';
import { YEAST_KINDS } from '@/lib/brewing/schema';
import type { StyleCategory } from '@/lib/brewing/styles';
import type { RecipeSearchResponse } from '@/lib/search/client';
import type { RecipeSearchQuery } from '@/lib/search/schemas';
import { FacetChecklist, facetValues } from './facet-checklist';
import { RANGE_SPECS, RangeFilter } from './range-filter';
import { StyleFilter } from './style-filter';

interface SearchFiltersProps {
  query: RecipeSearchQuery;
  categories: StyleCategory[];
  /** The latest results, for counts; absent while nothing has loaded. */
  data: RecipeSearchResponse | undefined;
  onChange(next: RecipeSearchQuery): void;
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="border-t border-line pt-4 first:border-t-0 first:pt-0">
      <h3 className="mb-2 font-sans text-sm font-semibold">{title}</h3>
      {children}
    </section>
  );
}

function toggled(values: readonly string[], value: string): string[] {
  return values.includes(value) ? values.filter((v) => v !== value) : [...values, value];
}

/** Every filter of the search, with counts from the current results. */
export function SearchFilters({ query, categories, data, onChange }: SearchFiltersProps) {
  const facets = data?.facetDistribution;
  const change = (patch: Partial<RecipeSearchQuery>) => onChange({ ...query, ...patch, page: 1 });
  // The yeast filter takes a strain's name or a kind; a chosen value shows in the list it belongs to.
  const isKind = (value: string) => (YEAST_KINDS as readonly string[]).includes(value);
  const yeastKindValues = facetValues(facets?.yeastKinds, query.yeast.filter(isKind));
  const yeastNameValues = facetValues(
    facets?.yeasts,
    query.yeast.filter((value) => !isKind(value)),
  );

  return (
    <div className="space-y-5">
      <Group title="Style">
        <StyleFilter
          categories={categories}
          selected={query.style}
          categoryCounts={facets?.styleCategory}
          styleCounts={facets?.styleCode}
          onChange={(style) => change({ style })}
        />
      </Group>
      <Group title="Hops">
        <FacetChecklist
          noun="hops"
          values={facetValues(facets?.hops, query.hop)}
          selected={query.hop}
          onToggle={(v) => change({ hop: toggled(query.hop, v) })}
        />
      </Group>
      <Group title="Malts and other fermentables">
        <FacetChecklist
          noun="fermentables"
          values={facetValues(facets?.fermentables, query.malt)}
          selected={query.malt}
          onToggle={(v) => change({ malt: toggled(query.malt, v) })}
        />
      </Group>
      <Group title="Yeast">
        <h4 className="mb-1 font-sans text-xs font-semibold uppercase tracking-wide text-muted">Kind</h4>
        <FacetChecklist
          noun="yeast kinds"
          values={yeastKindValues}
          selected={query.yeast}
          onToggle={(v) => change({ yeast: toggled(query.yeast, v) })}
        />
        <h4 className="mb-1 mt-3 font-sans text-xs font-semibold uppercase tracking-wide text-muted">Strain</h4>
        <FacetChecklist
          noun="yeasts"
          values={yeastNameValues}
          selected={query.yeast}
          onToggle={(v) => change({ yeast: toggled(query.yeast, v) })}
        />
      </Group>
      <Group title="Numbers">
        <div className="space-y-4">
          {RANGE_SPECS.map((spec) => (
            <RangeFilter
              key={spec.field}
              spec={spec}
              value={{ min: query[`${spec.field}Min`], max: query[`${spec.field}Max`] }}
              stats={data && data.total > 0 ? data.facetStats[spec.field] : undefined}
              onCommit={({ min, max }) => change({ [`${spec.field}Min`]: min, [`${spec.field}Max`]: max })}
            />
          ))}
        </div>
      </Group>
    </div>
  );
}
