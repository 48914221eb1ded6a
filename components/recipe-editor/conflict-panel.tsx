'use client';

import { formatDistanceToNow } from 'date-fns';
import { useEffect, useRef } from 'react';
import type { RecipeDocumentInput } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import type { HeadVersion } from './save-recipe';
import { compareVersions, hasChanges } from './version-changes';

function whenSaved(createdAt: string): string {
  const date = new Date(createdAt);
  return Number.isNaN(date.getTime()) ? '' : ` ${formatDistanceToNow(date)} ago`;
}

/**
 * Shown when a newer version was saved while the member edited an older one:
 * what that version changed, and how to go on without losing the member's work.
 */
export function ConflictPanel({
  head,
  baseDocument,
  baseVersionNumber,
  slug,
  units,
  saving,
  onSaveOnTop,
}: {
  head: HeadVersion;
  baseDocument: RecipeDocumentInput;
  baseVersionNumber?: number;
  slug?: string;
  units: UnitSystem;
  saving: boolean;
  onSaveOnTop: () => void;
}) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), [head.id]);
  const changes = compareVersions(baseDocument, head.document, units);
  const from =
    baseVersionNumber === undefined
      ? 'the version you started from'
      : `version ${baseVersionNumber}, the one you started from`;

  return (
    <section aria-labelledby="kf-conflict-title" className="rounded-lg border-2 border-caution bg-card p-5">
      <h2 id="kf-conflict-title" ref={heading} tabIndex={-1} className="text-xl font-semibold">
        A newer version was saved while you were editing
      </h2>
      <p className="mt-2 font-sans text-sm">
        {head.authorName} saved version {head.number}
        {whenSaved(head.createdAt)}
        {head.message ? `: “${head.message}”.` : '.'} Your changes are still in the form below and have not been saved.
      </p>
      <h3 className="mt-4 text-base font-semibold">
        What version {head.number} changed since {from}
      </h3>
      {hasChanges(changes) ? (
        <div className="mt-2 space-y-3">
          {changes.groups.map((group) => (
            <div key={group.title}>
              <h4 className="font-sans text-sm font-semibold">{group.title}</h4>
              <ul className="ml-5 list-disc font-sans text-sm">
                {group.lines.map((line, i) => (
                  <li key={i}>{line}</li>
                ))}
              </ul>
            </div>
          ))}
          {changes.notesChanged && <p className="font-sans text-sm">The notes changed too.</p>}
        </div>
      ) : (
        <p className="mt-2 font-sans text-sm">Nothing in the recipe itself; only the version message differs.</p>
      )}
      <p className="mt-4 font-sans text-sm text-muted">
        Saving on top makes your form the next version as it stands, so the changes listed above are replaced by yours.
        Copy any you want to keep into the form first.
      </p>
      <div className="mt-3 flex flex-wrap gap-3">
        <button type="button" className="kf-btn" onClick={onSaveOnTop} disabled={saving}>
          {saving ? 'Saving…' : `Keep my changes and save on top of version ${head.number}`}
        </button>
        {slug && (
          <a
            href={`/recipes/${slug}/v/${head.number}`}
            target="_blank"
            rel="noopener noreferrer"
            className="kf-btn-quiet"
          >
            Open version {head.number}
            <span className="sr-only"> (opens in a new tab)</span>
          </a>
        )}
      </div>
    </section>
  );
}
