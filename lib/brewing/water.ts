import { ION_NAMES, SALT_NAMES, type IonName, type SaltAddition, type SaltName, type WaterProfile } from './schema';

/**
 * Brewing water: ions added by salts, residual alkalinity, and a salt plan
 * that moves a source water towards a target profile.
 */

/** Standard atomic weights, IUPAC (abridged conventional values, 2021). */
const ATOMIC_WEIGHT = { H: 1.008, C: 12.011, O: 15.999, Na: 22.98976928, Mg: 24.305, S: 32.06, Cl: 35.45, Ca: 40.078 };
const WATER = 2 * ATOMIC_WEIGHT.H + ATOMIC_WEIGHT.O;
const SULFATE = ATOMIC_WEIGHT.S + 4 * ATOMIC_WEIGHT.O;
const BICARBONATE = ATOMIC_WEIGHT.H + ATOMIC_WEIGHT.C + 3 * ATOMIC_WEIGHT.O;

/** Molar mass (g/mol) of each salt as sold for brewing; calcium chloride as the dihydrate. */
const SALT_MOLAR_MASS: Record<SaltName, number> = {
  gypsum: ATOMIC_WEIGHT.Ca + SULFATE + 2 * WATER,
  epsom: ATOMIC_WEIGHT.Mg + SULFATE + 7 * WATER,
  table_salt: ATOMIC_WEIGHT.Na + ATOMIC_WEIGHT.Cl,
  calcium_chloride: ATOMIC_WEIGHT.Ca + 2 * ATOMIC_WEIGHT.Cl + 2 * WATER,
  baking_soda: ATOMIC_WEIGHT.Na + BICARBONATE,
};

const SALT_ION_MOLAR_MASS: Record<SaltName, Partial<Record<IonName, number>>> = {
  gypsum: { calcium: ATOMIC_WEIGHT.Ca, sulfate: SULFATE },
  epsom: { magnesium: ATOMIC_WEIGHT.Mg, sulfate: SULFATE },
  table_salt: { sodium: ATOMIC_WEIGHT.Na, chloride: ATOMIC_WEIGHT.Cl },
  calcium_chloride: { calcium: ATOMIC_WEIGHT.Ca, chloride: 2 * ATOMIC_WEIGHT.Cl },
  baking_soda: { sodium: ATOMIC_WEIGHT.Na, bicarbonate: BICARBONATE },
};

/** mg of each ion per gram of salt, i.e. mg/L added by 1 g of salt in 1 L of water. */
export const SALT_ION_MG_PER_G: Record<SaltName, Record<IonName, number>> = Object.fromEntries(
  SALT_NAMES.map((salt) => [
    salt,
    Object.fromEntries(
      ION_NAMES.map((ion) => [ion, ((SALT_ION_MOLAR_MASS[salt][ion] ?? 0) / SALT_MOLAR_MASS[salt]) * 1000]),
    ),
  ]),
) as Record<SaltName, Record<IonName, number>>;

/** Ion profile (mg/L) after dissolving the salts in `volumeL` of the source water. */
export function waterAfterSalts(source: WaterProfile, salts: readonly SaltAddition[], volumeL: number): WaterProfile {
  const result: WaterProfile = { ...source };
  for (const addition of salts) {
    const ionMgPerG = SALT_ION_MG_PER_G[addition.salt];
    for (const ion of ION_NAMES) result[ion] += (ionMgPerG[ion] * addition.grams) / volumeL;
  }
  return result;
}

/** Alkalinity as CaCO3 from bicarbonate: × 50.04 / 61.02 (equivalent weights). */
function bicarbonateToAlkalinity(bicarbonateMgPerL: number): number {
  return bicarbonateMgPerL * (50.04 / 61.02);
}

/**
 * Residual alkalinity (mg/L as CaCO3) after Kolbach, as given by Palmer (How
 * to Brew): RA = alkalinity − (Ca / 1.4 + Mg / 1.7), with Ca and Mg in mg/L.
 */
