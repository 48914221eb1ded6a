import { preBoilVolumeL } from '@/lib/brewing/brewday';
import { findStyle } from '@/lib/brewing/styles';
import type { FermentableKind, HopUse, RecipeDocument, YeastKind } from '@/lib/brewing/schema';
import { ION_NAMES } from '@/lib/brewing/schema';
import { SALT_FILE_NAMES, mashedKg, recipeType, splitStyleCode, unnamedStep, type BrewMethod } from '../shared';
import { decimalText, lovibondToSrmClamped, ppgToYieldPct } from '../units';
import { escapeXml } from '../xml-reader';

/**
 * Writing BeerXML 1.0 (Smith, Avis, Taylor, Perron and Johnson, "BeerXML: An XML Standard for Beer
 * Brewing Data", version 1.0, 2004). Every record carries the fields the specification marks
 * required, in its units: kg, L, minutes, °C, percent (days for fermentation ages; °L for malt
 * colour, SRM for liquid extract).
 */

interface Tag {
  tag: string;
  value?: string | number | boolean;
  children?: Tag[];
}

const t = (tag: string, value: string | number | boolean): Tag => ({ tag, value });
const group = (tag: string, children: Tag[]): Tag => ({ tag, children });

function render(node: Tag, depth: number): string {
  const pad = ' '.repeat(depth);
  if (node.children) {
    if (node.children.length === 0) return `${pad}<${node.tag}></${node.tag}>`;
    return `${pad}<${node.tag}>\n${node.children.map((c) => render(c, depth + 1)).join('\n')}\n${pad}</${node.tag}>`;
  }
  const value =
    typeof node.value === 'boolean'
      ? node.value
        ? 'TRUE'
        : 'FALSE'
      : typeof node.value === 'number'
        ? decimalText(node.value)
        : escapeXml(node.value ?? '');
  return `${pad}<${node.tag}>${value}</${node.tag}>`;
}

const RECIPE_TYPE_WORDS: Record<BrewMethod, string> = {
  'all grain': 'All Grain',
  'partial mash': 'Partial Mash',
  extract: 'Extract',
};
const HOP_USE_WORDS: Record<HopUse, string> = {
  boil: 'Boil',
  dry_hop: 'Dry Hop',
  mash: 'Mash',
  first_wort: 'First Wort',
  whirlpool: 'Aroma',
};
const FERMENTABLE_WORDS: Record<FermentableKind, string> = {
  grain: 'Grain',
  sugar: 'Sugar',
  extract: 'Extract',
  adjunct: 'Adjunct',
};
// BeerXML 1.0 has no kveik or wild type: they go out as Ale, with what they are best for to tell them apart.
const YEAST_WORDS: Record<YeastKind, string> = {
  ale: 'Ale',
  lager: 'Lager',
  kveik: 'Ale',
  wheat: 'Wheat',
  wild: 'Ale',
  other: 'Wine',
};
export const YEAST_BEST_FOR: Partial<Record<YeastKind, string>> = {
  kveik: 'Kveik (farmhouse) ales',
  wild: 'Wild and sour beers',
};

/** Who a recipe is by when the caller names nobody: BREWER is required by the specification. */
const UNNAMED_BREWER = 'Kettlefork brewer';

