'use client';

import { useState, type Ref } from 'react';
import { formatForInput, parseTyped, type FieldUnit } from './field-units';

function sameNumber(a: number | null | undefined, b: number | null | undefined): boolean {
  return a === b || (Number.isNaN(a) && Number.isNaN(b));
}

export interface UnitNumberInputProps {
  id: string;
  name: string;
  /** The stored (metric) value; null or undefined when empty. */
  value: number | null | undefined;
  /** Receives the stored (metric) value: null when empty, NaN when the text is not a number. */
  onChange: (stored: number | null) => void;
  onBlur?: () => void;
  unit: FieldUnit;
  invalid?: boolean;
  describedBy?: string;
  inputRef?: Ref<HTMLInputElement>;
  className?: string;
}

/**
 * A number input that shows a stored metric value in the member's unit and
 * writes metric back. The typed text stays as typed ("1.", "0.50") while the
 * value it stands for is sent on; the text is only rewritten when the value
 * changes from outside (a catalogue pick, a reset).
 */
export function UnitNumberInput({
  id,
  name,
  value,
  onChange,
  onBlur,
  unit,
  invalid,
  describedBy,
  inputRef,
  className = '',
}: UnitNumberInputProps) {
  const [text, setText] = useState(() => formatForInput(value, unit));
  const [shownValue, setShownValue] = useState(value);
  if (!sameNumber(value, shownValue)) {
    setShownValue(value);
    setText(formatForInput(value, unit));
  }

  return (
    <input
      id={id}
      name={name}
      ref={inputRef}
      type="text"
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      className={`kf-input kf-data ${className}`}
      value={text}
      aria-invalid={invalid || undefined}
      aria-describedby={describedBy}
      onChange={(event) => {
        const typed = event.target.value;
        const stored = parseTyped(typed, unit);
        setText(typed);
        setShownValue(stored);
        onChange(stored);
      }}
      onBlur={onBlur}
    />
  );
}