export function residualAlkalinity(profile: WaterProfile): number {
  return bicarbonateToAlkalinity(profile.bicarbonate) - (profile.calcium / 1.4 + profile.magnesium / 1.7);
}

/**
 * Sulfate-to-chloride ratio. Chloride below 1 mg/L counts as 1 mg/L so the
 * ratio stays finite; such water reads as strongly bitter-leaning anyway.
 */
export function sulfateToChlorideRatio(profile: WaterProfile): number {
  return profile.sulfate / Math.max(profile.chloride, 1);
}

/** Reading of the sulfate-to-chloride ratio (common practice). */
export const SULFATE_CHLORIDE_READING = { maltyBelow: 0.8, bitterAbove: 2 } as const;

/** Mash pH usually aimed for in a pale beer, measured at room temperature (common practice). */
export const MASH_PH_TARGET = { min: 5.2, max: 5.6 } as const;

export interface SaltPlan {
  /** Salts worth adding, in grams (0.01 g steps); salts not needed are left out. */
  salts: SaltAddition[];
  /** The profile those salts give. */
  water: WaterProfile;
  /** Root-mean-square distance (mg/L) of the six ions from the target. */
  rmsErrorMgPerL: number;
  /** Ions the plan leaves off target by more than PLAN_TOLERANCE; `fromSource` when the source alone is already above. */
  misses: { ion: IonName; offMgPerL: number; fromSource: boolean }[];
}

/** An ion counts as reached within 5 mg/L or 5 % of its target, whichever is larger (common practice for a salt plan). */
const PLAN_TOLERANCE = { mgPerL: 5, share: 0.05 } as const;

/** Whether an ion is off its target by more than a salt plan allows. */
export function ionOffTarget(valueMgPerL: number, targetMgPerL: number): boolean {
  return Math.abs(valueMgPerL - targetMgPerL) > Math.max(PLAN_TOLERANCE.mgPerL, PLAN_TOLERANCE.share * targetMgPerL);
}

/** The last plan and what it was for: 6 source ions, 6 target ions, the volume. */
const lastPlanInput = new Float64Array(13).fill(Number.NaN);
let lastPlan: SaltPlan | null = null;

function sameAsLastPlan(source: WaterProfile, target: WaterProfile, volumeL: number): boolean {
  if (lastPlanInput[12] !== volumeL) return false;
  for (let i = 0; i < ION_NAMES.length; i++) {
    if (lastPlanInput[i] !== source[ION_NAMES[i]] || lastPlanInput[6 + i] !== target[ION_NAMES[i]]) return false;
  }
  return true;
}

/**
 * Proposes salt additions (never negative) for `volumeL` of `source` water
 * that bring the six ions as close to `target` as least squares allows.
 * Salts only add ions, so an ion already above target stays above it.
 * With five salts there are 31 possible sets of salts in use; the best
 * non-negative answer is the unconstrained least-squares answer on one of
 * them, so trying each set and keeping the best feasible one is exact.
 */
export function planWaterSalts(source: WaterProfile, target: WaterProfile, volumeL: number): SaltPlan {
  // The last plan is kept: the live panel recomputes on every keystroke and the water rarely
  // changes between them. Callers must not change the plan they are given.
  if (lastPlan && sameAsLastPlan(source, target, volumeL)) return lastPlan;
  const plan = solvePlan(source, target, volumeL);
  ION_NAMES.forEach((ion, i) => {
    lastPlanInput[i] = source[ion];
    lastPlanInput[6 + i] = target[ion];
  });
  lastPlanInput[12] = volumeL;
  lastPlan = plan;
  return plan;
}

