import type { RecipeDocument } from './schema';

/** A fermentation step held outside the temperature range a yeast in the recipe is given. */
export interface YeastTemperatureFlag {
  stepIndex: number;
  tempC: number;
  yeastName: string;
  side: 'below' | 'above';
  /** The end of the yeast's range the step misses. */
  limitC: number;
}

/** A last step this cold, after others, is a cold crash or lagering, not fermentation (common practice). */
const COLD_CONDITIONING_MAX_C = 4;

/**
 * Fermentation steps below a yeast's lowest or above its highest temperature.
 * Only ranges the recipe states are checked; a yeast without one is not guessed at.
 * Below the range a yeast slows or stalls; above it, it makes more esters and
 * fusel alcohols (common practice; yeast makers state these ranges). A cold
 * last step is left alone below the range: the yeast's work is done by then.
 */
export function yeastTemperatureFlags(doc: Pick<RecipeDocument, 'yeasts' | 'fermentation'>): YeastTemperatureFlag[] {
  const flags: YeastTemperatureFlag[] = [];
  const steps = doc.fermentation.steps;
  steps.forEach((step, stepIndex) => {
    const coldConditioning = stepIndex > 0 && stepIndex === steps.length - 1 && step.tempC <= COLD_CONDITIONING_MAX_C;
    for (const yeast of doc.yeasts) {
      if (yeast.tempMinC !== undefined && step.tempC < yeast.tempMinC && !coldConditioning) {
        flags.push({ stepIndex, tempC: step.tempC, yeastName: yeast.name, side: 'below', limitC: yeast.tempMinC });
      } else if (yeast.tempMaxC !== undefined && step.tempC > yeast.tempMaxC) {
        flags.push({ stepIndex, tempC: step.tempC, yeastName: yeast.name, side: 'above', limitC: yeast.tempMaxC });
      }
    }
  });
  return flags;
}
