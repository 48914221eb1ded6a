import type { ScaleTarget } from './scale';

/** A member's brewhouse as settings hold it; losses left unset keep the recipe's. */
export interface BrewhouseSettings {
  batchVolumeL: number;
  efficiencyPct: number;
  boilOffLPerHour?: number | null;
  trubLossL?: number | null;
  grainAbsorptionLPerKg?: number | null;
  mashWaterLPerKg?: number | null;
}

/** What the member's logged brew days measured (as /api/me/brew-averages answers). */
export interface MeasuredEfficiency {
  meanPct: number;
  count: number;
}

/** Fewer brew days than this and one odd brew would set the efficiency (common practice: average several). */
const MEASURED_EFFICIENCY_MIN_BREWS = 2;
/** The recipe schema's bounds on efficiency: a measured mean outside them is not used. */
const EFFICIENCY_BOUNDS = { min: 10, max: 100 } as const;

export interface FitTarget {
  target: ScaleTarget;
  efficiencyFrom: 'measured' | 'settings';
  /** Brew days behind a measured efficiency. */
  measuredBrews?: number;
}

/**
 * The brewhouse a recipe is fitted to: the member's batch volume and losses
 * from settings, and their measured efficiency when at least two brew days
 * give one, else the efficiency they set.
 */
export function fitTargetFor(settings: BrewhouseSettings, measured: MeasuredEfficiency | null): FitTarget {
  const useMeasured =
    measured !== null &&
    measured.count >= MEASURED_EFFICIENCY_MIN_BREWS &&
    measured.meanPct >= EFFICIENCY_BOUNDS.min &&
    measured.meanPct <= EFFICIENCY_BOUNDS.max;
  const target: ScaleTarget = {
    volumeL: settings.batchVolumeL,
    efficiencyPct: useMeasured ? Math.round(measured.meanPct * 10) / 10 : settings.efficiencyPct,
  };
  if (settings.boilOffLPerHour != null) target.boilOffLPerHour = settings.boilOffLPerHour;
  if (settings.trubLossL != null) target.trubLossL = settings.trubLossL;
  if (settings.grainAbsorptionLPerKg != null) target.grainAbsorptionLPerKg = settings.grainAbsorptionLPerKg;
  if (settings.mashWaterLPerKg != null) target.mashWaterLPerKg = settings.mashWaterLPerKg;
  return useMeasured
    ? { target, efficiencyFrom: 'measured', measuredBrews: measured.count }
    : { target, efficiencyFrom: 'settings' };
}
