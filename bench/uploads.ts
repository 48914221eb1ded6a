// Photo upload processing: header check, decode, two resizes and two JPEG encodes of a 12-megapixel
// JPEG, as the upload route runs them (storage and the database are not included).
import { Jimp } from 'jimp';
import { processPhoto } from '../lib/storage/images';
import type { BenchRow } from './types';

const RUNS = 5;
const WIDTH = 4000;
const HEIGHT = 3000;

/** An invented photo-like 12 MP picture: smooth gradients with sensor-like noise, as a q90 JPEG. */
async function twelveMegapixelJpeg(): Promise<Buffer> {
  const image = new Jimp({ width: WIDTH, height: HEIGHT, color: 0x000000ff });
  const data = image.bitmap.data;
  let seed = 7;
  const noise = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff) * 20;
  for (let y = 0; y < HEIGHT; y += 1) {
    for (let x = 0; x < WIDTH; x += 1) {
      const i = (y * WIDTH + x) * 4;
      const n = noise();
      data[i] = 130 + 70 * Math.sin(x / 310) + n;
      data[i + 1] = 95 + 55 * Math.cos(y / 190) + n;
      data[i + 2] = 60 + 40 * Math.sin((x + y) / 470) + n;
    }
  }
  return image.getBuffer('image/jpeg', { quality: 90 });
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

export async function benchUploads(): Promise<BenchRow[]> {
  const jpeg = await twelveMegapixelJpeg();
  // One warm-up run loads the WebAssembly decoders and lets the JIT settle.
  await processPhoto(jpeg);
  (globalThis as { gc?: () => void }).gc?.();
  const rssBefore = process.memoryUsage().rss;
  let peakRss = rssBefore;
  const times: number[] = [];
  for (let i = 0; i < RUNS; i += 1) {
    const started = performance.now();
    await processPhoto(jpeg);
    times.push(performance.now() - started);
    peakRss = Math.max(peakRss, process.memoryUsage().rss, process.resourceUsage().maxRSS * 1024);
  }
  const sizeMb = (jpeg.length / 1024 / 1024).toFixed(1);
  return [
    {
      area: 'uploads',
      metric: 'processing time of a 12 MP JPEG, median',
      value: Math.round(median(times)),
      unit: 'ms',
      target: { op: '<', value: 1500 },
      note: `${WIDTH}×${HEIGHT}, ${sizeMb} MB; decode, 1600 px and 400 px resizes, two JPEG encodes; ${RUNS} runs`,
    },
    {
      area: 'uploads',
      metric: 'processing time of a 12 MP JPEG, slowest',
      value: Math.round(Math.max(...times)),
      unit: 'ms',
    },
    {
      area: 'uploads',
      metric: 'peak memory while processing (RSS over the idle process)',
      value: Math.round((peakRss - rssBefore) / 1024 / 1024),
      unit: 'MB',
      note: 'process peak RSS after a warm-up run, less RSS before the measured runs',
    },
  ];
}

// Run directly: `node --conditions=react-server --import tsx bench/uploads.ts`
if (import.meta.url === `file://${process.argv[1]}`) {
  console.table(await benchUploads());
}
