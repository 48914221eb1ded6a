import { z } from 'zod';
import { versionResponse } from '@/lib/http/cache';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { toBeerJson, toBeerXml } from '@/lib/interchange';
import { getVersionById } from '@/lib/recipes/versions';
import { slugify } from '@/lib/slug';

const exportQuerySchema = z.object({
  format: z
    .enum(['beerxml', 'beerjson', 'kettlefork'], { error: 'Format must be beerxml, beerjson or kettlefork.' })
    .default('beerxml'),
});

/** A file name from the title: plain letters, digits and dashes, with the version number. */
function fileName(title: string, number: number, extension: string): string {
  return `${slugify(title, 60) || 'recipe'}-v${number}.${extension}`;
}

// GET /api/versions/[id]/export – download a version as BeerXML 1.0, BeerJSON 1.0 or Kettlefork's own JSON document
export const GET = route(
  { access: 'public', params: idParams('version'), query: exportQuerySchema },
  async ({ req, viewer, params, query }) => {
    const { recipe, version } = await getVersionById(viewer, params.id);
    const doc = version.document;
    const file =
      query.format === 'beerxml'
        ? {
            body: toBeerXml(doc, { brewer: recipe.ownerName }),
            type: 'application/xml; charset=utf-8',
            extension: 'xml',
          }
        : query.format === 'beerjson'
          ? {
              body: `${JSON.stringify(toBeerJson(doc, { author: recipe.ownerName }), null, 2)}\n`,
              type: 'application/json; charset=utf-8',
              extension: 'beer.json',
            }
          : {
              body: `${JSON.stringify(doc, null, 2)}\n`,
              type: 'application/json; charset=utf-8',
              extension: 'kettlefork.json',
            };
    return versionResponse(req, recipe, file.body, {
      'content-type': file.type,
      'content-disposition': `attachment; filename="${fileName(doc.title, version.number, file.extension)}"`,
    });
  },
);
