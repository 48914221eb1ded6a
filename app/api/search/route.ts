import { NextResponse } from 'next/server';
import { AppError } from '@/lib/errors';
import { route } from '@/lib/http/route';
import { searchRecipesWithHints } from '@/lib/search/client';
import { parseSearchParams } from '@/lib/search/schemas';

const UNAVAILABLE_MESSAGE = 'Search is unavailable right now; recipes and saving still work.';

// GET /api/search – recipes the viewer may see, with facet counts, and hints when nothing matches
export const GET = route({ access: 'public' }, async ({ req, viewer }) => {
  const parsed = parseSearchParams(req.nextUrl.searchParams);
  if (!parsed.success) {
    const fields = Object.entries(parsed.fieldErrors).flatMap(([path, messages]) =>
      (messages ?? []).map((message) => ({ path, message })),
    );
    const summary = fields.map((field) => field.message).join('; ');
    throw new AppError('bad_request', 'search', `Please check the search: ${summary}.`, fields);
  }
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
