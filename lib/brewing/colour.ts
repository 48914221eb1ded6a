import { POINTS_L_PER_KG_PER_PPG, clamp } from './constants';

/**
 * Beer colour from the grist. MCU (malt colour units) = Σ(lb × °L) / US gal;
 * in metric, 8.3454 × Σ(kg × °L) / L (the same lb/gal ratio as ppg).
 */
export function maltColourUnits(
  grist: readonly { amountKg: number; colorLovibond: number }[],
  volumeL: number,
): number {
  let kgLovibond = 0;
  for (const fermentable of grist) kgLovibond += fermentable.amountKg * fermentable.colorLovibond;
  return (POINTS_L_PER_KG_PER_PPG * kgLovibond) / volumeL;
}

/** SRM from MCU: Dan Morey, "Approximating Beer Color", Brewing Techniques; fits below about 50 SRM. */
export function moreySrm(mcu: number): number {
  return 1.4922 * Math.pow(Math.max(mcu, 0), 0.6859);
}

/** SRM from MCU: Ray Daniels, Designing Great Beers (1996); meant for darker beers (MCU above about 11). */
export function danielsSrm(mcu: number): number {
  return 0.2 * mcu + 8.4;
}

/** EBC from SRM: both scales read absorbance at 430 nm (SRM = 12.7 D A430, EBC = 25 D A430). */
export function srmToEbc(srm: number): number {
  return 1.97 * srm;
}

export function ebcToSrm(ebc: number): number {
  return ebc / 1.97;
}

/** Lovibond → SRM, the common conversion for malt colour (SRM = 1.3546 °L − 0.76). */
export function lovibondToSrm(lovibond: number): number {
  return 1.3546 * lovibond - 0.76;
}

export function srmToLovibond(srm: number): number {
  return (srm + 0.76) / 1.3546;
}

/**
 * Anchor colours for the on-screen swatch, chosen by eye for Kettlefork (our
 * own fit): pale straw at 1–2 SRM, gold near 6, amber 10–13, brown 17–20,
 * near black above 30. No standards body defines a screen colour for SRM, so
 * this is an approximation for display only.
 */
const SWATCH_ANCHORS: readonly (readonly [srm: number, red: number, green: number, blue: number])[] = [
  [1, 250, 243, 170],
  [2, 247, 230, 130],
  [4, 240, 200, 80],
  [6, 226, 168, 45],
  [9, 205, 130, 32],
  [12, 180, 98, 26],
  [15, 152, 74, 22],
  [18, 122, 54, 18],
  [22, 92, 38, 14],
  [26, 66, 27, 11],
  [30, 44, 19, 10],
  [40, 22, 11, 7],
];

function hexByte(value: number): string {
  return Math.round(clamp(value, 0, 255))
    .toString(16)
    .padStart(2, '0');
}

/** Approximate sRGB swatch (`#rrggbb`) for a colour in SRM, interpolated between SWATCH_ANCHORS. */
export function srmToHex(srm: number): string {
  const value = Number.isFinite(srm) ? srm : 0;
  let lower = SWATCH_ANCHORS[0];
  let upper = SWATCH_ANCHORS[SWATCH_ANCHORS.length - 1];
  if (value <= lower[0]) upper = lower;
  else if (value >= upper[0]) lower = upper;
  else {
    const index = SWATCH_ANCHORS.findIndex((anchor) => anchor[0] >= value);
    lower = SWATCH_ANCHORS[index - 1];
    upper = SWATCH_ANCHORS[index];
  }
  const share = upper[0] === lower[0] ? 0 : (value - lower[0]) / (upper[0] - lower[0]);
  const channel = (i: 1 | 2 | 3) => lower[i] + (upper[i] - lower[i]) * share;
  return `#${hexByte(channel(1))}${hexByte(channel(2))}${hexByte(channel(3))}`;
}
