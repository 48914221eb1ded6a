import { crc32, deflateSync } from 'node:zlib';

function chunk(kind: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(kind, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([length, body, crc]);
}

/**
 * An opaque 8-bit RGB PNG built by hand (W3C, Portable Network Graphics Specification, 2003): every
 * row holds the same horizontal stripes, so even 7000×5000 pixels deflate to about a hundred
 * kilobytes while a decoder still has to inflate and unfilter every one of them.
 */
export function stripedPng(width: number, height: number): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // colour type: RGB
  const row = Buffer.alloc(1 + width * 3); // filter byte 0 (None), then the pixels
  for (let x = 0; x < width; x += 1) {
    const shade = (x >> 6) % 2 === 0 ? 0xd0 : 0x60;
    row[1 + x * 3] = shade;
    row[2 + x * 3] = Math.round(shade * 0.7);
    row[3 + x * 3] = 0x20;
  }
  const raw = Buffer.alloc(row.length * height);
  for (let y = 0; y < height; y += 1) row.copy(raw, y * row.length);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw, { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
