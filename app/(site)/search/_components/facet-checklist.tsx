'use client';

import { useId, useState } from 'react';

/** How many values a list shows before "Show all". */
export const VISIBLE_VALUES = 12;

export interface FacetValue {
  value: string;
  count: number;
}

/** Values by count (most first), with every chosen value kept even when the results no longer count it. */
export function facetValues(
  distribution: Record<string, number> | undefined,
  selected: readonly string[],
): FacetValue[] {
  const counts = new Map(Object.entries(distribution ?? {}).filter(([value]) => value !== ''));
  for (const value of selected) if (!counts.has(value)) counts.set(value, 0);
  return [...counts]
    .map(([value, count]) => ({ value, count }))
    .sort((a, b) => b.count - a.count || a.value.localeCompare(b.value));
}

/** The first `limit` values, plus any chosen ones further down, so a ticked box never hides. */
function visibleValues(values: FacetValue[], selected: readonly string[], limit: number): FacetValue[] {
  return values.filter((item, i) => i < limit || selected.includes(item.value));
}

export function CountBadge({ count }: { count: number }) {
  return <span className="kf-data ml-auto pl-2 text-xs text-muted">{count.toLocaleString('en')}</span>;
}

interface FacetChecklistProps {
  /** What one value is, for the "Show all" button and the empty note: "hops". */
  noun: string;
  values: FacetValue[];
  selected: readonly string[];
  onToggle(value: string): void;
}

/** Checkboxes with result counts; the top few first, the rest behind "Show all". */
export function FacetChecklist({ noun, values, selected, onToggle }: FacetChecklistProps) {
  const [expanded, setExpanded] = useState(false);
  const listId = useId();
  if (values.length === 0) return <p className="font-sans text-sm text-muted">No {noun} in these results.</p>;
  const shown = expanded ? values : visibleValues(values, selected, VISIBLE_VALUES);
  return (
    <div>
      <ul id={listId} className="space-y-1">
        {shown.map(({ value, count }) => (
          <li key={value}>
            <label className="flex cursor-pointer items-start gap-2 rounded px-1 py-0.5 font-sans text-sm hover:bg-paper">
              <input
                type="checkbox"
                className="mt-0.5 h-4 w-4 shrink-0 accent-copper"
                checked={selected.includes(value)}
                onChange={() => onToggle(value)}
              />
              <span className="min-w-0 break-words">{value}</span>
              <CountBadge count={count} />
            </label>
          </li>
        ))}
      </ul>
      {values.length > VISIBLE_VALUES && (
        <button
          type="button"
          className="mt-1 font-sans text-sm text-copper-strong underline underline-offset-2"
          aria-expanded={expanded}
          aria-controls={listId}
          onClick={() => setExpanded(!expanded)}
        >
          {expanded ? 'Show fewer' : `Show all ${values.length} ${noun}`}
        </button>
      )}
    </div>
  );
}
