import 'server-only';
import { imageSize } from 'image-size';
import { AppError } from '@/lib/errors';
import { processOnWorker, type PhotoType } from './photo-pool';

/**
 * Photo limits (ASVS 12.1.1–12.1.2). A file over MAX_PHOTO_BYTES is refused before it is read in
 * full; one whose header claims more than MAX_PHOTO_SIDE_PX a side or MAX_PHOTO_PIXELS in all is
 * refused before it is decoded (a small file can claim a bitmap of gigabytes).
 */
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
const MAX_PHOTO_SIDE_PX = 12_000;
const MAX_PHOTO_PIXELS = 40_000_000;

/** The type by its magic bytes; the name and the client's content type are never asked. */
function sniffPhotoType(bytes: Uint8Array): PhotoType | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (bytes.length >= 8 && png.every((b, i) => bytes[i] === b)) return 'png';
  const ascii = (from: number, to: number) => Buffer.from(bytes.subarray(from, to)).toString('latin1');
  if (bytes.length >= 12 && ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return 'webp';
  return null;
}

const NOT_AN_IMAGE = 'The photo must be a JPEG, PNG or WebP image; this file is not one we can read.';

/** Type and dimensions from the header alone, refusing what is too big to decode safely. */
function probeImage(bytes: Uint8Array): { type: PhotoType; width: number; height: number } {
  const type = sniffPhotoType(bytes);
  if (!type) throw new AppError('bad_request', 'photo', NOT_AN_IMAGE, [{ path: 'photo', message: NOT_AN_IMAGE }]);
  let size: { width?: number; height?: number; type?: string };
  try {
    size = imageSize(bytes);
  } catch {
    throw new AppError('bad_request', 'photo', 'The photo is damaged or incomplete: its header cannot be read.', [
      { path: 'photo', message: 'The photo is damaged or incomplete.' },
    ]);
  }
  const width = size.width ?? 0;
  const height = size.height ?? 0;
  const expected = type === 'jpeg' ? 'jpg' : type;
  if (size.type !== expected || width < 1 || height < 1) {
    throw new AppError('bad_request', 'photo', 'The photo is damaged or incomplete.', [
      { path: 'photo', message: 'The photo is damaged or incomplete.' },
    ]);
  }
  if (width > MAX_PHOTO_SIDE_PX || height > MAX_PHOTO_SIDE_PX || width * height > MAX_PHOTO_PIXELS) {
    const message = `The photo is ${width}×${height} pixels; the largest we take is ${MAX_PHOTO_SIDE_PX} pixels a side and ${MAX_PHOTO_PIXELS / 1_000_000} megapixels.`;
    throw new AppError('too_large', 'photo', message, [{ path: 'photo', message }]);
  }
  return { type, width, height };
}

export interface ProcessedPhoto {
  display: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

/**
 * Checks an uploaded photo's header here, then decodes and re-encodes it into a display JPEG and a
 * thumbnail JPEG on a worker thread (lib/storage/photo-worker.mjs), so the request thread stays free.
 * Re-encoding from the bitmap drops every piece of metadata (camera, location).
 */
export async function processPhoto(bytes: Uint8Array): Promise<ProcessedPhoto> {
  const { type } = probeImage(bytes);
  return processOnWorker(bytes, type);
}
