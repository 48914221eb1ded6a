'use client';

import { useFitTarget } from '@/hooks/use-brewhouse';
import type { FitTarget } from '@/lib/brewing/fit-target';
import { describeFit, scaleRecipe, type FitChange, type FitUnit } from '@/lib/brewing/scale';
import { formatIssues, recipeDocumentSchema, type FieldIssue, type RecipeDocument } from '@/lib/brewing/schema';
import { litresPerKgToQuartsPerLb, type UnitSystem } from '@/lib/brewing/units';
import { formatAmount } from '@/lib/format';

export type BrewhouseFit =
  | { state: 'loading' }
  | { state: 'error'; message: string }
  | { state: 'refused'; fit: FitTarget; issues: FieldIssue[] }
  | { state: 'ready'; fit: FitTarget; fitted: RecipeDocument; changes: FitChange[] };

/**
 * The recipe fitted to the member's brewhouse (scaleRecipe), what that
 * changes (describeFit), or why it cannot be: loading, a failed load, or a
 * fitted recipe the schema refuses (a much lower efficiency can need more
 * grain than a batch may hold).
 */
export function useBrewhouseFit(doc: RecipeDocument | null | undefined, enabled: boolean): BrewhouseFit {
  const { fit, isLoading, error } = useFitTarget(enabled);
  if (error) return { state: 'error', message: error.message };
  if (isLoading || !fit || !doc) return { state: 'loading' };
  const parsed = recipeDocumentSchema.safeParse(scaleRecipe(doc, fit.target));
  if (!parsed.success) return { state: 'refused', fit, issues: formatIssues(parsed.error) };
  return { state: 'ready', fit, fitted: parsed.data, changes: describeFit(doc, parsed.data) };
}

function amount(value: number, unit: FitUnit, units: UnitSystem): string {
  switch (unit) {
    case 'L':
      return formatAmount(value, 'volume', units, 2);
    case 'kg':
      return formatAmount(value, 'mass', units, 3);
    case 'hop g':
      return formatAmount(value, 'hopMass', units, units === 'us' ? 2 : 1);
    case 'L/h':
      return `${formatAmount(value, 'volume', units, 2)} per hour`;
    case 'L/kg':
      return units === 'us' ? `${+litresPerKgToQuartsPerLb(value).toFixed(2)} qt/lb` : `${+value.toFixed(2)} L/kg`;
    case '%':
      return `${+value.toFixed(1)} %`;
    case 'g':
      return `${+value.toFixed(2)} g`;
  }
}

function efficiencyNote(fit: FitTarget): string {
  return fit.efficiencyFrom === 'measured'
    ? `Efficiency measured over your last ${fit.measuredBrews} brew days.`
    : 'Efficiency from your settings (log two brew days with an OG to use your measured one).';
}

/** What a fit changes, line by line, before anything is applied. */
export function FitChanges({ result, units }: { result: BrewhouseFit; units: UnitSystem }) {
  switch (result.state) {
    case 'loading':
      return (
        <p role="status" className="font-sans text-sm text-muted">
          Loading your brewhouse…
        </p>
      );
    case 'error':
      return (
        <p role="alert" className="kf-field-error">
          {result.message}
        </p>
      );
    case 'refused':
      return (
        <div role="alert" className="font-sans text-sm">
          <p className="font-semibold text-danger">Fitted to your brewhouse, this recipe would not be valid:</p>
          <ul className="mt-1 list-disc pl-5">
            {result.issues.slice(0, 3).map((issue) => (
              <li key={`${issue.path}:${issue.message}`}>{issue.message}</li>
            ))}
          </ul>
          <p className="mt-1 text-muted">
            Check your batch volume and efficiency in <a href="/settings">settings</a>.
          </p>
        </div>
      );
    case 'ready':
      return (
        <div className="font-sans text-sm" data-testid="fit-changes">
          {result.changes.length === 0 ? (
            <p>This recipe already fits your brewhouse: nothing changes.</p>
          ) : (
            <table className="w-full">
              <caption className="sr-only">What fitting to your brewhouse changes</caption>
              <thead>
                <tr className="border-b border-line text-left text-xs text-muted">
                  <th scope="col" className="py-1 font-semibold">
                    What
                  </th>
                  <th scope="col" className="py-1 font-semibold">
                    Now
                  </th>
                  <th scope="col" className="py-1 font-semibold">
                    Fitted
                  </th>
                </tr>
              </thead>
              <tbody className="kf-data">
                {result.changes.map((change, i) => (
                  <tr key={i} className="border-b border-line/60 last:border-0">
                    <td className="py-1 pr-2 font-sans">
                      {change.what.charAt(0).toUpperCase() + change.what.slice(1)}
                    </td>
                    <td className="py-1 pr-2">{amount(change.from, change.unit, units)}</td>
                    <td className="py-1 font-semibold">{amount(change.to, change.unit, units)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          <p className="mt-2 text-xs text-muted">
            {efficiencyNote(result.fit)} OG, bitterness and colour are kept; losses you left empty in{' '}
            <a href="/settings">settings</a> stay as the recipe has them.
          </p>
        </div>
      );
  }
}
