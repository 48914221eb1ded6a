'use client';

import { useQuery } from '@tanstack/react-query';
import { fitTargetFor, type FitTarget } from '@/lib/brewing/fit-target';
import type { BrewhouseCalibration } from '@/lib/brew-days/calibration';
import type { MemberBrewhouse } from '@/lib/community/brewhouse-schema';
import { requestJson } from '@/lib/http/client';

export const brewhouseKeys = { all: ['me', 'brewhouse'] as const, averages: ['me', 'brew-averages'] as const };

type BrewAverages = Pick<BrewhouseCalibration, 'efficiency' | 'calibration'>;

async function getJson<T>(url: string, what: string): Promise<T> {
  const result = await requestJson<T>(url, 'GET', undefined, { cache: 'no-store' });
  if (result.ok) return result.data;
  if (result.status === 401) throw new Error(`Sign in to use your ${what}.`);
  throw new Error(`Your ${what} could not be loaded. Try again in a moment.`);
}

/** The signed-in member's brewhouse: batch volume, efficiency, losses and water report from settings. */
export function useBrewhouse(enabled = true) {
  return useQuery({
    queryKey: brewhouseKeys.all,
    enabled,
    queryFn: async () => (await getJson<{ brewhouse: MemberBrewhouse }>('/api/me/brewhouse', 'settings')).brewhouse,
  });
}

/** The signed-in member's figures learnt from their brew days (efficiency, attenuation per yeast kind). */
export function useBrewAverages(enabled = true) {
  return useQuery({
    queryKey: brewhouseKeys.averages,
    enabled,
    queryFn: () => getJson<BrewAverages>('/api/me/brew-averages', 'brew-day averages'),
  });
}

/** What "Fit to my brewhouse" fits to: settings, with measured efficiency from two brew days or more. */
export function useFitTarget(enabled: boolean) {
  const brewhouse = useBrewhouse(enabled);
  const averages = useBrewAverages(enabled);
  const fit: FitTarget | undefined =
    brewhouse.data && averages.data ? fitTargetFor(brewhouse.data, averages.data.efficiency) : undefined;
  return {
    fit,
    isLoading: brewhouse.isLoading || averages.isLoading,
    error: brewhouse.error ?? averages.error,
  };
}
