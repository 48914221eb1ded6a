import { parseBeerJson } from './beerjson/read';
import { parseBeerXml } from './beerxml/read';
import { InterchangeError, type ImportResult, type InterchangeFormat } from './types';

export { toBeerJson } from './beerjson/write';
export { toBeerXml } from './beerxml/write';
export { MAX_IMPORT_BYTES } from './limits';
export { InterchangeError, type ImportResult, type InterchangeFormat } from './types';

/** Which format a text is in, by its first meaningful character: `<` for XML, `{` for JSON. */
function detectFormat(text: string): InterchangeFormat {
  const start = text.replace(/^\uFEFF/, '').trimStart()[0];
  if (start === '<') return 'beerxml';
  if (start === '{') return 'beerjson';
  throw new InterchangeError('the text is neither XML (BeerXML) nor JSON (BeerJSON)', '(file)', 'malformed');
}

/** Reads a recipe file in either open format; the format is detected when not given. */
export function parseRecipeFile(
  text: string,
  format?: InterchangeFormat,
): { format: InterchangeFormat } & ImportResult {
  const chosen = format ?? detectFormat(text);
  const body = text.replace(/^\uFEFF/, '');
  return { format: chosen, ...(chosen === 'beerxml' ? parseBeerXml(body) : parseBeerJson(body)) };
}
