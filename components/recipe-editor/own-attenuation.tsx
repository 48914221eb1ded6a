'use client';

import { useBrewAverages } from '@/hooks/use-brewhouse';
import { finalGravity } from '@/lib/brewing/alcohol';
import type { RecipeDocument } from '@/lib/brewing/schema';
import { leadingYeastKind } from '@/lib/brew-days/measure';

/**
 * The FG this recipe would reach with the attenuation the member's own brew days measured for its
 * yeast kind (recency-weighted, two brews or more), beside the recipe's prediction. Nothing shows
 * until there are two such brews.
 */
export function OwnAttenuation({ doc, og, fg }: { doc: RecipeDocument; og: number; fg: number }) {
  const averages = useBrewAverages();
  const kind = leadingYeastKind(doc);
  const own = averages.data?.calibration.attenuationByYeastKind.find((a) => a.yeastKind === kind);
  if (!own) return null;
  const ownFg = finalGravity(og, own.weightedMeanPct);
  return (
    <p className="mt-3 rounded-md border border-line p-3 font-sans text-sm" data-testid="own-attenuation">
      With your own {kind} attenuation ({own.weightedMeanPct.toFixed(0)} % over {own.count} brews, spread ±
      {own.spreadPct.toFixed(1)} points): FG <strong>{ownFg.toFixed(3)}</strong>, against the recipe&apos;s{' '}
      {fg.toFixed(3)}.
    </p>
  );
}
