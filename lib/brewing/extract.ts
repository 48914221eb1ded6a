import { POINTS_L_PER_KG_PER_PPG } from './constants';
import type { FermentableKind } from './schema';

interface GristEntry {
  amountKg: number;
  potentialPpg: number;
  kind: FermentableKind;
}

/** Grain and adjuncts are mashed and yield at brewhouse efficiency; extracts and sugars dissolve whole. */
export function isMashed(kind: FermentableKind): boolean {
  return kind === 'grain' || kind === 'adjunct';
}

/** Gravity points (1.050 → 50) the grist gives in `volumeL`: Σ kg × ppg × 8.3454 × efficiency / L. */
export function gristGravityPoints(grist: readonly GristEntry[], volumeL: number, efficiencyPct: number): number {
  const efficiency = efficiencyPct / 100;
  let pointLitres = 0;
  for (const entry of grist) {
    const yieldShare = isMashed(entry.kind) ? efficiency : 1;
    pointLitres += entry.amountKg * entry.potentialPpg * POINTS_L_PER_KG_PER_PPG * yieldShare;
  }
  return pointLitres / volumeL;
}

/** Original gravity from the grist, volume into the fermenter and brewhouse efficiency. */
export function originalGravity(grist: readonly GristEntry[], volumeL: number, efficiencyPct: number): number {
  return 1 + gristGravityPoints(grist, volumeL, efficiencyPct) / 1000;
}
