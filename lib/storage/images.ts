import 'server-only';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import decodeJpegWasm, { init as initJpegDecoder } from '@jsquash/jpeg/decode.js';
import decodeWebpWasm, { init as initWebpDecoder } from '@jsquash/webp/decode.js';
import { imageSize } from 'image-size';
import { Jimp, ResizeStrategy } from 'jimp';
import { AppError } from '@/lib/errors';

/**
 * Photo limits (ASVS 12.1.1–12.1.2). A file over MAX_PHOTO_BYTES is refused before it is read in
 * full; one whose header claims more than MAX_PHOTO_SIDE_PX a side or MAX_PHOTO_PIXELS in all is
 * refused before it is decoded (a small file can claim a bitmap of gigabytes).
 */
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
const MAX_PHOTO_SIDE_PX = 12_000;
const MAX_PHOTO_PIXELS = 40_000_000;
/** Long side of the size shown in the larger view, and of the gallery thumbnail. */
const DISPLAY_LONG_SIDE_PX = 1600;
const THUMB_LONG_SIDE_PX = 400;
const DISPLAY_QUALITY = 82;
const THUMB_QUALITY = 78;

type ImageType = 'jpeg' | 'png' | 'webp';

/** The type by its magic bytes; the name and the client's content type are never asked. */
function sniffImageType(bytes: Uint8Array): ImageType | null {
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  const png = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
  if (bytes.length >= 8 && png.every((b, i) => bytes[i] === b)) return 'png';
  const ascii = (from: number, to: number) => Buffer.from(bytes.subarray(from, to)).toString('latin1');
  if (bytes.length >= 12 && ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return 'webp';
  return null;
}

const NOT_AN_IMAGE = 'The photo must be a JPEG, PNG or WebP image; this file is not one we can read.';

/** Type and dimensions from the header alone, refusing what is too big to decode safely. */
function probeImage(bytes: Uint8Array): { type: ImageType; width: number; height: number } {
  const type = sniffImageType(bytes);
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

// JPEG and WebP are decoded by the libjpeg-turbo/mozjpeg and libwebp WebAssembly builds (several
// times faster than the pure-JavaScript decoder); the bitmap then goes to jimp for resizing and
// re-encoding. The wasm files are read from node_modules once per process.
const codecs = globalThis as unknown as { kfCodecs?: Promise<void> };

async function loadCodecs(): Promise<void> {
  const wasm = async (pkg: string, file: string) =>
    WebAssembly.compile(await readFile(path.join(process.cwd(), 'node_modules', pkg, 'codec', 'dec', file)));
  // The decoders' own messages about bad files would only clutter the server log; the refusal says it.
  const quiet = { print: () => {}, printErr: () => {} };
  // The published typings omit init's (module, options) form, which the code accepts.
  type InitWithModule = (module: WebAssembly.Module, options: typeof quiet) => Promise<void>;
  await (initJpegDecoder as unknown as InitWithModule)(await wasm('@jsquash/jpeg', 'mozjpeg_dec.wasm'), quiet);
  await (initWebpDecoder as unknown as InitWithModule)(await wasm('@jsquash/webp', 'webp_dec.wasm'), quiet);
}

function damaged(detail?: string): AppError {
  const message = `The photo is damaged or incomplete${detail ? ` (${detail})` : ''}; please upload the whole file.`;
  return new AppError('bad_request', 'photo', message, [{ path: 'photo', message }]);
}

async function decodeWithWasm(decoder: (b: ArrayBuffer) => Promise<ImageData>, bytes: Uint8Array): Promise<ImageData> {
  codecs.kfCodecs ??= loadCodecs();
  await codecs.kfCodecs;
  try {
    return await decoder(bytes.slice().buffer);
  } catch {
    throw damaged();
  }
}

/**
 * True when the JPEG's segments run from SOI to an EOI marker (ITU-T T.81, annex B). libjpeg
 * fills a cut-off file with grey instead of failing, so a cut-off upload is caught here.
 */
function jpegIsComplete(bytes: Uint8Array): boolean {
  let i = 2;
  while (i + 1 < bytes.length) {
    if (bytes[i] !== 0xff) return false;
    const marker = bytes[i + 1];
    if (marker === 0xff) {
      i += 1; // fill byte
      continue;
    }
    if (marker === 0xd9) return true;
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      i += 2;
      continue;
    }
    if (i + 3 >= bytes.length) return false;
    i += 2 + ((bytes[i + 2] << 8) | bytes[i + 3]);
    if (marker === 0xda) {
      // Entropy-coded data runs to the next marker that is neither a stuffed 0x00 nor a restart.
      while (
        i + 1 < bytes.length &&
        !(bytes[i] === 0xff && bytes[i + 1] !== 0x00 && !(bytes[i + 1] >= 0xd0 && bytes[i + 1] <= 0xd7))
      )
        i += 1;
    }
  }
  return false;
}

async function decodeImage(bytes: Uint8Array, type: ImageType) {
  if (type === 'png') {
    try {
      const decoded = await Jimp.fromBuffer(Buffer.from(bytes));
      // JPEG has no transparency: see-through parts go on white rather than black.
      return new Jimp({ width: decoded.width, height: decoded.height, color: 0xffffffff }).composite(decoded);
    } catch {
      throw damaged();
    }
  }
  if (type === 'jpeg' && !jpegIsComplete(bytes)) throw damaged('the file ends too early');
  const decoded = await decodeWithWasm(type === 'jpeg' ? (b) => decodeJpegWasm(b) : decodeWebpWasm, bytes);
  return Jimp.fromBitmap({
    data: Buffer.from(decoded.data.buffer, decoded.data.byteOffset, decoded.data.byteLength),
    width: decoded.width,
    height: decoded.height,
  });
}

export interface ProcessedPhoto {
  display: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

/**
 * Checks, decodes and re-encodes an uploaded photo into a display JPEG and a thumbnail JPEG.
 * Re-encoding from the bitmap drops every piece of metadata (camera, location).
 */
export async function processPhoto(bytes: Uint8Array): Promise<ProcessedPhoto> {
  const { type } = probeImage(bytes);
  const image = await decodeImage(bytes, type);
  if (image.width > DISPLAY_LONG_SIDE_PX || image.height > DISPLAY_LONG_SIDE_PX) {
    // Bilinear is several times faster than the default filter and looks the same at these sizes.
    image.scaleToFit({ w: DISPLAY_LONG_SIDE_PX, h: DISPLAY_LONG_SIDE_PX, mode: ResizeStrategy.BILINEAR });
  }
  const display = await image.getBuffer('image/jpeg', { quality: DISPLAY_QUALITY });
  const { width, height } = image;
  if (width > THUMB_LONG_SIDE_PX || height > THUMB_LONG_SIDE_PX) {
    image.scaleToFit({ w: THUMB_LONG_SIDE_PX, h: THUMB_LONG_SIDE_PX, mode: ResizeStrategy.BILINEAR });
  }
  const thumb = await image.getBuffer('image/jpeg', { quality: THUMB_QUALITY });
  return { display, thumb, width, height };
}
