import type { Metadata } from 'next';
import { requirePageViewer } from '@/lib/auth/page-guard';
import { getBrewhouse } from '@/lib/community/brewhouse';
import { getSettings } from '@/lib/community/settings';
import { BrewhouseSettings } from './_components/brewhouse-settings';
import { SettingsForm } from './_components/settings-form';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const viewer = await requirePageViewer('/settings');
  const [settings, brewhouse] = await Promise.all([getSettings(viewer), getBrewhouse(viewer)]);
  return (
    <div className="max-w-2xl">
      <h1 className="text-3xl font-semibold">Settings</h1>
      <p className="mt-1 font-sans text-sm text-muted">
        Signed in as @{settings.handle} ({settings.email}).
      </p>
      <SettingsForm initial={settings} />
      <BrewhouseSettings initial={brewhouse} units={settings.units} />
    </div>
  );
}
