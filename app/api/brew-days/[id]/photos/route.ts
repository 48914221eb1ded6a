import { loadOwnBrewDay } from '@/lib/brew-days/brew-days';
import { uploadPhoto } from '@/lib/brew-days/photos';
import { photoCaptionSchema } from '@/lib/brew-days/schemas';
import { AppError, invalidInput } from '@/lib/errors';
import { readBodyWithin } from '@/lib/http/body';
import { errorResponse, route } from '@/lib/http/route';
import { idParams } from '@/lib/validation/ids';
import { MAX_PHOTO_BYTES } from '@/lib/storage/images';

/** Room for the multipart boundaries, part headers and a caption around the file itself. */
const ENVELOPE_BYTES = 64 * 1024;
const LIMIT_MB = MAX_PHOTO_BYTES / 1024 / 1024;

function tooLarge(): AppError {
  const message = `The photo is larger than ${LIMIT_MB} MB.`;
  return new AppError('too_large', 'photo', message, [{ path: 'photo', message }]);
}

/** A refusal after reading was cut off mid-stream: that connection cannot be reused, so say so. */
function closing(err: unknown): Response {
  const res = errorResponse(err);
  res.headers.set('Connection', 'close');
  return res;
}

// POST /api/brew-days/[id]/photos – the brewer uploads a photo (multipart field "photo", optional "caption")
export const POST = route({ access: 'user', params: idParams('brew day') }, async ({ req, viewer, params }) => {
  const declared = Number(req.headers.get('content-length'));
  // Refused before reading; the server discards the declared body so the connection stays usable.
  if (Number.isFinite(declared) && declared > MAX_PHOTO_BYTES + ENVELOPE_BYTES) throw tooLarge();
  const contentType = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(contentType)) {
    const message = 'Send the photo as a multipart form with the image in the field "photo".';
    throw new AppError('bad_request', 'photo', message, [{ path: 'photo', message }]);
  }
  await loadOwnBrewDay(viewer, params.id, 'add photos to');
  const body = await readBodyWithin(req.body, MAX_PHOTO_BYTES + ENVELOPE_BYTES);
  if (!body) return closing(tooLarge());
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(body), { headers: { 'content-type': contentType } }).formData();
  } catch {
    throw new AppError('bad_request', 'photo', 'The upload is not a complete multipart form; please try again.');
  }
  const file = form.get('photo');
  if (!(file instanceof File)) {
    const message = 'Attach the image in the form field "photo".';
    throw new AppError('bad_request', 'photo', message, [{ path: 'photo', message }]);
  }
  if (file.size > MAX_PHOTO_BYTES) throw tooLarge();
  if (file.size === 0) {
    throw new AppError('bad_request', 'photo', 'The photo file is empty.', [
      { path: 'photo', message: 'The photo file is empty.' },
    ]);
  }
  const caption = photoCaptionSchema.safeParse(typeof form.get('caption') === 'string' ? form.get('caption') : '');
  if (!caption.success) throw invalidInput(caption.error, 'caption');
  return uploadPhoto(viewer, params.id, new Uint8Array(await file.arrayBuffer()), caption.data);
});
