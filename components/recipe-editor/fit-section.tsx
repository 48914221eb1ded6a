'use client';

import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { FitChanges, useBrewhouseFit } from '@/components/fit-to-brewhouse';
import type { RecipeDocument } from '@/lib/brewing/schema';
import type { UnitSystem } from '@/lib/brewing/units';
import type { EditorValues } from './editor-form';

/** "Fit to my brewhouse" in the editor: shows what changes, and writes it into the form only when asked. */
export function FitToBrewhouse({
  doc,
  current,
  units,
}: {
  doc: RecipeDocument | null;
  current: boolean;
  units: UnitSystem;
}) {
  const { setValue } = useFormContext<EditorValues>();
  const [open, setOpen] = useState(false);
  const result = useBrewhouseFit(doc, open);
  const apply = () => {
    if (result.state !== 'ready') return;
    const { fitted } = result;
    const options = { shouldDirty: true, shouldValidate: true };
    setValue('document.batch', fitted.batch, options);
    setValue('document.fermentables', fitted.fermentables, options);
    setValue('document.hops', fitted.hops, options);
    if (fitted.water) setValue('document.water', fitted.water, options);
    setOpen(false);
  };
  return (
    <div className="mt-4 rounded-md border border-line p-3">
      {!open ? (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="kf-btn-quiet" onClick={() => setOpen(true)} disabled={!current || !doc}>
            Fit to my brewhouse
          </button>
          <p className="font-sans text-xs text-muted">
            {current && doc
              ? 'Rescales to your batch volume, efficiency and losses, keeping OG, bitterness and colour.'
              : 'Fix the marked fields first: a fit starts from a complete recipe.'}
          </p>
        </div>
      ) : (
        <div>
          <h3 className="text-base font-semibold">Fit to my brewhouse</h3>
          <div className="mt-2">
            <FitChanges result={result} units={units} />
          </div>
          <div className="mt-3 flex flex-wrap gap-2">
            {result.state === 'ready' && result.changes.length > 0 && (
              <button type="button" className="kf-btn" onClick={apply}>
                Apply these changes
              </button>
            )}
            <button type="button" className="kf-btn-quiet" onClick={() => setOpen(false)}>
              {result.state === 'ready' && result.changes.length > 0 ? 'Keep the recipe as it is' : 'Close'}
            </button>
          </div>
        </div>
      )}
    </div>
  );
}
