import type { RecipeDocument } from '@/lib/brewing/schema';
import type { RecipeStats } from '@/lib/brewing/stats';
import type { UnitSystem } from '@/lib/brewing/units';
import type { AppliedChange } from './compare';
import { STAT_SPECS, type StatSpec } from './fields';

/**
 * Why the numbers moved between two versions. The engine is a black box here: for every stat that
 * changed, each change is made alone on a copy of the "before" document and the stats recomputed;
 * what the single changes do not add up to is reported as the changes acting together (a hotter
 * mash and a more attenuative yeast both move FG, and not quite additively).
 */

export type StatsOf = (doc: RecipeDocument) => RecipeStats;

export interface StatDelta {
  stat: string;
  label: string;
  before: number | null;
  after: number | null;
  delta: number | null;
  beforeText: string;
  afterText: string;
  deltaText: string;
  /** The change shows at the precision the number is shown with. */
  moved: boolean;
}

interface AttributionPart {
  /** The `id` of the change in the comparison's sections. */
  change: string;
  /** The change in words, e.g. "the yeast swap". */
  cause: string;
  delta: number;
  deltaText: string;
}

export interface StatAttribution {
  stat: string;
  label: string;
  before: number;
  after: number;
  delta: number;
  deltaText: string;
  /** Each change's own effect, largest first. */
  parts: AttributionPart[];
  /** What is left once the single effects are added up: the changes acting together. */
  together: { delta: number; deltaText: string } | null;
  /** E.g. "FG 1.013 → 1.016: +0.004 from the yeast swap, −0.001 from the 2 °C hotter mash". */
  sentence: string;
}

function statValue(stats: RecipeStats, key: string): number | null {
  let value: unknown;
  if (key === 'sulfateToChloride' || key === 'residualAlkalinity') value = stats.water?.[key];
  else if (key === 'kegPressureKPa') value = stats.carbonation?.kegPressureKPa;
  else value = (stats as unknown as Record<string, unknown>)[key];
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function statDelta(spec: StatSpec, a: RecipeStats, b: RecipeStats, units: UnitSystem): StatDelta {
  const before = statValue(a, spec.key);
  const after = statValue(b, spec.key);
  const delta = before !== null && after !== null ? after - before : null;
  return {
    stat: spec.key,
    label: spec.label,
    before,
    after,
    delta,
    beforeText: before === null ? '—' : spec.show(before, units),
    afterText: after === null ? '—' : spec.show(after, units),
    deltaText: delta === null ? '—' : spec.delta(delta, units),
    moved: delta === null ? before !== after : Math.abs(delta) >= spec.epsilon(units),
  };
}

/** Changes that cannot move a number (the title, the style) are not recomputed. */
const moveNumbers = (change: AppliedChange) =>
  !(change.item.id.startsWith('settings-') && (change.item.label === 'Title' || change.item.label === 'Style'));

export function attribute(
  a: RecipeDocument,
  b: RecipeDocument,
  changes: readonly AppliedChange[],
  computeStats: StatsOf,
  units: UnitSystem,
): { stats: StatDelta[]; attribution: StatAttribution[] } {
  const statsA = computeStats(a);
  const statsB = computeStats(b);
  const stats = STAT_SPECS.map((spec) => statDelta(spec, statsA, statsB, units)).filter(
    (row) => row.before !== null || row.after !== null,
  );
  const moved = stats.filter((row) => row.moved && row.delta !== null);
  if (!moved.length) return { stats, attribution: [] };
  const relevant = changes.filter(moveNumbers);
  // One recompute per change, shared by every stat that moved.
  const alone = relevant.map((change) => computeStats(change.apply(a)));
  const attribution = moved.map((row) => {
    const spec = STAT_SPECS.find((s) => s.key === row.stat)!;
    const before = row.before!;
    const total = row.delta!;
    const keep = spec.epsilon(units) / 5;
    const parts: AttributionPart[] = [];
    relevant.forEach((change, i) => {
      const value = statValue(alone[i], row.stat);
      if (value === null) return;
      const delta = value - before;
      if (Math.abs(delta) >= keep)
        parts.push({ change: change.item.id, cause: change.item.cause, delta, deltaText: spec.delta(delta, units) });
    });
    parts.sort((x, y) => Math.abs(y.delta) - Math.abs(x.delta));
    const rest = total - parts.reduce((n, p) => n + p.delta, 0);
    const together = Math.abs(rest) >= keep ? { delta: rest, deltaText: spec.delta(rest, units) } : null;
    return {
      stat: row.stat,
      label: row.label,
      before,
      after: row.after!,
      delta: total,
      deltaText: row.deltaText,
      parts,
      together,
      sentence: sentence(row, parts, together, spec, units),
    };
  });
  return { stats, attribution };
}

function sentence(
  row: StatDelta,
  parts: AttributionPart[],
  together: StatAttribution['together'],
  spec: StatSpec,
  units: UnitSystem,
): string {
  const shown = parts.filter((p) => Math.abs(p.delta) >= spec.epsilon(units));
  const hidden = parts.length - shown.length;
  const restDelta = (together?.delta ?? 0) + parts.slice(shown.length).reduce((n, p) => n + p.delta, 0);
  const bits = shown.map((p) => `${p.deltaText} from ${p.cause}`);
  if (Math.abs(restDelta) >= spec.epsilon(units))
    bits.push(
      `${spec.delta(restDelta, units)} from ${hidden ? 'smaller changes and the changes acting together' : 'the changes acting together'}`,
    );
  const head = `${row.label} ${row.beforeText} → ${row.afterText}`;
  return bits.length ? `${head}: ${bits.join(', ')}` : `${head}: ${row.deltaText} from several small changes`;
}

/** "IBU", "FG" stay as they are; "Colour (SRM)" reads "colour (SRM)" inside a sentence. */
const inSentence = (label: string) =>
  /^[A-Z]{2}/.test(label) ? label : label.charAt(0).toLowerCase() + label.slice(1);

/**
 * One number's change as a consequence of taking a set of changes, e.g. "Accepting this changes
 * IBU by +6: the new 10-minute Cascade addition" (`lead` is "Accepting this changes"). Causes are
 * the attribution's, largest first; what they do not add up to is the changes acting together.
 */
export function effectSentence(a: StatAttribution, lead: string, units: UnitSystem): string {
  const spec = STAT_SPECS.find((s) => s.key === a.stat)!;
  const shown = a.parts.filter((p) => Math.abs(p.delta) >= spec.epsilon(units));
  const rest = a.delta - shown.reduce((n, p) => n + p.delta, 0);
  const head = `${lead} ${inSentence(a.label)} by ${a.deltaText}`;
  if (shown.length === 1 && Math.abs(rest) < spec.epsilon(units)) return `${head}: ${shown[0].cause}`;
  const bits = shown.map((p) => `${p.deltaText} from ${p.cause}`);
  if (Math.abs(rest) >= spec.epsilon(units))
    bits.push(
      `${spec.delta(rest, units)} from ${shown.length ? 'the changes acting together' : 'several small changes'}`,
    );
  return `${head}: ${bits.join(', ')}`;
}
