import { describe, expect, it } from 'vitest';
import { safeCallbackPath } from './callback';

// Browsers read "\" as "/" and drop tabs and newlines in special-scheme URLs (WHATWG URL Standard),
// so each of these would leave the site if followed as written.
describe('safeCallbackPath', () => {
  it.each([
    '/\\evil.example/phish',
    '/\t/evil.example/phish',
    '/\n/evil.example/phish',
    '//evil.example/phish',
    '\\\\evil.example',
    'https://evil.example/phish',
    'javascript:alert(1)',
    '/.//evil.example',
    '',
  ])('sends %j home', (raw) => {
    expect(safeCallbackPath(raw)).toBe('/');
  });

  it('keeps a path on our own site with its query and fragment', () => {
    expect(safeCallbackPath('/recipes/copper-pale/v/2?tab=notes#brew')).toBe('/recipes/copper-pale/v/2?tab=notes#brew');
    expect(safeCallbackPath('/proposals/abc')).toBe('/proposals/abc');
    expect(safeCallbackPath(undefined)).toBe('/');
  });
});
