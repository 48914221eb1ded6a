import type { UnitSystem } from '@/lib/brewing/units';
import { changeLines, type DocumentComparison } from './compare';
import { STAT_SPECS } from './fields';

/**
 * One line per version of a recipe's history, saying what moved against the version before it:
 * "Mashed 1 °C cooler → FG −0.001; Yeast: Clean ale yeast → Kveik → FG −0.004, ABV +0.5%". Built
 * from the comparison's attribution, so each number is credited to the change that moved it.
 */

/** Changes named on one line; the rest are counted. */
const MAX_SEGMENTS = 4;

/** The numbers a history line names first; colour in the scale the member's units go with. */
const headline = (units: UnitSystem) => ['og', 'fg', 'abv', 'ibu', units === 'us' ? 'srm' : 'ebc'];
/** Other numbers a change moved, named when it moved none of the headline ones. */
const MAX_OTHER = 2;

const epsilonOf = (stat: string, units: UnitSystem) => STAT_SPECS.find((s) => s.key === stat)!.epsilon(units);

export function historyLine(
  comparison: Pick<DocumentComparison, 'sections' | 'attribution' | 'units' | 'identical'>,
): string {
  const { attribution, units } = comparison;
  const items = changeLines(comparison);
  if (!items.length) return comparison.identical ? 'Nothing changed' : 'Only the notes changed; no number changed';
  const segments = items.map((item) => {
    const all = attribution.flatMap((a) => {
      const part = a.parts.find((p) => p.change === item.id);
      return part && Math.abs(part.delta) >= epsilonOf(a.stat, units)
        ? [{ stat: a.stat, text: `${a.label} ${part.deltaText}` }]
        : [];
    });
    const main = all.filter((m) => headline(units).includes(m.stat));
    const moves = (main.length ? main : all.slice(0, MAX_OTHER)).map((m) => m.text);
    // A swap already reads "A → B"; its numbers follow a dash so the arrow is not read as a second swap.
    const lead = item.short.includes('→') ? ' — ' : ' → ';
    return { text: moves.length ? `${item.short}${lead}${moves.join(', ')}` : item.short, moves: moves.length };
  });
  // What the named changes do not account for: the changes acting together, or many small ones.
  const rest = attribution
    .filter((a) => headline(units).includes(a.stat))
    .flatMap((a) => {
      const shown = a.parts
        .filter((p) => Math.abs(p.delta) >= epsilonOf(a.stat, units))
        .reduce((n, p) => n + p.delta, 0);
      const left = a.delta - shown;
      if (Math.abs(left) < epsilonOf(a.stat, units)) return [];
      return [`${a.label} ${STAT_SPECS.find((s) => s.key === a.stat)!.delta(left, units)}`];
    });
  // Changes that moved a number come first; the order within each group is the recipe's.
  const ordered = [...segments.filter((s) => s.moves), ...segments.filter((s) => !s.moves)];
  const named = ordered.slice(0, MAX_SEGMENTS).map((s) => s.text);
  const more = ordered.length - named.length;
  if (more) named.push(`${more} more ${more === 1 ? 'change' : 'changes'}`);
  if (rest.length) named.push(`the changes together → ${rest.join(', ')}`);
  if (!attribution.length) named.push('no number changed');
  return named.join('; ');
}
