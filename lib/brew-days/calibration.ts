import 'server-only';
import { desc, eq } from 'drizzle-orm';
import { db } from '@/db';
import { brewDays, recipeVersions, recipes, users } from '@/db/schema';
import { apparentAttenuationPct, measuredEfficiencyPct, type RecipeDocument, type RecipeStats } from '@/lib/brewing';
import { canView } from '@/lib/recipes/access';
import { fermenterVolume, leadingYeastKind } from './measure';

/**
 * A brewer's brewhouse as their brew days measured it: efficiency, and apparent attenuation per
 * yeast kind. Recent brews count for more (a brewhouse changes: a new mill, a new kettle): the
 * newest brew weighs 1, the one before RECENCY_DECAY, then RECENCY_DECAY², and so on. The factor is
 * our own choice, not a published one. Fewer than two brews say nothing about a brewhouse, so a
 * figure needs at least two.
 */
export const RECENCY_DECAY = 0.8;
const MIN_BREWS = 2;

/** One brew day as the calibration reads it; `brewedOn` orders them, newest counting most. */
export interface CalibrationBrew {
  brewDayId: string;
  brewedOn: string;
  recipeTitle: string;
  yeastKind: string;
  predictedOg: number;
  measuredOg: number | null;
  predictedFg: number;
  measuredFg: number | null;
  predictedEfficiencyPct: number;
  measuredEfficiencyPct: number | null;
  measuredAttenuationPct: number | null;
}

/** A figure over several brews: recency-weighted mean, how many brews and how far they spread. */
export interface WeightedFigure {
  weightedMeanPct: number;
  count: number;
  /** Recency-weighted standard deviation, in percentage points. */
  spreadPct: number;
  minPct: number;
  maxPct: number;
}

/** The plain means kept for readers of the earlier answer, beside the weighted calibration. */
interface BrewerAverages {
  brewDayCount: number;
  efficiency: { meanPct: number; count: number } | null;
  attenuationByYeastKind: { yeastKind: string; meanPct: number; count: number }[];
}

export interface BrewhouseCalibration extends BrewerAverages {
  calibration: {
    efficiency: WeightedFigure | null;
    attenuationByYeastKind: (WeightedFigure & { yeastKind: string })[];
    recencyDecay: number;
    minBrews: number;
  };
  /** Predicted beside measured for every brew with a measured OG, oldest first (for the chart). */
  history: CalibrationBrew[];
}

const mean = (values: number[]) => values.reduce((a, b) => a + b, 0) / values.length;

/** Values given newest first; null when fewer than two. */
export function weightedFigure(newestFirst: number[]): WeightedFigure | null {
  if (newestFirst.length < MIN_BREWS) return null;
  const weights = newestFirst.map((_, rank) => RECENCY_DECAY ** rank);
  const total = weights.reduce((a, b) => a + b, 0);
  const m = newestFirst.reduce((sum, v, i) => sum + v * weights[i], 0) / total;
  const variance = newestFirst.reduce((sum, v, i) => sum + weights[i] * (v - m) ** 2, 0) / total;
  return {
    weightedMeanPct: m,
    count: newestFirst.length,
    spreadPct: Math.sqrt(variance),
    minPct: Math.min(...newestFirst),
    maxPct: Math.max(...newestFirst),
  };
}

/** Everything the calibration says, from a brewer's brews in any order. */
export function calibrate(brews: CalibrationBrew[]): BrewhouseCalibration {
  const newestFirst = [...brews].sort((a, b) => (a.brewedOn < b.brewedOn ? 1 : a.brewedOn > b.brewedOn ? -1 : 0));
  const efficiencies = newestFirst.flatMap((b) =>
    b.measuredEfficiencyPct !== null && b.measuredEfficiencyPct > 0 ? [b.measuredEfficiencyPct] : [],
  );
  const attenuation = new Map<string, number[]>();
  for (const b of newestFirst) {
    if (b.measuredAttenuationPct === null) continue;
    attenuation.set(b.yeastKind, [...(attenuation.get(b.yeastKind) ?? []), b.measuredAttenuationPct]);
  }
  const kinds = [...attenuation].sort((a, b) => b[1].length - a[1].length);
  return {
    brewDayCount: brews.length,
    efficiency: efficiencies.length ? { meanPct: mean(efficiencies), count: efficiencies.length } : null,
    attenuationByYeastKind: kinds.map(([yeastKind, values]) => ({
      yeastKind,
      meanPct: mean(values),
      count: values.length,
    })),
    calibration: {
      efficiency: weightedFigure(efficiencies),
      attenuationByYeastKind: kinds.flatMap(([yeastKind, values]) => {
        const figure = weightedFigure(values);
        return figure ? [{ yeastKind, ...figure }] : [];
      }),
      recencyDecay: RECENCY_DECAY,
      minBrews: MIN_BREWS,
    },
    history: newestFirst.filter((b) => b.measuredOg !== null).reverse(),
  };
}

/**
 * A brewer's calibration from their own brew days. Only brew days of recipes the brewer can still
 * see count (a recipe hidden by moderators drops out, as it does from their lists).
 */
export async function getBrewhouseCalibrationByUserId({ userId }: { userId: string }): Promise<BrewhouseCalibration> {
  const rows = await db
    .select({
      day: brewDays,
      recipe: recipes,
      document: recipeVersions.document,
      stats: recipeVersions.stats,
      role: users.role,
    })
    .from(brewDays)
    .innerJoin(recipes, eq(recipes.id, brewDays.recipeId))
    .innerJoin(recipeVersions, eq(recipeVersions.id, brewDays.versionId))
    .innerJoin(users, eq(users.id, brewDays.brewerId))
    .where(eq(brewDays.brewerId, userId))
    .orderBy(desc(brewDays.brewedOn), desc(brewDays.createdAt));
  const brews = rows
    .filter((r) => canView(r.recipe, { id: userId, role: r.role }))
    .map(({ day, document, stats }): CalibrationBrew => {
      const doc = document as RecipeDocument;
      const predicted = stats as RecipeStats;
      return {
        brewDayId: day.id,
        brewedOn: day.brewedOn,
        recipeTitle: doc.title,
        yeastKind: leadingYeastKind(doc),
        predictedOg: predicted.og,
        measuredOg: day.og,
        predictedFg: predicted.fg,
        measuredFg: day.fg,
        predictedEfficiencyPct: doc.batch.efficiencyPct,
        measuredEfficiencyPct:
          day.og === null ? null : measuredEfficiencyPct(doc.fermentables, day.og, fermenterVolume(day, doc)),
        measuredAttenuationPct: day.og !== null && day.fg !== null ? apparentAttenuationPct(day.og, day.fg) : null,
      };
    });
  return calibrate(brews);
}
