import { getPhotoBytes } from '@/lib/brew-days/photos';
import { photoSizeSchema } from '@/lib/brew-days/schemas';
import { route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';

const photoParams = idParams('photo').extend({ size: photoSizeSchema });

// GET /api/photos/[id]/[size] – a photo's display or thumbnail JPEG, for viewers who may see its brew day
export const GET = route({ access: 'public', params: photoParams }, async ({ viewer, params }) => {
  const bytes = await getPhotoBytes(viewer, params.id, params.size);
  return new Response(new Uint8Array(bytes), {
    headers: {
      'Content-Type': 'image/jpeg',
      'Content-Length': String(bytes.length),
      'X-Content-Type-Options': 'nosniff',
      // Per viewer: access is checked on every request, so shared caches must not keep it.
      'Cache-Control': 'private, max-age=3600',
      'Content-Disposition': 'inline',
    },
  });
});
