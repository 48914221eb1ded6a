import { describe, expect, it } from 'vitest';
import { parseXmlSafely } from './xml-reader';

function recipeName(xml: string): unknown {
  const parsed = parseXmlSafely(`<RECIPES><RECIPE><NAME>${xml}</NAME></RECIPE></RECIPES>`) as {
    RECIPES: { RECIPE: { NAME: unknown }[] };
  };
  return parsed.RECIPES.RECIPE[0].NAME;
}

// XML 1.0 (W3C, fifth edition 2008), §4.1 and §4.6: the five predefined entities and decimal and
// hexadecimal character references are part of every document and must be decoded.
describe('reading XML text', () => {
  it('decodes the predefined entities and numeric character references', () => {
    expect(recipeName('Miller&#39;s Best')).toBe("Miller's Best");
    expect(recipeName('&#x27;Stout&#x27; &amp; &lt;porter&gt; &quot;&apos;')).toBe("'Stout' & <porter> \"'");
    expect(recipeName('Caf&#233; &#x1F37A;')).toBe('Café 🍺');
  });

  it('decodes only once: an escaped ampersand before a reference stays text', () => {
    expect(recipeName('&amp;#39;')).toBe('&#39;');
  });

  it('keeps a reference to no character (NUL, a surrogate) as written', () => {
    expect(recipeName('a&#0;b&#xD800;')).toBe('a&#0;b&#xD800;');
  });

  it('refuses a document nested deeper than any recipe file, with a clear message', () => {
    const deep = (n: number) => '<A>'.repeat(n) + '</A>'.repeat(n);
    expect(() => parseXmlSafely(deep(200))).toThrow(/nested more than 32 elements deep/);
    expect(() => parseXmlSafely(deep(20))).not.toThrow();
  });

  it('still refuses declared entities', () => {
    expect(() => parseXmlSafely('<!DOCTYPE r [<!ENTITY x "y">]><r>&x;</r>')).toThrow(/document type declaration/);
  });
});
