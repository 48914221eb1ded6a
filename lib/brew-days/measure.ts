import {
  apparentAttenuationPct,
  brixToGravity,
  correctHydrometerReading,
  DEFAULT_WORT_CORRECTION_FACTOR,
  fermentingGravityFromBrix,
  mainSaccharificationTempC,
  measuredBeer,
  measuredEfficiencyPct,
  postBoilVolumeL,
  preBoilGravity,
  preBoilVolumeL,
  sgToPlato,
  type RecipeDocument,
  type RecipeStats,
} from '@/lib/brewing';
import { GRAVITY_MAX, GRAVITY_MIN, GRAVITY_RANGE_MESSAGE, TYPICAL_KEG_RATING_KPA } from './schemas';

// Pure: turns what a brewer typed into gravities, and lays measured numbers beside predicted ones.

export interface GravityEntry {
  method: 'hydrometer' | 'refractometer';
  value: number;
  sampleTempC?: number | null;
}

/** The °Brix a refractometer would have shown for the original wort (the Terrill correction needs it). */
export function originalBrix(og: GravityEntry | null | undefined, ogGravity: number | null): number | null {
  if (og?.method === 'refractometer') return og.value;
  if (ogGravity === null) return null;
  return sgToPlato(ogGravity) * DEFAULT_WORT_CORRECTION_FACTOR;
}

export type GravityResult = { gravity: number } | { error: string };

/**
 * SG from an entry: a hydrometer reading corrected for its sample temperature, a refractometer
 * reading converted from °Brix, with the after-fermentation correction when alcohol is present
 * (any reading after the OG).
 */
export function gravityFromEntry(
  entry: GravityEntry,
  opts: { afterOg: boolean; ogBrix: number | null },
): GravityResult {
  let gravity: number;
  if (entry.method === 'hydrometer') {
    gravity = entry.sampleTempC == null ? entry.value : correctHydrometerReading(entry.value, entry.sampleTempC);
  } else if (opts.afterOg) {
    if (opts.ogBrix === null)
      return { error: 'A refractometer reading of fermenting beer needs the original gravity: record the OG first' };
    gravity = fermentingGravityFromBrix(opts.ogBrix, entry.value);
  } else {
    gravity = brixToGravity(entry.value);
  }
  if (!Number.isFinite(gravity) || gravity < GRAVITY_MIN || gravity > GRAVITY_MAX) {
    return {
      error: `The corrected reading (${Number.isFinite(gravity) ? gravity.toFixed(3) : 'not a number'}) ${GRAVITY_RANGE_MESSAGE}`,
    };
  }
  return { gravity };
}

export interface Comparison {
  key: string;
  label: string;
  quantity: 'temperature' | 'volume' | 'gravity' | 'percent' | 'ph' | 'pressure';
  measured: number | null;
  predicted: number | null;
  difference: number | null;
}

export interface BrewDayMeasures {
  preBoilGravity: number | null;
  og: number | null;
  fg: number | null;
  preBoilVolumeL: number | null;
  postBoilVolumeL: number | null;
  fermenterVolumeL: number | null;
  strikeTempC: number | null;
  mashTempC: number | null;
  mashPh: number | null;
  pitchTempC: number | null;
  kegPressureKPa: number | null;
}

export interface Outcome {
  comparisons: Comparison[];
  efficiencyPct: number | null;
  attenuationPct: number | null;
  abv: number | null;
  kegPressureAboveTypicalRating: boolean;
}

function row(
  key: string,
  label: string,
  quantity: Comparison['quantity'],
  measured: number | null,
  predicted: number | null,
): Comparison {
  return {
    key,
    label,
    quantity,
    measured,
    predicted,
    difference: measured !== null && predicted !== null ? measured - predicted : null,
  };
}

/** Volume into the fermenter for the efficiency figure: as measured, else the recipe's batch volume. */
export function fermenterVolume(day: Pick<BrewDayMeasures, 'fermenterVolumeL'>, doc: RecipeDocument): number {
  return day.fermenterVolumeL ?? doc.batch.volumeL;
}

/** Each measured number beside the version's prediction, and what the measurements say about the beer. */
export function compareWithPrediction(day: BrewDayMeasures, doc: RecipeDocument, stats: RecipeStats): Outcome {
  const firstFermentTempC = doc.fermentation?.steps?.[0]?.tempC ?? null;
  const efficiencyPct =
    day.og !== null ? measuredEfficiencyPct(doc.fermentables, day.og, fermenterVolume(day, doc)) : null;
  const beer = day.og !== null && day.fg !== null ? measuredBeer(day.og, day.fg) : null;
  const predictedKeg = stats.carbonation?.kegPressureKPa ?? null;
  // Versions saved before the engine predicted mash pH carry no mash numbers.
  const predictedPh = (stats.mash as RecipeStats['mash'] | undefined)?.predictedPh ?? null;
  return {
    comparisons: [
      row('mashTempC', 'Mash temperature', 'temperature', day.mashTempC, mainSaccharificationTempC(doc.mash.steps)),
      row('mashPh', 'Mash pH', 'ph', day.mashPh, predictedPh),
      row('preBoilVolumeL', 'Pre-boil volume', 'volume', day.preBoilVolumeL, preBoilVolumeL(doc.batch)),
      row('preBoilGravity', 'Pre-boil gravity', 'gravity', day.preBoilGravity, preBoilGravity(stats.og, doc.batch)),
      row('postBoilVolumeL', 'Post-boil volume', 'volume', day.postBoilVolumeL, postBoilVolumeL(doc.batch)),
      row('fermenterVolumeL', 'Into the fermenter', 'volume', day.fermenterVolumeL, doc.batch.volumeL),
      row('og', 'Original gravity', 'gravity', day.og, stats.og),
      row('pitchTempC', 'Pitching temperature', 'temperature', day.pitchTempC, firstFermentTempC),
      row('fg', 'Final gravity', 'gravity', day.fg, stats.fg),
      row('efficiencyPct', 'Brewhouse efficiency', 'percent', efficiencyPct, doc.batch.efficiencyPct),
      row(
        'attenuationPct',
        'Apparent attenuation',
        'percent',
        beer ? beer.apparentAttenuationPct : null,
        stats.attenuationPct,
      ),
      row('abv', 'ABV', 'percent', beer ? beer.abv : null, stats.abv),
      row('kegPressureKPa', 'Keg pressure', 'pressure', day.kegPressureKPa, predictedKeg),
    ],
    efficiencyPct,
    attenuationPct: day.og !== null && day.fg !== null ? apparentAttenuationPct(day.og, day.fg) : null,
    abv: beer ? beer.abv : null,
    kegPressureAboveTypicalRating: day.kegPressureKPa !== null && day.kegPressureKPa > TYPICAL_KEG_RATING_KPA,
  };
}

/** The yeast kind that sets how far the beer ferments (the most attenuative, as the engine takes it). */
export function leadingYeastKind(doc: RecipeDocument): string {
  let best = doc.yeasts[0];
  for (const yeast of doc.yeasts) if (yeast.attenuationPct > best.attenuationPct) best = yeast;
  return best?.kind ?? 'unknown';
}
