import { route } from '@/lib/http/route';
import { compareVersions } from '@/lib/recipes/listing';
import { compareQuerySchema } from '@/lib/recipes/schemas';

// GET /api/compare?a=&b= – two versions side by side: ingredients, numbers and notes
export const GET = route({ access: 'public', query: compareQuerySchema }, async ({ viewer, query }) => {
  const { a, b, comparison } = await compareVersions(viewer, query.a, query.b, viewer?.units ?? 'metric');
  const side = (v: typeof a) => ({
    recipe: { id: v.recipe.id, slug: v.recipe.slug, title: v.recipe.title },
    version: v.version,
  });
  return { a: side(a), b: side(b), comparison };
});
