import { settingsSchema } from '@/lib/community/schemas';
import { getSettings, updateSettings } from '@/lib/community/settings';
import { route } from '@/lib/http/route';

// GET /api/me/settings – the member's profile, units, brewhouse defaults and e-mail choices
export const GET = route({ access: 'user' }, async ({ viewer }) => ({ settings: await getSettings(viewer) }));

// PUT /api/me/settings – change them all at once
export const PUT = route({ access: 'user', body: settingsSchema }, async ({ viewer, body }) => ({
  settings: await updateSettings(viewer, body),
}));

export const dynamic = 'force-dynamic';
