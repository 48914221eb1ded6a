import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';
import { brewDayVia, jpeg, uploadVia } from './fixtures';

describe('photos hidden by moderators', { timeout: 120_000 }, () => {
  it('vanish for everyone but their uploader and the moderators, in the brew day, the recipe page and the image route', async () => {
    const owner = await signedInClient();
    const reader = await signedInClient();
    const moderator = await signedInClient('moderator');
    const day = await brewDayVia(owner.client);
    const upload = await uploadVia(owner.client, day.brewDayId, await jpeg(800, 600), {
      caption: 'Suspicious picture',
    });
    expect(upload.status).toBe(201);
    const photoId = upload.body.id!;

    const report = await reader.client.post<{ id: string }>('/api/reports', {
      targetType: 'photo',
      targetId: photoId,
      reason: 'abuse',
      note: 'not beer',
    });
    expect(report.status).toBe(201);
    const hidden = await moderator.client.post(`/api/moderation/reports/${report.body.id}`, {
      action: 'hide',
      reason: 'Not a brewing photo',
    });
    expect(hidden.status).toBeLessThan(300);

    const anon = new TestClient();
    for (const viewer of [anon, reader.client]) {
      expect((await viewer.fetch(`/api/photos/${photoId}/thumb`)).status).toBe(404);
      expect(await (await viewer.fetch(`/brew-days/${day.brewDayId}`)).text()).not.toContain(photoId);
      expect(await (await viewer.fetch(`/recipes/${day.recipe.slug}`)).text()).not.toContain(photoId);
    }
    for (const viewer of [owner.client, moderator.client]) {
      expect((await viewer.fetch(`/api/photos/${photoId}/thumb`)).status).toBe(200);
      expect(await (await viewer.fetch(`/brew-days/${day.brewDayId}`)).text()).toContain(photoId);
    }
  });
});
