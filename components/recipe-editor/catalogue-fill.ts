import { CATALOGUE_FERMENTABLES, CATALOGUE_HOPS, CATALOGUE_YEAST_KINDS } from '@/lib/brewing/catalogue';
import type { Fermentable, Yeast } from '@/lib/brewing/schema';

/**
 * Typical values for a name picked from the starter catalogue. Any other name
 * is welcome too; it just fills nothing.
 */

function sameName(a: string, b: string): boolean {
  return a.trim().toLowerCase() === b.trim().toLowerCase();
}

function midpoint(min: number, max: number): number {
  return Math.round(((min + max) / 2) * 10) / 10;
}

export const FERMENTABLE_SUGGESTIONS = CATALOGUE_FERMENTABLES.map((entry) => entry.name);
export const HOP_SUGGESTIONS = CATALOGUE_HOPS.map((entry) => entry.name);
export const YEAST_SUGGESTIONS = CATALOGUE_YEAST_KINDS.map((entry) => entry.name);

export function fermentableFill(name: string): Pick<Fermentable, 'potentialPpg' | 'colorLovibond' | 'kind'> | null {
  const entry = CATALOGUE_FERMENTABLES.find((candidate) => sameName(candidate.name, name));
  return entry ? { potentialPpg: entry.potentialPpg, colorLovibond: entry.colorLovibond, kind: entry.kind } : null;
}

/** A hop's typical alpha acid: the middle of its usual range. */
export function hopFill(name: string): { alphaPct: number } | null {
  const entry = CATALOGUE_HOPS.find((candidate) => sameName(candidate.name, name));
  return entry ? { alphaPct: midpoint(entry.alphaPctMin, entry.alphaPctMax) } : null;
}

export function yeastFill(name: string): Pick<Yeast, 'kind' | 'attenuationPct' | 'tempMinC' | 'tempMaxC'> | null {
  const entry = CATALOGUE_YEAST_KINDS.find((candidate) => sameName(candidate.name, name));
  if (!entry) return null;
  return {
    kind: entry.kind,
    attenuationPct: midpoint(entry.attenuationPctMin, entry.attenuationPctMax),
    tempMinC: entry.tempMinC,
    tempMaxC: entry.tempMaxC,
  };
}