/** One recipe as a BeerXML 1.0 file (a RECIPES group holding one RECIPE). */
export function toBeerXml(doc: RecipeDocument, opts: { brewer?: string } = {}): string {
  const boilSizeL = preBoilVolumeL(doc.batch);
  const recipe: Tag[] = [
    t('NAME', doc.title),
    t('VERSION', 1),
    t('TYPE', RECIPE_TYPE_WORDS[recipeType(doc)]),
    style(doc),
    t('BREWER', opts.brewer?.trim() || UNNAMED_BREWER),
    t('BATCH_SIZE', doc.batch.volumeL),
    t('BOIL_SIZE', boilSizeL),
    t('BOIL_TIME', doc.batch.boilTimeMin),
    t('EFFICIENCY', doc.batch.efficiencyPct),
    group('HOPS', doc.hops.map(hop)),
    group('FERMENTABLES', doc.fermentables.map(fermentable)),
    group(
      'MISCS',
      (doc.water?.salts ?? []).map((s) =>
        group('MISC', [
          t('NAME', SALT_FILE_NAMES[s.salt]),
          t('VERSION', 1),
          t('TYPE', 'Water Agent'),
          t('USE', 'Mash'),
          t('TIME', 0),
          t('AMOUNT', s.grams / 1000),
          t('AMOUNT_IS_WEIGHT', true),
        ]),
      ),
    ),
    group('YEASTS', doc.yeasts.map(yeast)),
    group(
      'WATERS',
      doc.water
        ? [
            group('WATER', [
              t('NAME', 'Source water'),
              t('VERSION', 1),
              t('AMOUNT', doc.water.volumeL),
              ...ION_NAMES.map((ion) => t(ion.toUpperCase(), doc.water!.source[ion])),
            ]),
          ]
        : [],
    ),
    group('EQUIPMENT', [
      t('NAME', `${doc.title} kit`),
      t('VERSION', 1),
      t('BOIL_SIZE', boilSizeL),
      t('BATCH_SIZE', doc.batch.volumeL),
      t('TRUB_CHILLER_LOSS', doc.batch.trubLossL),
      // BeerXML's evaporation rate is a percentage of the pre-boil volume per hour.
      t('EVAP_RATE', boilSizeL > 0 ? (doc.batch.boilOffLPerHour / boilSizeL) * 100 : 0),
      t('BOIL_TIME', doc.batch.boilTimeMin),
    ]),
    mash(doc),
    t('NOTES', notesForExport(doc)),
    ...fermentationTags(doc),
    ...(doc.carbonation
      ? [t('CARBONATION', doc.carbonation.volumesCO2), t('CARBONATION_TEMP', doc.carbonation.servingTempC)]
      : []),
  ];
  return `<?xml version="1.0" encoding="UTF-8"?>\n${render(group('RECIPES', [group('RECIPE', recipe)]), 0)}\n`;
}

function hop(h: RecipeDocument['hops'][number]): Tag {
  return group('HOP', [
    t('NAME', h.name),
    t('VERSION', 1),
    t('ALPHA', h.alphaPct),
    t('AMOUNT', h.amountG / 1000),
    t('USE', HOP_USE_WORDS[h.use]),
    t('TIME', h.timeMin),
    ...(h.use === 'whirlpool' && h.tempC !== undefined ? [t('NOTES', `Hop stand at ${decimalText(h.tempC)} °C`)] : []),
    t('FORM', h.form === 'leaf' ? 'Leaf' : 'Pellet'),
  ]);
}

function fermentable(f: RecipeDocument['fermentables'][number]): Tag {
  // Liquid extract colour is SRM in BeerXML, everything else °L. A colour paler than 0 SRM cannot be
  // written as SRM, so such an extract goes out as dry extract, whose colour is in °L.
  const srm = lovibondToSrmClamped(f.colorLovibond);
  const type = f.kind === 'extract' && srm <= 0 ? 'Dry Extract' : FERMENTABLE_WORDS[f.kind];
  return group('FERMENTABLE', [
    t('NAME', f.name),
    t('VERSION', 1),
    t('TYPE', type),
    t('AMOUNT', f.amountKg),
    t('YIELD', ppgToYieldPct(f.potentialPpg)),
    t('COLOR', type === 'Extract' ? srm : f.colorLovibond),
  ]);
}

function yeast(y: RecipeDocument['yeasts'][number]): Tag {
  const bestFor = YEAST_BEST_FOR[y.kind];
  return group('YEAST', [
    t('NAME', y.name),
    t('VERSION', 1),
    t('TYPE', YEAST_WORDS[y.kind]),
    t('FORM', 'Dry'),
    // One 11 g packet: the document does not say how much yeast, and BeerXML requires an amount.
    t('AMOUNT', 0.011),
    t('AMOUNT_IS_WEIGHT', true),
    ...(y.tempMinC === undefined ? [] : [t('MIN_TEMPERATURE', y.tempMinC)]),
    ...(y.tempMaxC === undefined ? [] : [t('MAX_TEMPERATURE', y.tempMaxC)]),
    t('ATTENUATION', y.attenuationPct),
    ...(bestFor ? [t('BEST_FOR', bestFor)] : []),
  ]);
}

