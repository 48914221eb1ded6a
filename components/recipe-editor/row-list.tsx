'use client';

import { useRef, useState, type ReactNode } from 'react';
import { useWatch } from 'react-hook-form';
import type { EditorPath } from './editor-fields';
import { ListError, fieldId } from './editor-fields';
import type { EditorValues } from './editor-form';

interface RowListProps {
  /** The list's form path, e.g. `document.hops`. */
  path: EditorPath;
  /** What one row is, in words: "hop", "mash step". */
  noun: string;
  /** Stable React keys from useFieldArray. */
  keys: readonly string[];
  maxRows: number;
  /** Path of the text that names a row in button labels ("Move Cascade up"); rows are numbered otherwise. */
  namePath?: (index: number) => EditorPath;
  onAdd: () => void;
  onMove: (from: number, to: number) => void;
  onRemove: (index: number) => void;
  renderRow: (index: number) => ReactNode;
  emptyText: string;
}

function focusById(...ids: string[]): void {
  for (const id of ids) {
    const element = document.getElementById(id);
    if (element instanceof HTMLButtonElement && !element.disabled) {
      element.focus();
      return;
    }
  }
}

/** Rows of one list with add, remove and move controls that keep keyboard focus where the member is working. */
export function RowList({
  path,
  noun,
  keys,
  maxRows,
  namePath,
  onAdd,
  onMove,
  onRemove,
  renderRow,
  emptyText,
}: RowListProps) {
  const [announcement, setAnnouncement] = useState('');
  const addButton = useRef<HTMLButtonElement>(null);
  const list = useRef<HTMLOListElement>(null);
  const listId = fieldId(path);

  const move = (from: number, to: number, rowName: string, direction: 'up' | 'down') => {
    onMove(from, to);
    setAnnouncement(`${rowName} moved to position ${to + 1} of ${keys.length}.`);
    const other = direction === 'up' ? 'down' : 'up';
    requestAnimationFrame(() => focusById(`${listId}-${to}-${direction}`, `${listId}-${to}-${other}`));
  };

  const add = () => {
    onAdd();
    // Focus moves into the new row, so the member types its name straight away.
    requestAnimationFrame(() =>
      list.current?.lastElementChild?.querySelector<HTMLElement>('input, select, textarea')?.focus(),
    );
  };

  const remove = (index: number, rowName: string) => {
    onRemove(index);
    setAnnouncement(`${rowName} removed.`);
    requestAnimationFrame(() => addButton.current?.focus());
  };

  return (
    <div>
      <ListError path={path} />
      {keys.length === 0 ? (
        <p className="font-sans text-sm text-muted">{emptyText}</p>
      ) : (
        <ol ref={list} className="space-y-3">
          {keys.map((key, index) => (
            <li key={key} className="rounded-md border border-line p-3">
              <RowHeader
                listId={listId}
                noun={noun}
                index={index}
                count={keys.length}
                namePath={namePath?.(index)}
                onMove={move}
                onRemove={remove}
              />
              <div className="mt-2">{renderRow(index)}</div>
            </li>
          ))}
        </ol>
      )}
      <button
        ref={addButton}
        type="button"
        className="kf-btn-quiet mt-3"
        onClick={add}
        disabled={keys.length >= maxRows}
      >
        Add {noun}
      </button>
      <p aria-live="polite" className="sr-only">
        {announcement}
      </p>
    </div>
  );
}

function RowHeader({
  listId,
  noun,
  index,
  count,
  namePath,
  onMove,
  onRemove,
}: {
  listId: string;
  noun: string;
  index: number;
  count: number;
  namePath?: EditorPath;
  onMove: (from: number, to: number, rowName: string, direction: 'up' | 'down') => void;
  onRemove: (index: number, rowName: string) => void;
}) {
  const watchedName = useWatch<EditorValues>({ name: namePath ?? 'document.title', disabled: !namePath });
  const typedName = namePath && typeof watchedName === 'string' ? watchedName.trim() : '';
  const rowName = typedName || `${noun} ${index + 1}`;
  const button = 'kf-btn-quiet px-2 py-1 text-xs';
  return (
    <div className="flex flex-wrap items-center justify-between gap-2">
      <p className="font-sans text-sm font-semibold text-muted">
        {index + 1}. <span className="text-ink">{typedName || `New ${noun}`}</span>
      </p>
      <div className="flex gap-1">
        <button
          id={`${listId}-${index}-up`}
          type="button"
          className={button}
          aria-label={`Move ${rowName} up`}
          disabled={index === 0}
          onClick={() => onMove(index, index - 1, rowName, 'up')}
        >
          <span aria-hidden="true">↑</span> Up
        </button>
        <button
          id={`${listId}-${index}-down`}
          type="button"
          className={button}
          aria-label={`Move ${rowName} down`}
          disabled={index === count - 1}
          onClick={() => onMove(index, index + 1, rowName, 'down')}
        >
          <span aria-hidden="true">↓</span> Down
        </button>
        <button
          type="button"
          className={`${button} text-danger`}
          aria-label={`Remove ${rowName}`}
          onClick={() => onRemove(index, rowName)}
        >
          Remove
        </button>
      </div>
    </div>
  );
}
