import { NextResponse } from 'next/server';
import { AppError, invalidInput } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { searchRecipesWithHints } from '@/lib/search/client';
import { searchParamsSchema } from '@/lib/search/schemas';

const UNAVAILABLE_MESSAGE = 'Search is unavailable right now; recipes and saving still work.';

// GET /api/search – recipes the viewer may see, with facet counts, and hints when nothing matches
export const GET = route({ access: 'public' }, async ({ req, viewer }) => {
  const parsed = searchParamsSchema.safeParse(req.nextUrl.searchParams);
  if (!parsed.success) throw invalidInput(parsed.error, 'search');
  let response;
  try {
    response = await searchRecipesWithHints(parsed.data, viewer && { id: viewer.id, role: viewer.role });
  } catch (err) {
    // Any engine failure (down, timing out, refusing) means search is out; the rest of the site is not.
    console.error('[search] query failed:', err instanceof Error ? err.message : err);
    throw new AppError('unavailable', 'search', UNAVAILABLE_MESSAGE);
  }
  // Results depend on who asks, so no shared cache may keep them.
  return NextResponse.json({ query: parsed.data, ...response }, { headers: { 'Cache-Control': 'private, no-store' } });
});
