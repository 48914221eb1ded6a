'use client';

import { useId, useState } from 'react';
import { fieldUnit, parseTyped, plainUnit, type FieldUnit } from '@/components/recipe-editor/field-units';
import { LIVE_FIELD_LABELS, type LiveFieldState, type LiveValue } from '@/lib/brew-days/live-steps';
import type { OutboxItem } from '@/lib/brew-days/outbox';
import { parseLiveFieldValue, type LiveField } from '@/lib/brew-days/schemas';
import type { UnitSystem } from '@/lib/brewing/units';
import { formatAmount } from '@/lib/format';

const GRAVITY_FIELDS: readonly LiveField[] = ['preBoilGravity', 'og'];

function unitOf(field: LiveField, units: UnitSystem): FieldUnit {
  if (field === 'mashPh') return plainUnit('pH', 2);
  if (field.endsWith('TempC')) return fieldUnit('temperature', units);
  return fieldUnit('volume', units);
}

/** A field's value in the brewer's units, as the screen shows it. */
export function shownValue(field: LiveField, value: LiveValue, units: UnitSystem): string {
  if (value === null) return '—';
  if (typeof value !== 'number') {
    if (value.method === 'refractometer') return `${value.value} °Brix`;
    const at = value.sampleTempC == null ? '' : ` at ${formatAmount(value.sampleTempC, 'temperature', units)}`;
    return `${value.value.toFixed(3)}${at}`;
  }
  if (field === 'mashPh') return value.toFixed(2);
  return formatAmount(value, field.endsWith('TempC') ? 'temperature' : 'volume', units, 1);
}

function time(iso: string | number): string {
  return new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });
}

/** One reading taken at its step: typed, checked by the brew-day form's own rules, then kept until saved. */
export function LiveFieldInput({
  field,
  units,
  saved,
  pending,
  onEnter,
  conflicted,
  onDiscard,
}: {
  field: LiveField;
  units: UnitSystem;
  saved: LiveFieldState;
  pending: OutboxItem[];
  onEnter: (value: LiveValue) => Promise<string | null>;
  /** Another value for this field waits for the brewer's choice (shown above the step). */
  conflicted: boolean;
  onDiscard: (item: OutboxItem) => void;
}) {
  const id = useId();
  const gravity = GRAVITY_FIELDS.includes(field);
  const unit = unitOf(field, units);
  const tempUnit = fieldUnit('temperature', units);
  const [text, setText] = useState('');
  const [method, setMethod] = useState<'hydrometer' | 'refractometer'>('hydrometer');
  const [sampleText, setSampleText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const label = LIVE_FIELD_LABELS[field];

  const submit = async () => {
    const value: unknown = gravity
      ? {
          method,
          value: parseTyped(text, plainUnit('', 4)) ?? '',
          sampleTempC: method === 'hydrometer' ? parseTyped(sampleText, tempUnit) : null,
        }
      : parseTyped(text, unit);
    const checked = parseLiveFieldValue(field, value);
    if (!checked.success) return setError(checked.error.issues[0]?.message ?? `${label} is not valid`);
    if (checked.data === null) return setError(`Enter the ${label.toLowerCase()} first`);
    const refused = await onEnter(checked.data as LiveValue);
    if (refused) return setError(refused);
    setError(null);
    setText('');
    setSampleText('');
  };

  const waiting = pending.filter((p) => p.state === 'waiting');
  const refused = pending.filter((p) => p.state === 'refused');
  const valueOf = (item: OutboxItem) => (item.request.kind === 'field' ? item.request.value : null);

  return (
    <div className="rounded-lg border border-line bg-paper p-3" data-testid={`live-field-${field}`}>
      <form
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
      >
        {gravity && (
          <div>
            <label htmlFor={`${id}-method`} className="kf-label">
              Measured with
            </label>
            <select
              id={`${id}-method`}
              className="kf-input min-h-12 text-lg"
              value={method}
              onChange={(e) => setMethod(e.target.value as 'hydrometer' | 'refractometer')}
            >
              <option value="hydrometer">Hydrometer (SG)</option>
              <option value="refractometer">Refractometer (°Brix)</option>
            </select>
          </div>
        )}
        <div className="min-w-32 flex-1">
          <label htmlFor={`${id}-value`} className="kf-label">
            {label}{' '}
            <span className="text-muted">({gravity ? (method === 'hydrometer' ? 'SG' : '°Brix') : unit.label})</span>
          </label>
          <input
            id={`${id}-value`}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            className="kf-input kf-data min-h-12 w-full text-2xl"
            value={text}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
            onChange={(e) => setText(e.target.value)}
          />
        </div>
        {gravity && method === 'hydrometer' && (
          <div className="w-28">
            <label htmlFor={`${id}-sample`} className="kf-label">
              Sample at <span className="text-muted">({tempUnit.label})</span>
            </label>
            <input
              id={`${id}-sample`}
              type="text"
              inputMode="decimal"
              autoComplete="off"
              className="kf-input kf-data min-h-12 w-full text-2xl"
              value={sampleText}
              onChange={(e) => setSampleText(e.target.value)}
            />
          </div>
        )}
        <button type="submit" className="kf-btn min-h-12 px-5 text-lg">
          Save {label}
        </button>
      </form>
      {error && (
        <p id={`${id}-error`} className="mt-1 font-sans text-sm text-danger">
          {error}
        </p>
      )}
      <div className="mt-2 space-y-1 font-sans text-sm" aria-live="polite">
        {saved.value !== null && waiting.length === 0 && !conflicted && (
          <p className="text-bine" data-testid={`saved-${field}`}>
            Saved: <span className="kf-data font-semibold">{shownValue(field, saved.value, units)}</span>
            {saved.savedAt && (
              <>
                {' '}
                {saved.savedBy && `by ${saved.savedBy} `}at {time(saved.savedAt)}
              </>
            )}
          </p>
        )}
        {waiting.map((item) => (
          <p key={item.idempotencyKey} className="text-caution" data-testid={`waiting-${field}`}>
            Waiting to send: <span className="kf-data font-semibold">{shownValue(field, valueOf(item), units)}</span>{' '}
            (entered {time(item.createdAt)})
          </p>
        ))}
        {conflicted && (
          <p className="font-semibold text-danger" data-testid={`conflicted-${field}`}>
            Two values for {label}: choose one above.
          </p>
        )}
        {refused.map((item) => (
          <p key={item.idempotencyKey} className="text-danger">
            Not saved: {item.message}{' '}
            <button type="button" className="underline" onClick={() => onDiscard(item)}>
              Dismiss
            </button>
          </p>
        ))}
      </div>
    </div>
  );
}