function mash(doc: RecipeDocument): Tag {
  const gristKg = mashedKg(doc.fermentables);
  return group('MASH', [
    t('NAME', 'Mash'),
    t('VERSION', 1),
    t('GRAIN_TEMP', 20),
    group(
      'MASH_STEPS',
      doc.mash.steps.map((s, i) =>
        group('MASH_STEP', [
          t('NAME', s.name ?? unnamedStep(i)),
          t('VERSION', 1),
          // The first step is the strike infusion; later ones are heated to (BeerXML: "Temperature").
          t('TYPE', i === 0 ? 'Infusion' : 'Temperature'),
          ...(i === 0 ? [t('INFUSE_AMOUNT', doc.batch.mashWaterLPerKg * gristKg)] : []),
          t('STEP_TEMP', s.tempC),
          t('STEP_TIME', s.timeMin),
        ]),
      ),
    ),
  ]);
}

function style(doc: RecipeDocument): Tag {
  const code = doc.style?.code;
  const guideline = code ? findStyle(code) : undefined;
  if (!doc.style || !guideline) {
    // STYLE and its fields are required even for a recipe filed under no style of our guidelines.
    const { number, letter } = splitStyleCode(doc.style?.code ?? '');
    return group('STYLE', [
      t('NAME', doc.style?.name ?? UNSPECIFIED_STYLE),
      t('CATEGORY', doc.style?.name ?? UNSPECIFIED_STYLE),
      t('VERSION', 1),
      t('CATEGORY_NUMBER', number || '0'),
      t('STYLE_LETTER', letter || 'A'),
      t('STYLE_GUIDE', doc.style ? 'Brewer’s own' : 'None'),
      t('TYPE', styleTypeFromYeast(doc)),
      ...rangeTags(undefined),
    ]);
  }
  const { number, letter } = splitStyleCode(guideline.code);
  return group('STYLE', [
    t('NAME', guideline.name),
    t('CATEGORY', guideline.category),
    t('VERSION', 1),
    t('CATEGORY_NUMBER', number),
    t('STYLE_LETTER', letter || 'A'),
    t('STYLE_GUIDE', 'BJCP 2021'),
    t(
      'TYPE',
      /lager|pils|bock|helles|märzen|marzen|schwarz|dunkel/i.test(guideline.name) ? 'Lager' : styleTypeFromYeast(doc),
    ),
    ...rangeTags(guideline.vitals),
  ]);
}

export const UNSPECIFIED_STYLE = 'Unspecified';

function styleTypeFromYeast(doc: RecipeDocument): string {
  const kinds = doc.yeasts.map((y) => y.kind);
  if (kinds.includes('lager')) return 'Lager';
  if (kinds.includes('wheat')) return 'Wheat';
  return 'Ale';
}

function rangeTags(vitals: NonNullable<ReturnType<typeof findStyle>>['vitals'] | undefined): Tag[] {
  const range = (
    min: string,
    max: string,
    r: { min: number; max: number } | null | undefined,
    fallback: [number, number],
  ) => [t(min, r?.min ?? fallback[0]), t(max, r?.max ?? fallback[1])];
  return [
    ...range('OG_MIN', 'OG_MAX', vitals?.og, [1, 1.2]),
    ...range('FG_MIN', 'FG_MAX', vitals?.fg, [0.99, 1.1]),
    ...range('IBU_MIN', 'IBU_MAX', vitals?.ibu, [0, 150]),
    ...range('COLOR_MIN', 'COLOR_MAX', vitals?.srm, [0, 80]),
  ];
}

function fermentationTags(doc: RecipeDocument): Tag[] {
  const stages = ['PRIMARY', 'SECONDARY', 'TERTIARY'];
  const steps = doc.fermentation.steps.slice(0, 3);
  return [
    t('FERMENTATION_STAGES', steps.length),
    ...steps.flatMap((s, i) => [t(`${stages[i]}_AGE`, s.days), t(`${stages[i]}_TEMP`, s.tempC)]),
  ];
}

/** BeerXML 1.0 has three fermentation stages; later steps are written into the notes so they are not lost. */
function notesForExport(doc: RecipeDocument): string {
  const extra = doc.fermentation.steps.slice(3);
  if (!extra.length) return doc.notes;
  const lines = extra.map((s, i) => `- Step ${i + 4}: ${decimalText(s.days)} days at ${decimalText(s.tempC)} °C`);
  return `${doc.notes}\n\nFurther fermentation steps:\n${lines.join('\n')}`.trim();
}
