import path from 'node:path';
import { Jimp } from 'jimp';
import { Piscina } from 'piscina';
import { afterAll, describe, expect, it } from 'vitest';
import { AppError } from '@/lib/errors';
import { errorResponse } from '@/lib/http/route';
import { stripedPng } from '../../tests/helpers/png';
import { AdmissionGate, processOnWorker } from './photo-pool';

describe('the admission gate', () => {
  it('admits up to its slots, lines up to its limit and refuses the rest, handing slots on in order', async () => {
    const gate = new AdmissionGate(1, 2);
    const first = await gate.enter();
    expect(first).toBeTypeOf('function');
    const order: string[] = [];
    const second = gate.enter().then((release) => (order.push('second'), release));
    const third = gate.enter().then((release) => (order.push('third'), release));
    expect(gate.load).toEqual({ running: 1, waiting: 2 });
    expect(await gate.enter()).toBe(false);

    (first as () => void)();
    const releaseSecond = await second;
    expect(order).toEqual(['second']);
    expect(gate.load).toEqual({ running: 1, waiting: 1 });
    (releaseSecond as () => void)();
    (releaseSecond as () => void)(); // a second call changes nothing
    const releaseThird = await third;
    expect(order).toEqual(['second', 'third']);
    (releaseThird as () => void)();
    expect(gate.load).toEqual({ running: 0, waiting: 0 });
  });
});

describe('photos on worker threads', () => {
  const pool = new Piscina({ filename: path.resolve('lib/storage/photo-worker.mjs'), maxThreads: 1 });
  afterAll(() => pool.destroy());

  it('answers 503 with Retry-After while every thread is busy and the line is full, and runs nothing', async () => {
    let runs = 0;
    let finish: () => void = () => {};
    const stalled = {
      run: () => {
        runs += 1;
        return new Promise<never>((_, reject) => (finish = () => reject(new Error('stopped'))));
      },
    };
    const workers = { pool: stalled, gate: new AdmissionGate(1, 1) };
    const busy = processOnWorker(new Uint8Array(8), 'png', workers).catch((e: unknown) => e);
    const waiting = processOnWorker(new Uint8Array(8), 'png', workers).catch((e: unknown) => e);
    const refused = await processOnWorker(new Uint8Array(8), 'png', workers).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).status).toBe(503);
    expect((refused as AppError).message).toMatch(/busy.*try again shortly/i);
    const res = errorResponse(refused);
    expect(res.status).toBe(503);
    expect(res.headers.get('retry-after')).toBe('5');
    expect(runs).toBe(1);
    finish();
    expect(((await busy) as AppError).status).toBe(400);
    finish();
    expect(((await waiting) as AppError).status).toBe(400);
    expect(runs).toBe(2);
  });

  it('decodes and resizes a photo off the calling thread', async () => {
    const gate = new AdmissionGate(1, 1);
    const photo = await processOnWorker(new Uint8Array(stripedPng(2000, 1000)), 'png', { pool, gate });
    expect([photo.width, photo.height]).toEqual([1600, 800]);
    expect(photo.display.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    expect(photo.thumb.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
    expect(gate.load).toEqual({ running: 0, waiting: 0 });
  });

  it('stops a photo that overruns its time budget with a 413, and the next photo still goes through', async () => {
    const gate = new AdmissionGate(1, 1);
    const large = new Uint8Array(stripedPng(7000, 5000));
    const started = Date.now();
    const overrun = await processOnWorker(large, 'png', { pool, gate }, 200).catch((e: unknown) => e);
    // Stopped, not waited for: the whole decode takes seconds even on an idle machine.
    expect(Date.now() - started).toBeLessThan(5000);
    expect(overrun).toBeInstanceOf(AppError);
    expect((overrun as AppError).status).toBe(413);
    expect((overrun as AppError).message).toMatch(/took longer than \d+ seconds/);
    const next = await processOnWorker(new Uint8Array(stripedPng(800, 600)), 'png', { pool, gate });
    expect([next.width, next.height]).toEqual([800, 600]);
  });

  it('puts see-through parts of a PNG on white, half see-through ones halfway', async () => {
    const picture = new Jimp({ width: 90, height: 30, color: 0x000000ff });
    picture.scan(0, 0, 30, 30, (_x, _y, i) => void (picture.bitmap.data[i + 3] = 0));
    picture.scan(30, 0, 30, 30, (_x, _y, i) => void (picture.bitmap.data[i + 3] = 128));
    const png = await picture.getBuffer('image/png');
    const photo = await processOnWorker(new Uint8Array(png), 'png', { pool, gate: new AdmissionGate(1, 1) });
    const shown = await Jimp.fromBuffer(photo.display);
    const red = (x: number) => shown.bitmap.data[(15 * shown.width + x) * 4];
    expect(red(15)).toBeGreaterThan(245); // transparent black: white
    expect(red(45)).toBeGreaterThan(110); // half see-through black: grey
    expect(red(45)).toBeLessThan(145);
    expect(red(75)).toBeLessThan(10); // opaque black stays black
  });

  it('refuses a damaged file with a 400 naming the field', async () => {
    const cut = stripedPng(640, 480).subarray(0, 200);
    const err = await processOnWorker(new Uint8Array(cut), 'png', { pool, gate: new AdmissionGate(1, 1) }).catch(
      (e: unknown) => e,
    );
    expect((err as AppError).status).toBe(400);
    expect((err as AppError).fields[0]?.path).toBe('photo');
  });
});
