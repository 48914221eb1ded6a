// Decodes, resizes and re-encodes one uploaded photo on a worker thread (run by lib/storage/photo-pool.ts),
// so a large picture never holds up the server's other requests. Plain JavaScript outside the Next bundle:
// Node loads this file from the checkout at run time, in development and in the production build alike.
// The caller has already checked the type and the dimensions from the header (lib/storage/images.ts).
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import decodeJpegWasm, { init as initJpegDecoder } from '@jsquash/jpeg/decode.js';
import decodeWebpWasm, { init as initWebpDecoder } from '@jsquash/webp/decode.js';
import { Jimp, ResizeStrategy } from 'jimp';

/** Long side of the size shown in the larger view, and of the gallery thumbnail. */
const DISPLAY_LONG_SIDE_PX = 1600;
const THUMB_LONG_SIDE_PX = 400;
const DISPLAY_QUALITY = 82;
const THUMB_QUALITY = 78;

// JPEG and WebP are decoded by the libjpeg-turbo/mozjpeg and libwebp WebAssembly builds (several
// times faster than the pure-JavaScript decoder); the bitmap then goes to jimp for resizing and
// re-encoding. The wasm files are read from node_modules once per thread.
let codecs;

async function loadCodecs() {
  const wasm = async (pkg, file) =>
    WebAssembly.compile(await readFile(path.join(process.cwd(), 'node_modules', pkg, 'codec', 'dec', file)));
  // The decoders' own messages about bad files would only clutter the server log; the refusal says it.
  const quiet = { print: () => {}, printErr: () => {} };
  await initJpegDecoder(await wasm('@jsquash/jpeg', 'mozjpeg_dec.wasm'), quiet);
  await initWebpDecoder(await wasm('@jsquash/webp', 'webp_dec.wasm'), quiet);
}

/** The answer for a file that cannot be decoded; the caller turns it into a 400 naming the field. */
class Damaged extends Error {}

async function decodeWithWasm(decoder, bytes) {
  codecs ??= loadCodecs();
  await codecs;
  try {
    return await decoder(bytes.slice().buffer);
  } catch {
    throw new Damaged();
  }
}

/**
 * True when the JPEG's segments run from SOI to an EOI marker (ITU-T T.81, annex B). libjpeg
 * fills a cut-off file with grey instead of failing, so a cut-off upload is caught here.
 */
function jpegIsComplete(bytes) {
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

/**
 * Whether a PNG can hold see-through pixels: a colour type with alpha (4 or 6) or a tRNS chunk
 * (W3C, Portable Network Graphics Specification, 2003, sections 11.2.2 and 11.3.2.1).
 */
function pngHasTransparency(bytes) {
  const colourType = bytes[25];
  if (colourType === 4 || colourType === 6) return true;
  const view = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let at = 8; at + 8 <= view.length;) {
    const length = view.readUInt32BE(at);
    const kind = view.toString('latin1', at + 4, at + 8);
    if (kind === 'tRNS') return true;
    if (kind === 'IDAT' || kind === 'IEND') return false;
    at += 12 + length;
  }
  return false;
}

/**
 * JPEG has no transparency: see-through parts go on white rather than black. The "over" operator
 * onto an opaque white backdrop (Porter and Duff, Compositing Digital Images, 1984), in one pass over
 * the RGBA bytes: many times faster than a general composite on a picture of tens of megapixels.
 */
function flattenOnWhite(rgba) {
  for (let i = 0; i < rgba.length; i += 4) {
    const alpha = rgba[i + 3];
    if (alpha === 255) continue;
    const white = 255 * (255 - alpha);
    rgba[i] = Math.round((rgba[i] * alpha + white) / 255);
    rgba[i + 1] = Math.round((rgba[i + 1] * alpha + white) / 255);
    rgba[i + 2] = Math.round((rgba[i + 2] * alpha + white) / 255);
    rgba[i + 3] = 255;
  }
}

async function decodeImage(bytes, type) {
  if (type === 'png') {
    let decoded;
    try {
      decoded = await Jimp.fromBuffer(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    } catch {
      throw new Damaged();
    }
    if (pngHasTransparency(bytes)) flattenOnWhite(decoded.bitmap.data);
    return decoded;
  }
  if (type === 'jpeg' && !jpegIsComplete(bytes)) throw new Damaged('the file ends too early');
  const decoded = await decodeWithWasm(type === 'jpeg' ? (b) => decodeJpegWasm(b) : decodeWebpWasm, bytes);
  return Jimp.fromBitmap({
    data: Buffer.from(decoded.data.buffer, decoded.data.byteOffset, decoded.data.byteLength),
    width: decoded.width,
    height: decoded.height,
  });
}

/**
 * One task: `{ bytes: Uint8Array, type: 'jpeg' | 'png' | 'webp' }` → `{ ok: true, display, thumb, width,
 * height }` (two JPEGs; re-encoding from the bitmap drops every piece of metadata, location included), or
 * `{ ok: false, detail }` when the file is damaged.
 */
export default async function processPhotoTask({ bytes, type }) {
  let image;
  try {
    image = await decodeImage(bytes, type);
  } catch (err) {
    if (err instanceof Damaged) return { ok: false, detail: err.message || undefined };
    throw err;
  }
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
  return { ok: true, display, thumb, width, height };
}
