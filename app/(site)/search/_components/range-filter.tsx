'use client';

import { useId, useState, type FocusEvent, type FormEvent } from 'react';
import { RANGE_BOUNDS, type RangeField } from '@/lib/search/schemas';

export interface RangeSpec {
  field: RangeField;
  /** The legend: "ABV". */
  label: string;
  /** Shown after the legend: "%". */
  unit: string;
  step: number;
  decimals: number;
}

export const RANGE_SPECS: RangeSpec[] = [
  { field: 'abv', label: 'ABV', unit: '%', step: 0.1, decimals: 1 },
  { field: 'ibu', label: 'Bitterness', unit: 'IBU', step: 1, decimals: 0 },
  { field: 'srm', label: 'Colour', unit: 'SRM', step: 1, decimals: 1 },
  { field: 'og', label: 'Original gravity', unit: 'OG', step: 0.001, decimals: 3 },
];

export interface RangeValue {
  min?: number;
  max?: number;
}

interface RangeFilterProps {
  spec: RangeSpec;
  value: RangeValue;
  /** The lowest and highest value among the current results, as a hint. */
  stats?: { min: number; max: number };
  onCommit(value: RangeValue): void;
}

const asText = (n: number | undefined) => (n === undefined ? '' : String(n));

/** Checks what was typed; returns the range or a message for people. */
function readRange(spec: RangeSpec, minText: string, maxText: string): { value: RangeValue } | { error: string } {
  const bounds = RANGE_BOUNDS[spec.field];
  const value: RangeValue = {};
  for (const [end, raw] of [
    ['min', minText],
    ['max', maxText],
  ] as const) {
    if (raw.trim() === '') continue;
    const n = Number(raw);
    if (!Number.isFinite(n)) return { error: `${spec.label} needs numbers.` };
    if (n < bounds.min || n > bounds.max) return { error: `${spec.label} goes from ${bounds.min} to ${bounds.max}.` };
    value[end] = n;
  }
  if (value.min !== undefined && value.max !== undefined && value.min > value.max) {
    return { error: `The lowest ${spec.label} is above the highest.` };
  }
  return { value };
}

/**
 * Two labelled number boxes. The range is applied when Enter is pressed or focus leaves the
 * pair, so a number is not searched for half-typed.
 */
export function RangeFilter({ spec, value, stats, onCommit }: RangeFilterProps) {
  const id = useId();
  const [minText, setMinText] = useState(asText(value.min));
  const [maxText, setMaxText] = useState(asText(value.max));
  const [error, setError] = useState<string | null>(null);

  // The address changed (Back, a suggestion, "Clear"): show what it says.
  const [shown, setShown] = useState(value);
  if (shown.min !== value.min || shown.max !== value.max) {
    setShown(value);
    setMinText(asText(value.min));
    setMaxText(asText(value.max));
    setError(null);
  }

  function commit() {
    const read = readRange(spec, minText, maxText);
    if ('error' in read) {
      setError(read.error);
      return;
    }
    setError(null);
    if (read.value.min !== value.min || read.value.max !== value.max) onCommit(read.value);
  }

  function onSubmit(event: FormEvent) {
    event.preventDefault();
    commit();
  }

  function onBlur(event: FocusEvent<HTMLFormElement>) {
    if (!event.currentTarget.contains(event.relatedTarget as Node | null)) commit();
  }

  const bounds = RANGE_BOUNDS[spec.field];
  const errorId = `${id}-error`;
  const hintId = `${id}-hint`;
  const inputClass = 'kf-input kf-data px-2 py-1 text-sm';
  const shared = {
    id,
    label: spec.label,
    className: inputClass,
    min: bounds.min,
    max: bounds.max,
    step: spec.step,
    invalid: Boolean(error),
    describedBy: error ? errorId : stats ? hintId : undefined,
  };
  return (
    <form onSubmit={onSubmit} onBlur={onBlur} noValidate>
      <fieldset>
        <legend className="kf-label">
          {spec.label} <span className="font-normal text-muted">({spec.unit})</span>
        </legend>
        <div className="flex items-end gap-2">
          <RangeEnd
            end="min"
            word="from"
            text={minText}
            onText={setMinText}
            placeholder={stats ? stats.min.toFixed(spec.decimals) : String(bounds.min)}
            {...shared}
          />
          <span aria-hidden="true" className="pb-1.5 text-muted">
            –
          </span>
          <RangeEnd
            end="max"
            word="to"
            text={maxText}
            onText={setMaxText}
            placeholder={stats ? stats.max.toFixed(spec.decimals) : String(bounds.max)}
            {...shared}
          />
        </div>
        {error ? (
          <p id={errorId} className="kf-field-error">
            {error}
          </p>
        ) : (
          stats && (
            <p id={hintId} className="mt-1 font-sans text-xs text-muted">
              These results:{' '}
              <span className="kf-data">
                {stats.min.toFixed(spec.decimals)}–{stats.max.toFixed(spec.decimals)}
              </span>
            </p>
          )
        )}
        {/* Lets Enter apply the range; leaving the pair applies it too, so it needs no place in the tab order. */}
        <button type="submit" className="sr-only" tabIndex={-1} aria-hidden="true">
          Apply {spec.label} range
        </button>
      </fieldset>
    </form>
  );
}

/** One end of a range: its own label (read with the range's name) and number input. */
function RangeEnd(props: {
  end: 'min' | 'max';
  word: string;
  text: string;
  onText: (text: string) => void;
  placeholder: string;
  id: string;
  label: string;
  className: string;
  min: number;
  max: number;
  step: number;
  invalid: boolean;
  describedBy: string | undefined;
}) {
  const inputId = `${props.id}-${props.end}`;
  return (
    <div className="min-w-0 flex-1">
      <label htmlFor={inputId} className="block font-sans text-xs text-muted">
        <span className="sr-only">{props.label} </span>
        {props.word}
      </label>
      <input
        id={inputId}
        type="number"
        inputMode="decimal"
        className={props.className}
        min={props.min}
        max={props.max}
        step={props.step}
        value={props.text}
        placeholder={props.placeholder}
        aria-invalid={props.invalid || undefined}
        aria-describedby={props.describedBy}
        onChange={(event) => props.onText(event.target.value)}
      />
    </div>
  );
}
