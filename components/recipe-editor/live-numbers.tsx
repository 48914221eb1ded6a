'use client';

import Link from 'next/link';
import { useEffect, useState } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { StatsPanel } from '@/components/stats-panel';
import { formatIssues, recipeDocumentSchema, type FieldIssue, type RecipeDocument } from '@/lib/brewing/schema';
import { computeStats, restTempForTargetFg, type RecipeStats } from '@/lib/brewing/stats';
import { toDisplayUnits, type UnitSystem } from '@/lib/brewing/units';
import { fieldId } from './editor-fields';
import { OwnAttenuation } from './own-attenuation';
import { withoutEmpty, type EditorValues } from './editor-form';

/** Long enough to skip most keystrokes in a burst, short enough to feel live. */
const RECOMPUTE_DELAY_MS = 150;
const ISSUES_SHOWN = 3;

export interface LiveStats {
  /** The last numbers of a valid document; null until there has been one. */
  stats: RecipeStats | null;
  /** The checked document those numbers are of. */
  document: RecipeDocument | null;
  /** False while the form holds something the schema refuses: the numbers are older than the form. */
  current: boolean;
  issues: FieldIssue[];
}

function evaluate(document: unknown, previous: Pick<LiveStats, 'stats' | 'document'>): LiveStats {
  const parsed = recipeDocumentSchema.safeParse(withoutEmpty(document));
  if (parsed.success) return { stats: computeStats(parsed.data), document: parsed.data, current: true, issues: [] };
  return { ...previous, current: false, issues: formatIssues(parsed.error) };
}

/** The recipe's numbers, recomputed shortly after each change while the document is valid. */
export function useLiveStats(form: UseFormReturn<EditorValues, unknown, unknown>): LiveStats {
  const { watch, getValues } = form;
  const [live, setLive] = useState<LiveStats>(() => evaluate(getValues('document'), { stats: null, document: null }));
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const subscription = watch(() => {
      clearTimeout(timer);
      timer = setTimeout(() => setLive((previous) => evaluate(getValues('document'), previous)), RECOMPUTE_DELAY_MS);
    });
    return () => {
      clearTimeout(timer);
      subscription.unsubscribe();
    };
  }, [watch, getValues]);
  return live;
}

function focusField(path: string): void {
  const element = document.getElementById(fieldId(`document.${path}`));
  if (element) element.focus();
}

function StaleNote({ issues }: { issues: FieldIssue[] }) {
  return (
    <div role="status" className="mb-3 rounded-md border border-caution p-3 font-sans text-sm">
      <p className="font-semibold text-caution">Fix the marked fields to update the numbers.</p>
      <ul className="mt-1 space-y-1">
        {issues.slice(0, ISSUES_SHOWN).map((issue) => (
          <li key={`${issue.path}:${issue.message}`}>
            <button
              type="button"
              className="text-left text-copper-strong underline underline-offset-2"
              onClick={() => focusField(issue.path)}
            >
              {issue.message}
            </button>
          </li>
        ))}
      </ul>
      {issues.length > ISSUES_SHOWN && <p className="mt-1 text-muted">and {issues.length - ISSUES_SHOWN} more</p>}
    </div>
  );
}

export function LiveNumbers({ live, units }: { live: LiveStats; units: UnitSystem }) {
  return (
    <section id="numbers" aria-labelledby="numbers-title" className="kf-card">
      <h2 id="numbers-title" className="text-xl font-semibold">
        Numbers
      </h2>
      <p className="mb-3 font-sans text-xs text-muted">
        Worked out as you type, with the same formulas used when you save.
      </p>
      {!live.current && <StaleNote issues={live.issues} />}
      {live.stats ? (
        <div className={live.current ? '' : 'opacity-60'}>
          <StatsPanel stats={live.stats} units={units} />
          {live.document && <OwnAttenuation doc={live.document} og={live.stats.og} fg={live.stats.fg} />}
          {live.document && <RestForFgTool doc={live.document} units={units} />}
        </div>
      ) : (
        <p className="font-sans text-sm text-muted">
          The numbers appear once the recipe has a batch volume, a fermentable and a yeast.
        </p>
      )}
    </section>
  );
}

function formatC(tempC: number, units: UnitSystem): string {
  return `${toDisplayUnits(tempC, 'temperature', units).toFixed(1)} °${units === 'us' ? 'F' : 'C'}`;
}

/** Answers "which main rest gives this FG?" by the inverse of the engine's rest-temperature model. */
function RestForFgTool({ doc, units }: { doc: RecipeDocument; units: UnitSystem }) {
  const [text, setText] = useState('');
  const typed = Number(text.trim().replace(',', '.'));
  const given = text.trim() !== '';
  const valid = given && Number.isFinite(typed) && typed >= 0.99 && typed <= 1.1;
  const answer = valid ? restTempForTargetFg(doc, typed) : null;
  const range = `${formatC(62, units)}–${formatC(72, units)}`;
  return (
    <section className="mt-6" aria-labelledby="rest-for-fg-title">
      <h3 id="rest-for-fg-title" className="text-base font-semibold">
        Rest temperature for a final gravity
      </h3>
      <label htmlFor="kf-target-fg" className="kf-label mt-2">
        FG you want
      </label>
      <input
        id="kf-target-fg"
        className="kf-input kf-data max-w-[8rem]"
        inputMode="decimal"
        placeholder="e.g. 1.010"
        value={text}
        aria-invalid={(given && !valid) || undefined}
        aria-describedby="kf-target-fg-answer"
        onChange={(event) => setText(event.target.value)}
      />
      <p id="kf-target-fg-answer" role="status" className="mt-1 font-sans text-sm">
        {!given
          ? 'Type a gravity such as 1.010 to get the main rest that reaches it with this grist and yeast.'
          : !valid
            ? 'Give the FG as a gravity between 0.990 and 1.100.'
            : answer!.ok
              ? `Rest at about ${formatC(answer!.tempC, units)} for this FG.`
              : `No rest in ${range} reaches it: the ${answer!.reason === 'too_low' ? 'coolest' : 'hottest'} rest, ${formatC(answer!.closestTempC, units)}, gives about ${answer!.closestFg.toFixed(3)}.`}
      </p>
      <Link href="/guides/designing#rest-temperature" className="font-sans text-xs">
        how is this worked out?<span className="sr-only"> (rest temperature)</span>
      </Link>
    </section>
  );
}

/** A one-line summary pinned to the bottom of small screens, where the full panel is far down the page. */
export function NumbersBar({ live, units }: { live: LiveStats; units: UnitSystem }) {
  if (!live.stats) return null;
  return (
    <div className="fixed inset-x-0 bottom-0 z-20 border-t border-line bg-card px-4 py-2 shadow-lg lg:hidden">
      <div className="flex items-center justify-between gap-3">
        <div className={live.current ? '' : 'opacity-60'}>
          <StatsPanel stats={live.stats} units={units} compact />
        </div>
        <a href="#numbers" className="shrink-0 font-sans text-xs">
          {live.current ? 'All numbers' : 'Not updated: see why'}
        </a>
      </div>
    </div>
  );
}
