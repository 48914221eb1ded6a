import { eq, sql } from 'drizzle-orm';
import { Jimp } from 'jimp';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/db';
import { moderationActions, photos } from '@/db/schema';
import { PHOTO_QUOTA_COUNT, uploadPhoto } from '@/lib/brew-days/photos';
import { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';
import {
  brewDayVia,
  jpeg,
  jpegBomb,
  jpegWithLocation,
  listBucket,
  photoRowCount,
  png,
  pngBomb,
  uploadVia,
  webp,
} from './fixtures';

type Owner = Awaited<ReturnType<typeof signedInClient>>;

describe('photo uploads', () => {
  let owner: Owner;
  let brewDayId: string;
  beforeAll(async () => {
    owner = await signedInClient();
    ({ brewDayId } = await brewDayVia(owner.client));
  });

  /** Runs a refused upload and checks that nothing was stored: no objects, no rows. */
  async function refused(
    run: () => Promise<{ status: number; body: { error?: { message: string; fields?: { path: string }[] } } }>,
    status: number,
  ) {
    // Keys are always under the brew day's prefix, so other test files uploading meanwhile do not disturb this.
    const keysBefore = await listBucket(`brew-days/${brewDayId}/`);
    const rowsBefore = await photoRowCount(brewDayId);
    const res = await run();
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    expect(res.body.error?.message).toBeTruthy();
    expect(await listBucket(`brew-days/${brewDayId}/`)).toEqual(keysBefore);
    expect(await photoRowCount(brewDayId)).toBe(rowsBefore);
    return res;
  }

  it('stores a JPEG as display and thumbnail JPEGs under server-chosen keys and serves them with nosniff', async () => {
    const res = await uploadVia(owner.client, brewDayId, await jpeg(2400, 1800), {
      caption: 'Mash in',
      name: '../../evil.php',
    });
    expect(res.status).toBe(201);
    const id = res.body.id!;
    const [row] = await db.select().from(photos).where(eq(photos.id, id));
    expect(row.displayKey).toMatch(new RegExp(`^brew-days/${brewDayId}/[0-9a-f-]{36}-display\\.jpg$`));
    expect(row.thumbKey).toMatch(/-thumb\.jpg$/);
    expect(await listBucket(`brew-days/${brewDayId}/`)).toEqual(expect.arrayContaining([row.displayKey, row.thumbKey]));
    expect([row.width, row.height]).toEqual([1600, 1200]);

    for (const size of ['display', 'thumb'] as const) {
      const served = await owner.client.fetch(`/api/photos/${id}/${size}`);
      expect(served.status).toBe(200);
      expect(served.headers.get('content-type')).toBe('image/jpeg');
      expect(served.headers.get('x-content-type-options')).toBe('nosniff');
      const image = await Jimp.fromBuffer(Buffer.from(await served.arrayBuffer()));
      expect(Math.max(image.width, image.height)).toBe(size === 'display' ? 1600 : 400);
    }
    // Anyone who can see the (public) recipe can see its photos.
    expect((await new TestClient().fetch(`/api/photos/${id}/thumb`)).status).toBe(200);
    expect((await owner.client.fetch(`/api/photos/${id}/original`)).status).toBe(404);
  });

  it('takes PNG and WebP, decided by content whatever the name or declared type says', async () => {
    const fromPng = await uploadVia(owner.client, brewDayId, await png(), { name: 'picture.gif', type: 'text/plain' });
    expect(fromPng.status).toBe(201);
    const fromWebp = await uploadVia(owner.client, brewDayId, await webp(), {
      name: 'picture.jpg',
      type: 'image/jpeg',
    });
    expect(fromWebp.status).toBe(201);
    const served = await owner.client.fetch(`/api/photos/${fromWebp.body.id}/display`);
    const bytes = Buffer.from(await served.arrayBuffer());
    expect([...bytes.subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
  });

  it('drops metadata, location included, by re-encoding', async () => {
    const original = await jpegWithLocation();
    expect(original.includes(Buffer.from('GPS 51.4769N'))).toBe(true);
    const res = await uploadVia(owner.client, brewDayId, original);
    expect(res.status).toBe(201);
    for (const size of ['display', 'thumb']) {
      const bytes = Buffer.from(await (await owner.client.fetch(`/api/photos/${res.body.id}/${size}`)).arrayBuffer());
      expect(bytes.includes(Buffer.from('GPS'))).toBe(false);
      expect(bytes.includes(Buffer.from('Exif'))).toBe(false);
    }
  });

  it('refuses a file that is not an image', async () => {
    const res = await refused(
      () =>
        uploadVia(owner.client, brewDayId, Buffer.from('#!/bin/sh\necho not a photo\n'), {
          name: 'photo.jpg',
          type: 'image/jpeg',
        }),
      400,
    );
    expect(res.body.error!.message).toMatch(/JPEG, PNG or WebP/);
    expect(res.body.error!.fields?.[0].path).toBe('photo');
  });

  it('refuses truncated JPEG and PNG files', async () => {
    const whole = await jpeg(800, 600);
    await refused(() => uploadVia(owner.client, brewDayId, whole.subarray(0, Math.floor(whole.length * 0.7))), 400);
    const wholePng = await png(400, 300);
    await refused(
      () => uploadVia(owner.client, brewDayId, wholePng.subarray(0, Math.floor(wholePng.length * 0.6))),
      400,
    );
    await refused(() => uploadVia(owner.client, brewDayId, whole.subarray(0, 40)), 400);
  });

  it('refuses decompression bombs from their header, before decoding', async () => {
    const bombPng = pngBomb();
    expect(bombPng.length).toBeLessThan(5000);
    const res = await refused(
      () => uploadVia(owner.client, brewDayId, bombPng, { type: 'image/png', name: 'bomb.png' }),
      413,
    );
    expect(res.body.error!.message).toContain('30000×30000');
    await refused(async () => uploadVia(owner.client, brewDayId, await jpegBomb()), 413);
  });

  it('refuses an 11 MB file from its Content-Length', async () => {
    const big = Buffer.alloc(11 * 1024 * 1024, 1);
    const res = await refused(() => uploadVia(owner.client, brewDayId, big), 413);
    expect(res.body.error!.message).toContain('10 MB');
  });

  it('refuses an 11 MB file sent without a Content-Length while reading it', async () => {
    const boundary = '----kettlefork-test-boundary';
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="photo"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
    );
    const chunk = Buffer.alloc(256 * 1024, 7);
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent === 0) controller.enqueue(head);
        if (sent >= 11 * 1024 * 1024) {
          controller.enqueue(Buffer.from(`\r\n--${boundary}--\r\n`));
          controller.close();
          return;
        }
        sent += chunk.length;
        controller.enqueue(chunk);
      },
    });
    await refused(async () => {
      const res = await owner.client.fetch(`/api/brew-days/${brewDayId}/photos`, {
        method: 'POST',
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
        body: stream,
        duplex: 'half',
      } as RequestInit);
      return { status: res.status, body: await res.json() };
    }, 413);
  });

  it('refuses a wrong field name and a body that is not a multipart form', async () => {
    const res = await refused(async () => uploadVia(owner.client, brewDayId, await jpeg(), { field: 'image' }), 400);
    expect(res.body.error!.message).toContain('"photo"');
    await refused(async () => {
      const r = await owner.client.json('POST', `/api/brew-days/${brewDayId}/photos`, { photo: 'base64…' });
      return r as never;
    }, 400);
  });

  it('refuses uploads by anyone but the brewer, and hides private brew days', async () => {
    const other = (await signedInClient()).client;
    const res = await refused(async () => uploadVia(other, brewDayId, await jpeg()), 403);
    expect(res.body.error!.message).toContain('brewer');
    await refused(async () => uploadVia(new TestClient(), brewDayId, await jpeg()), 401);
    const moderator = (await signedInClient('moderator')).client;
    await refused(async () => uploadVia(moderator, brewDayId, await jpeg()), 403);

    const secret = await brewDayVia(owner.client, { visibility: 'private' });
    const mine = await uploadVia(owner.client, secret.brewDayId, await jpeg(120, 90));
    expect(mine.status).toBe(201);
    expect((await uploadVia(other, secret.brewDayId, await jpeg())).status).toBe(404);
    expect((await other.fetch(`/api/photos/${mine.body.id}/thumb`)).status).toBe(404);
    expect((await owner.client.fetch(`/api/photos/${mine.body.id}/thumb`)).status).toBe(200);
  });

  it('refuses a cross-site upload', async () => {
    const form = new FormData();
    form.append('photo', new Blob([new Uint8Array(await jpeg())]), 'p.jpg');
    const keysBefore = await listBucket(`brew-days/${brewDayId}/`);
    const res = await owner.client.fetch(`/api/brew-days/${brewDayId}/photos`, {
      method: 'POST',
      body: form,
      headers: { origin: 'https://elsewhere.example' },
    });
    expect(res.status).toBe(403);
    expect(await listBucket(`brew-days/${brewDayId}/`)).toEqual(keysBefore);
  });

  it('keeps to the per-member quota', async () => {
    const member = await signedInClient();
    const day = await brewDayVia(member.client);
    // Fill the allowance with rows on another brew day of theirs (their objects are not needed for the count).
    const filler = await brewDayVia(member.client);
    await db.insert(photos).values(
      Array.from({ length: PHOTO_QUOTA_COUNT }, (_, i) => ({
        brewDayId: filler.brewDayId,
        uploaderId: member.user.id,
        displayKey: `quota-test/${i}-display.jpg`,
        thumbKey: `quota-test/${i}-thumb.jpg`,
        width: 10,
        height: 10,
        storedBytes: 100,
      })),
    );
    const res = await uploadVia(member.client, day.brewDayId, await jpeg(100, 80));
    expect(res.status).toBe(403);
    expect(res.body.error!.message).toContain('allowance');
    expect(await listBucket(`brew-days/${day.brewDayId}/`)).toEqual([]);
    expect(await photoRowCount(day.brewDayId)).toBe(0);
  });

  it('deletes the stored objects when the row cannot be written', async () => {
    const viewer = {
      id: owner.user.id,
      name: owner.user.name ?? '',
      email: owner.user.email,
      handle: owner.user.handle,
      role: owner.user.role,
      units: owner.user.units,
    };
    const keysBefore = await listBucket(`brew-days/${brewDayId}/`);
    const rowsBefore = await photoRowCount(brewDayId);
    // A caption longer than its column (the route would refuse it first) makes the insert fail after the objects are stored.
    await expect(uploadPhoto(viewer, brewDayId, await jpeg(200, 150), 'x'.repeat(500))).rejects.toThrow();
    expect(await listBucket(`brew-days/${brewDayId}/`)).toEqual(keysBefore);
    expect(await photoRowCount(brewDayId)).toBe(rowsBefore);
  });

  it('lets the brewer and moderators delete photos (row and objects), and nobody else', async () => {
    const first = await uploadVia(owner.client, brewDayId, await jpeg(300, 200));
    const second = await uploadVia(owner.client, brewDayId, await jpeg(300, 200));
    const [row] = await db.select().from(photos).where(eq(photos.id, first.body.id!));
    const other = (await signedInClient()).client;
    expect((await other.delete(`/api/photos/${first.body.id}`)).status).toBe(403);
    expect(await listBucket()).toEqual(expect.arrayContaining([row.displayKey, row.thumbKey]));

    expect((await owner.client.delete(`/api/photos/${first.body.id}`)).status).toBe(200);
    expect(await listBucket()).not.toEqual(expect.arrayContaining([row.displayKey]));
    expect(await listBucket()).not.toEqual(expect.arrayContaining([row.thumbKey]));
    expect((await owner.client.fetch(`/api/photos/${first.body.id}/thumb`)).status).toBe(404);

    const moderator = await signedInClient('moderator');
    expect((await moderator.client.delete(`/api/photos/${second.body.id}?reason=off-topic`)).status).toBe(200);
    const [logged] = await db
      .select()
      .from(moderationActions)
      .where(sql`${moderationActions.targetId} = ${second.body.id}`);
    expect(logged).toMatchObject({ actorId: moderator.user.id, action: 'delete_photo', reason: 'off-topic' });
    expect((await owner.client.delete(`/api/photos/${second.body.id}`)).status).toBe(404);
  });

  it("lists brew days with photo thumbnails on the recipe page and the brewer's page", async () => {
    const { recipe, brewDayId: day } = await brewDayVia(owner.client);
    const up = await uploadVia(owner.client, day, await jpeg(200, 150));
    expect(up.status).toBe(201);
    const page = await (await new TestClient().fetch(`/recipes/${recipe.slug}`)).text();
    expect(page).toContain(`/brew-days/${day}`);
    expect(page).toContain(`/api/photos/${up.body.id}/thumb`);
    const member = await (await new TestClient().fetch(`/members/${owner.user.handle}`)).text();
    expect(member).toContain(`/brew-days/${day}`);
    expect(member).toContain(`/api/photos/${up.body.id}/thumb`);
    // The thumbnail both pages show is served to a reader who is not signed in, as a JPEG.
    const thumb = await new TestClient().fetch(`/api/photos/${up.body.id}/thumb`);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toBe('image/jpeg');
    expect([...new Uint8Array(await thumb.arrayBuffer()).slice(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
  });
});
