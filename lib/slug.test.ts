import { describe, expect, it } from 'vitest';
import { slugify } from './slug';

describe('slugify', () => {
  it('keeps letters and digits, drops accents and joins the rest with single dashes', () => {
    expect(slugify('Märzen #2: Grätzer-style!', 60)).toBe('marzen-2-gratzer-style');
    expect(slugify('  --Dry  Stout--  ', 60)).toBe('dry-stout');
  });

  it('cuts to the length without leaving a dash at the end', () => {
    expect(slugify('Session pale ale', 8)).toBe('session');
    expect(slugify('abc def', 4)).toBe('abc');
  });

  it('answers an empty string when nothing usable is left', () => {
    expect(slugify('***', 60)).toBe('');
    expect(slugify('', 60)).toBe('');
  });
});
