'use client';

import { useEffect, useId, useRef, useState } from 'react';
import type { StyleCategory } from '@/lib/brewing/styles';
import { MAX_FILTER_VALUES } from '@/lib/search/schemas';
import { CountBadge, VISIBLE_VALUES } from './facet-checklist';

interface StyleFilterProps {
  categories: StyleCategory[];
  /** Chosen style codes. */
  selected: readonly string[];
  categoryCounts: Record<string, number> | undefined;
  styleCounts: Record<string, number> | undefined;
  onChange(codes: string[]): void;
}

interface CategoryRow {
  category: StyleCategory;
  count: number;
  /** The category's styles that have recipes here, or are chosen. */
  styles: Array<{ code: string; name: string; count: number }>;
}

function CategoryCheckbox({ checked, mixed, onChange }: { checked: boolean; mixed: boolean; onChange(): void }) {
  const ref = useRef<HTMLInputElement>(null);
  useEffect(() => {
    if (ref.current) ref.current.indeterminate = mixed;
  }, [mixed]);
  return (
    <input
      ref={ref}
      type="checkbox"
      className="mt-0.5 h-4 w-4 shrink-0 accent-copper"
      checked={checked}
      onChange={onChange}
    />
  );
}

/**
 * Styles grouped by the guideline's categories. Ticking a category chooses its styles that have
 * recipes; once any style of a category is chosen, its styles show so the choice can be narrowed.
 */
export function StyleFilter({ categories, selected, categoryCounts, styleCounts, onChange }: StyleFilterProps) {
  const [expanded, setExpanded] = useState(false);
  const [limitNote, setLimitNote] = useState(false);
  const listId = useId();
  const rows: CategoryRow[] = categories
    .map((category) => ({
      category,
      count: categoryCounts?.[category.name] ?? 0,
      styles: category.styles
        .map((style) => ({ ...style, count: styleCounts?.[style.code] ?? 0 }))
        .filter((style) => style.count > 0 || selected.includes(style.code)),
    }))
    .filter((row) => row.count > 0 || row.styles.length > 0)
    .sort((a, b) => b.count - a.count);

  if (rows.length === 0) return <p className="font-sans text-sm text-muted">No styles in these results.</p>;

  const isChosen = (row: CategoryRow) => row.styles.some((style) => selected.includes(style.code));
  const shown = expanded ? rows : rows.filter((row, i) => i < VISIBLE_VALUES || isChosen(row));

  function toggleCategory(row: CategoryRow) {
    const codes = row.category.styles.map((style) => style.code);
    const chosenHere = row.styles.filter((style) => selected.includes(style.code));
    if (chosenHere.length > 0 && chosenHere.length === row.styles.length) {
      onChange(selected.filter((code) => !codes.includes(code)));
      return;
    }
    const next = [...new Set([...selected, ...row.styles.map((style) => style.code)])];
    if (next.length > MAX_FILTER_VALUES) {
      setLimitNote(true);
      return;
    }
    setLimitNote(false);
    onChange(next);
  }

  function toggleStyle(code: string) {
    if (selected.includes(code)) onChange(selected.filter((c) => c !== code));
    else if (selected.length >= MAX_FILTER_VALUES) setLimitNote(true);
    else onChange([...selected, code]);
  }

  return (
    <div>
      <ul id={listId} className="space-y-1">
        {shown.map((row) => {
          const chosenHere = row.styles.filter((style) => selected.includes(style.code)).length;
          const all = chosenHere > 0 && chosenHere === row.styles.length;
          return (
            <li key={row.category.name}>
              <label className="flex cursor-pointer items-start gap-2 rounded px-1 py-0.5 font-sans text-sm hover:bg-paper">
                <CategoryCheckbox checked={all} mixed={chosenHere > 0 && !all} onChange={() => toggleCategory(row)} />
                <span className="min-w-0 break-words">{row.category.name}</span>
                <CountBadge count={row.count} />
              </label>
              {chosenHere > 0 && (
                <ul
                  className="ml-6 mt-1 space-y-1 border-l border-line pl-2"
                  aria-label={`Styles in ${row.category.name}`}
                >
                  {row.styles.map((style) => (
                    <li key={style.code}>
                      <label className="flex cursor-pointer items-start gap-2 rounded px-1 py-0.5 font-sans text-sm hover:bg-paper">
                        <input
                          type="checkbox"
                          className="mt-0.5 h-4 w-4 shrink-0 accent-copper"
                          checked={selected.includes(style.code)}
                          onChange={() => toggleStyle(style.code)}
                        />
                        <span className="min-w-0 break-words">
                          {style.name} <span className="kf-data text-xs text-muted">{style.code}</span>
                        </span>
                        <CountBadge count={style.count} />
                      </label>
                    </li>
                  ))}
                </ul>
              )}
            </li>
          );
        })}
      </ul>
      {limitNote && (
        <p className="kf-field-error" role="status">
          Up to {MAX_FILTER_VALUES} styles at once; untick some to add others.
        </p>
      )}
      {rows.length > VISIBLE_VALUES && (
        <button
          type="button"
          className="mt-1 font-sans text-sm text-copper-strong underline underline-offset-2"
          aria-expanded={expanded}
          aria-controls={listId}
          onClick={() => setExpanded(!expanded)}
        >
          {expanded ? 'Show fewer' : `Show all ${rows.length} style groups`}
        </button>
      )}
    </div>
  );
}
