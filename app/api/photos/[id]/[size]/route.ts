import { getPhotoBytes } from '@/lib/brew-days/photos';
import { photoSizeSchema } from '@/lib/brew-days/schemas';
import { AppError } from '@/lib/errors';
import { route } from '@/lib/http/route';

// GET /api/photos/[id]/[size] – a photo's display or thumbnail JPEG, for viewers who may see its brew day
export const GET = route<undefined, { id: string; size: string }, 'public'>(
  { access: 'public' },
  async ({ viewer, params }) => {
    const size = photoSizeSchema.safeParse(params.size);
    if (!size.success) throw new AppError('not_found', 'photo');
    const bytes = await getPhotoBytes(viewer, params.id, size.data);
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
  },
);
