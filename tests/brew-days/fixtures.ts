import { randomUUID } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { Jimp } from 'jimp';
import { db } from '@/db';
import { brewDays, photos } from '@/db/schema';
import { eq, sql } from 'drizzle-orm';
import type { TestClient } from '../helpers/http';
import { createRecipeVia, paleAle } from '../helpers/recipes';
import type { FieldIssue } from '@/lib/errors';

const S3_ENDPOINT = process.env.S3_ENDPOINT ?? 'http://127.0.0.1:4570';
const bucket = process.env.S3_BUCKET ?? 'kettlefork-photos';
const s3 = new S3Client({
  endpoint: S3_ENDPOINT,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
});

/** Every key in the photo bucket (the fake holds only what the tests stored). */
export async function listBucket(prefix = ''): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const res = await s3.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
    for (const o of res.Contents ?? []) if (o.Key) keys.push(o.Key);
    token = res.IsTruncated ? res.NextContinuationToken : undefined;
  } while (token);
  return keys.sort();
}

export async function photoRowCount(brewDayId: string): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(photos)
    .where(eq(photos.brewDayId, brewDayId));
  return row.n;
}

/** A picture with some structure (so encoders have work to do) in the given colour. */
function picture(width: number, height: number, rgb = 0xc8891e): InstanceType<typeof Jimp> {
  const image = new Jimp({ width, height, color: ((rgb << 8) | 0xff) >>> 0 });
  const data = image.bitmap.data;
  for (let y = 0; y < height; y += 1) {
    for (let x = 0; x < width; x += 1) {
      const i = (y * width + x) * 4;
      const shade = Math.round(30 * Math.sin(x / 17) + 30 * Math.cos(y / 23));
      data[i] = Math.max(0, Math.min(255, data[i] + shade));
      data[i + 1] = Math.max(0, Math.min(255, data[i + 1] + shade));
    }
  }
  return image;
}

export async function jpeg(width = 640, height = 480): Promise<Buffer> {
  return picture(width, height).getBuffer('image/jpeg', { quality: 85 });
}

export async function png(width = 320, height = 240): Promise<Buffer> {
  return picture(width, height).getBuffer('image/png');
}

/** A WebP made with the libwebp WebAssembly encoder (jimp has no WebP encoder of its own). */
export async function webp(width = 300, height = 200): Promise<Buffer> {
  const { default: encode, init } = await import('@jsquash/webp/encode.js');
  const wasm = await WebAssembly.compile(
    await readFile(path.resolve('node_modules/@jsquash/webp/codec/enc/webp_enc.wasm')),
  );
  await (init as unknown as (m: WebAssembly.Module) => Promise<void>)(wasm);
  const image = picture(width, height);
  const out = await encode(
    { data: new Uint8ClampedArray(image.bitmap.data), width, height, colorSpace: 'srgb' } as ImageData,
    { quality: 80 },
  );
  return Buffer.from(out);
}

/** A JPEG whose Exif segment names a place: after re-encoding the text must be gone. */
export async function jpegWithLocation(): Promise<Buffer> {
  const plain = await jpeg(200, 150);
  const text = Buffer.from('Exif\0\0GPS 51.4769N 0.0005W Millrace shed', 'latin1');
  const app1 = Buffer.concat([Buffer.from([0xff, 0xe1, (text.length + 2) >> 8, (text.length + 2) & 0xff]), text]);
  return Buffer.concat([plain.subarray(0, 2), app1, plain.subarray(2)]);
}

/** A tiny PNG whose header claims 30000×30000 pixels (3.6 GB as a bitmap): the decompression-bomb case. */
export function pngBomb(): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(30000, 0);
  ihdr.writeUInt32BE(30000, 4);
  ihdr[8] = 8;
  ihdr[9] = 6;
  const chunk = Buffer.concat([Buffer.from([0, 0, 0, 13]), Buffer.from('IHDR'), ihdr, Buffer.alloc(4)]);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk, Buffer.alloc(2000)]);
}

/** A JPEG whose frame header (SOF0) claims 30000×30000 pixels. */
export async function jpegBomb(): Promise<Buffer> {
  const real = await jpeg(64, 64);
  const sof = real.indexOf(Buffer.from([0xff, 0xc0]));
  const out = Buffer.from(real);
  out.writeUInt16BE(30000, sof + 5);
  out.writeUInt16BE(30000, sof + 7);
  return out;
}

export async function uploadVia(
  client: TestClient,
  brewDayId: string,
  file: Buffer,
  opts: { field?: string; name?: string; type?: string; caption?: string } = {},
) {
  const form = new FormData();
  form.append(
    opts.field ?? 'photo',
    new Blob([new Uint8Array(file)], { type: opts.type ?? 'image/jpeg' }),
    opts.name ?? 'photo.jpg',
  );
  if (opts.caption !== undefined) form.append('caption', opts.caption);
  const res = await client.fetch(`/api/brew-days/${brewDayId}/photos`, { method: 'POST', body: form });
  const text = await res.text();
  let body: { id?: string; error?: { message: string; fields?: FieldIssue[] } } = {};
  try {
    body = JSON.parse(text);
  } catch {
    body = { error: { message: text } };
  }
  return { status: res.status, body };
}

export function today(offsetDays = 0): string {
  return new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);
}

/** A recipe of the client's and a brew day of its first version. */
export async function brewDayVia(
  client: TestClient,
  opts: { visibility?: 'public' | 'unlisted' | 'private'; fields?: Record<string, unknown> } = {},
) {
  const saved = await createRecipeVia(client, { document: paleAle(), visibility: opts.visibility ?? 'public' });
  const res = await client.post<{ id: string }>('/api/brew-days', {
    versionId: saved.version.id,
    brewedOn: today(-20),
    og: { method: 'hydrometer', value: 1.05 },
    ...opts.fields,
  });
  if (res.status !== 201) throw new Error(`brew day not created: ${res.status} ${JSON.stringify(res.body)}`);
  return { ...saved, brewDayId: res.body.id };
}

export async function brewDayRow(id: string) {
  const [row] = await db.select().from(brewDays).where(eq(brewDays.id, id));
  return row;
}

/** A live brew-day write of a hydrometer OG, naming the value the device last saw on the server. */
export const ogEntry = (value: number, knownValue: unknown) => ({
  idempotencyKey: randomUUID(),
  kind: 'field',
  field: 'og',
  value: { method: 'hydrometer', value },
  knownValue,
});
