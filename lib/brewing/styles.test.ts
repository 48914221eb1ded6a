import { describe, expect, it } from 'vitest';
import { computeStats } from './stats';
import {
  STYLE_GUIDELINES_EDITION,
  STYLE_GUIDELINES_SOURCE,
  findStyle,
  fitStyle,
  listStyles,
  styleCategories,
} from './styles';
import { examplePaleAle } from './test-fixtures';

// BJCP 2021 Beer Style Guidelines, vital statistics as printed (data/style-vitals-2021.json).
describe('style guideline ranges', () => {
  it('names the edition and keeps the data source line', () => {
    expect(STYLE_GUIDELINES_EDITION).toBe('BJCP 2021 Beer Style Guidelines');
    expect(STYLE_GUIDELINES_SOURCE).toMatch(/^BJCP 2021 Beer Style Guidelines/);
  });

  it('lists every style with ordered numeric ranges or null', () => {
    const styles = listStyles();
    expect(styles.length).toBe(106);
    for (const style of styles) {
      for (const range of Object.values(style.vitals)) {
        if (range) expect(range.min).toBeLessThanOrEqual(range.max);
      }
    }
  });

  // As printed for 18B American Pale Ale: OG 1.045–1.060, FG 1.010–1.015, IBU 30–50, SRM 5–10, ABV 4.5–6.2%.
  it('finds a style by code, ignoring case and spaces', () => {
    const style = findStyle(' 18b ');
    expect(style?.name).toBe('American Pale Ale');
    expect(style?.vitals).toEqual({
      og: { min: 1.045, max: 1.06 },
      fg: { min: 1.01, max: 1.015 },
      abv: { min: 4.5, max: 6.2 },
      ibu: { min: 30, max: 50 },
      srm: { min: 5, max: 10 },
    });
    expect(findStyle('99Z')).toBeUndefined();
  });

  // As printed for 33A Wood-Aged Beer: every statistic "varies with base style".
  it('has no numbers for a style whose statistics vary with its base style', () => {
    expect(Object.values(findStyle('33A')?.vitals ?? {})).toEqual([null, null, null, null, null]);
    expect(fitStyle('33A', { og: 1.05, fg: 1.01, abv: 5, ibu: 30, srm: 10 })?.og).toBeNull();
  });

  it('groups styles into categories in guideline order', () => {
    const categories = styleCategories();
    expect(categories[0].name).toBe('Standard American Beer');
    expect(categories[0].styles.map((s) => s.code)).toEqual(['1A', '1B', '1C', '1D']);
    expect(categories.flatMap((c) => c.styles).length).toBe(listStyles().length);
  });

  // BJCP 2021 Style Guidelines, 18B American Pale Ale: OG 1.045–1.060, FG 1.010–1.015, 4.5–6.2 %, 30–50 IBU, 5–10 SRM.
  it('places a recipe built for American Pale Ale within each of its ranges', () => {
    const fit = computeStats(examplePaleAle()).styleFit;
    expect(fit?.code).toBe('18B');
    for (const vital of ['og', 'fg', 'abv', 'ibu', 'srm'] as const) expect(fit?.[vital]?.position).toBe('within');
  });

  it('says below and above, comparing at the printed precision', () => {
    const fit = fitStyle('18B', { og: 1.0446, fg: 1.0153, abv: 4.44, ibu: 50.4, srm: 10.06 });
    expect(fit?.og?.position).toBe('within');
    expect(fit?.fg?.position).toBe('within');
    expect(fit?.abv?.position).toBe('below');
    expect(fit?.ibu?.position).toBe('within');
    expect(fit?.srm?.position).toBe('above');
    expect(fitStyle('18B', { og: 1.07, fg: 1.005, abv: 7, ibu: 20, srm: 3 })).toMatchObject({
      og: { position: 'above' },
      fg: { position: 'below' },
      abv: { position: 'above' },
      ibu: { position: 'below' },
      srm: { position: 'below' },
    });
  });
});
