import { NextResponse } from 'next/server';
import { computeStats } from '@/lib/brewing';
import { AppError, invalidInput } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { readBodyWithin } from '@/lib/http/body';
import { InterchangeError, MAX_IMPORT_BYTES, parseRecipeFile } from '@/lib/interchange';
import { importFileSchema } from '@/lib/recipes/schemas';

/** The JSON wrapping (quotes and escapes around the file's text) may add a little to the file's own size. */
const MAX_BODY_BYTES = Math.ceil(MAX_IMPORT_BYTES * 1.25);

// POST /api/import – read a BeerXML or BeerJSON file and preview its recipes with recomputed numbers (nothing is saved)
export const POST = route({ access: 'user' }, async ({ req }) => {
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > MAX_BODY_BYTES) throw tooLarge();
  const bytes = await readBodyWithin(req.body, MAX_BODY_BYTES);
  if (!bytes) throw tooLarge();
  let json: unknown;
  try {
    json = JSON.parse(bytes.toString('utf8'));
  } catch {
    throw new AppError('bad_request', 'request body', 'The request body is not valid JSON.');
  }
  const parsed = importFileSchema.safeParse(json);
  if (!parsed.success) throw invalidInput(parsed.error);
  try {
    const { format, recipes } = parseRecipeFile(parsed.data.text, parsed.data.format);
    return NextResponse.json({
      format,
      recipes: recipes.map((r) => ({
        document: r.document,
        stats: computeStats(r.document),
        dropped: r.dropped,
        guessed: r.guessed,
      })),
    });
  } catch (err) {
    if (!(err instanceof InterchangeError)) throw err;
    if (err.kind === 'too_large') throw tooLarge();
    throw new AppError('bad_request', 'file', `We could not import this file. ${err.message}`, [
      { path: err.element || 'text', message: err.message },
    ]);
  }
});

function tooLarge(): AppError {
  return new AppError(
    'too_large',
    'file',
    `The file is too large; the largest we import is ${MAX_IMPORT_BYTES / (1024 * 1024)} MB.`,
  );
}
