import { describe, expect, it } from 'vitest';
import { TestClient } from '../helpers/http';
import { signedInClient } from '../helpers/users';

const report = {
  name: 'Hillside spring, March 2026',
  calcium: 6,
  magnesium: 2,
  sodium: 4,
  chloride: 5,
  sulfate: 4,
  bicarbonate: 18,
};
const valid = {
  boilOffLPerHour: 3.5,
  trubLossL: 0.8,
  grainAbsorptionLPerKg: null,
  mashWaterLPerKg: 5.5,
  waterReport: report,
};

interface Answer {
  brewhouse: typeof valid & { batchVolumeL: number; efficiencyPct: number };
}

describe('the member’s losses and water report', () => {
  it('starts empty, keeps what is saved beside the settings’ batch volume and efficiency', async () => {
    const { client } = await signedInClient();
    const before = await client.get<Answer>('/api/me/brewhouse');
    expect(before.status).toBe(200);
    expect(before.body.brewhouse).toMatchObject({ boilOffLPerHour: null, waterReport: null, batchVolumeL: 20 });
    const saved = await client.put<Answer>('/api/me/brewhouse', valid);
    expect(saved.status).toBe(200);
    expect(saved.body.brewhouse).toMatchObject({ ...valid, batchVolumeL: 20, efficiencyPct: 72 });
    expect((await client.get<Answer>('/api/me/brewhouse')).body.brewhouse.waterReport).toEqual(report);
    const page = await (await client.fetch('/settings')).text();
    expect(page).toContain('Hillside spring, March 2026');
  });

  it('refuses bad input with a message per field and keeps what was saved', async () => {
    const { client } = await signedInClient();
    await client.put('/api/me/brewhouse', valid);
    const res = await client.put<{ error: { fields: { path: string; message: string }[] } }>('/api/me/brewhouse', {
      ...valid,
      mashWaterLPerKg: 0.2,
      waterReport: { ...report, name: '', sulfate: -3 },
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.map((f) => f.path).sort()).toEqual([
      'mashWaterLPerKg',
      'waterReport.name',
      'waterReport.sulfate',
    ]);
    expect((await client.get<Answer>('/api/me/brewhouse')).body.brewhouse).toMatchObject(valid);
  });

  it('is only for signed-in members', async () => {
    expect((await new TestClient().get('/api/me/brewhouse')).status).toBe(401);
  });
});
