import guidelines from './data/style-vitals-2021.json';

/**
 * Style guideline ranges: the vital statistics of the BJCP 2021 Beer Style
 * Guidelines (OG, FG, ABV, IBU, SRM), as printed. Styles whose guideline gives
 * no number for a statistic ("varies with base style") have null there.
 */
export const STYLE_GUIDELINES_EDITION = 'BJCP 2021 Beer Style Guidelines';
export const STYLE_GUIDELINES_SOURCE: string = guidelines.source;

const STYLE_VITALS = ['og', 'fg', 'abv', 'ibu', 'srm'] as const;
export type StyleVital = (typeof STYLE_VITALS)[number];

interface StyleRange {
  min: number;
  max: number;
}

export interface StyleGuideline {
  code: string;
  name: string;
  category: string;
  vitals: Record<StyleVital, StyleRange | null>;
}

export interface StyleCategory {
  name: string;
  styles: { code: string; name: string }[];
}

function toRange(printed: unknown): StyleRange | null {
  if (!Array.isArray(printed) || printed.length !== 2) return null;
  const [min, max] = printed;
  return typeof min === 'number' && typeof max === 'number' ? { min, max } : null;
}

function toGuideline(entry: (typeof guidelines.styles)[number]): StyleGuideline {
  const printed: Record<string, unknown> = entry.vitals;
  const vitals = Object.fromEntries(STYLE_VITALS.map((vital) => [vital, toRange(printed[vital])])) as Record<
    StyleVital,
    StyleRange | null
  >;
  return { code: entry.code, name: entry.name, category: entry.category, vitals };
}

const STYLES: readonly StyleGuideline[] = guidelines.styles.map(toGuideline);
const STYLES_BY_CODE = new Map(STYLES.map((style) => [normaliseCode(style.code), style]));

function normaliseCode(code: string): string {
  return code.trim().toUpperCase();
}

/** Every style, in guideline order. */
export function listStyles(): readonly StyleGuideline[] {
  return STYLES;
}

/** A style by its code (`21A`, case and surrounding spaces ignored), or undefined. */
export function findStyle(code: string): StyleGuideline | undefined {
  return STYLES_BY_CODE.get(normaliseCode(code));
}

/** Categories in guideline order, each with its styles. */
export function styleCategories(): StyleCategory[] {
  const categories = new Map<string, StyleCategory>();
  for (const style of STYLES) {
    const category = categories.get(style.category) ?? { name: style.category, styles: [] };
    category.styles.push({ code: style.code, name: style.name });
    categories.set(style.category, category);
  }
  return [...categories.values()];
}

type RangePosition = 'below' | 'within' | 'above';

export interface RangeFit extends StyleRange {
  value: number;
  position: RangePosition;
}

export interface StyleFit {
  code: string;
  name: string;
  og: RangeFit | null;
  fg: RangeFit | null;
  abv: RangeFit | null;
  ibu: RangeFit | null;
  srm: RangeFit | null;
}

/** Values are compared at the precision the guidelines print them: gravity 0.001, ABV and SRM 0.1, IBU 1. */
const COMPARISON_STEP: Record<StyleVital, number> = { og: 0.001, fg: 0.001, abv: 0.1, ibu: 1, srm: 0.1 };

function roundToStep(value: number, step: number): number {
  return Math.round(value / step) * step;
}

function fitRange(range: StyleRange | null, value: number, step: number): RangeFit | null {
  if (!range) return null;
  const compared = roundToStep(value, step);
  const tolerance = step / 1000;
  const position: RangePosition =
    compared < range.min - tolerance ? 'below' : compared > range.max + tolerance ? 'above' : 'within';
  return { min: range.min, max: range.max, value, position };
}

/** How a beer's numbers sit in a style's ranges; null for an unknown style code. */
export function fitStyle(code: string, values: Record<StyleVital, number>): StyleFit | null {
  const style = findStyle(code);
  if (!style) return null;
  return {
    code: style.code,
    name: style.name,
    og: fitRange(style.vitals.og, values.og, COMPARISON_STEP.og),
    fg: fitRange(style.vitals.fg, values.fg, COMPARISON_STEP.fg),
    abv: fitRange(style.vitals.abv, values.abv, COMPARISON_STEP.abv),
    ibu: fitRange(style.vitals.ibu, values.ibu, COMPARISON_STEP.ibu),
    srm: fitRange(style.vitals.srm, values.srm, COMPARISON_STEP.srm),
  };
}