function solvePlan(source: WaterProfile, target: WaterProfile, volumeL: number): SaltPlan {
  const gramsPerL = solveGramsPerL(source, target);
  const salts = SALT_NAMES.map((salt, j) => ({
    salt,
    grams: Math.round(gramsPerL[j] * volumeL * 100) / 100,
  })).filter((addition) => addition.grams > 0);
  const water = waterAfterSalts(source, salts, volumeL);
  const rmsErrorMgPerL = Math.sqrt(sumOfSquares(ION_NAMES.map((ion) => water[ion] - target[ion])) / ION_NAMES.length);
  const misses: SaltPlan['misses'] = [];
  for (const ion of ION_NAMES) {
    if (ionOffTarget(water[ion], target[ion])) {
      misses.push({ ion, offMgPerL: water[ion] - target[ion], fromSource: source[ion] > target[ion] });
    }
  }
  return { salts, water, rmsErrorMgPerL, misses };
}

/** Grams of each salt per litre (SALT_NAMES order) by exact non-negative least squares over the 31 salt sets. */
function solveGramsPerL(source: WaterProfile, target: WaterProfile): number[] {
  const shortfall = ION_NAMES.map((ion) => target[ion] - source[ion]);
  const columns = SALT_NAMES.map((salt) => ION_NAMES.map((ion) => SALT_ION_MG_PER_G[salt][ion]));
  let bestGrams: number[] = SALT_NAMES.map(() => 0);
  let bestError = sumOfSquares(shortfall);
  for (let mask = 1; mask < 1 << SALT_NAMES.length; mask++) {
    const chosen = SALT_NAMES.map((_, j) => j).filter((j) => (mask >> j) & 1);
    const solution = leastSquares(
      chosen.map((j) => columns[j]),
      shortfall,
    );
    if (!solution || solution.some((grams) => grams < 0)) continue;
    const grams = SALT_NAMES.map(() => 0);
    chosen.forEach((j, k) => (grams[j] = solution[k]));
    const error = sumOfSquares(residual(columns, grams, shortfall));
    if (error < bestError - 1e-9) {
      bestError = error;
      bestGrams = grams;
    }
  }
  return bestGrams;
}

function sumOfSquares(values: readonly number[]): number {
  let total = 0;
  for (const value of values) total += value * value;
  return total;
}

function residual(columns: readonly number[][], weights: readonly number[], wanted: readonly number[]): number[] {
  return wanted.map((value, i) => columns.reduce((sum, column, j) => sum + column[i] * weights[j], 0) - value);
}

/** Least squares by the normal equations (a few columns only); null when the columns are dependent. */
function leastSquares(columns: readonly number[][], wanted: readonly number[]): number[] | null {
  const normal = columns.map((a) => columns.map((b) => dot(a, b)));
  const rhs = columns.map((a) => dot(a, wanted));
  return solveLinear(normal, rhs);
}

function dot(a: readonly number[], b: readonly number[]): number {
  let total = 0;
  for (let i = 0; i < a.length; i++) total += a[i] * b[i];
  return total;
}

/** Gaussian elimination with partial pivoting; null for a singular system. */
function solveLinear(matrix: number[][], rhs: number[]): number[] | null {
  const n = rhs.length;
  const rows = matrix.map((row, i) => [...row, rhs[i]]);
  const scale = Math.max(...matrix.map((row) => Math.max(...row.map(Math.abs))));
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(rows[r][col]) > Math.abs(rows[pivot][col])) pivot = r;
    if (!(Math.abs(rows[pivot][col]) > 1e-12 * scale)) return null;
    [rows[col], rows[pivot]] = [rows[pivot], rows[col]];
    for (let r = col + 1; r < n; r++) {
      const factor = rows[r][col] / rows[col][col];
      for (let c = col; c <= n; c++) rows[r][c] -= factor * rows[col][c];
    }
  }
  const solution = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let sum = rows[r][n];
    for (let c = r + 1; c < n; c++) sum -= rows[r][c] * solution[c];
    solution[r] = sum / rows[r][r];
  }
  return solution;
}
