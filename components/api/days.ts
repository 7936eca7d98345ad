import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DayKindDay, DayKindDayInput } from '../../shared/schemas/profile-settings';
import { apiFetch } from './client';
import { settingsKeys } from './profile-settings';

/** Day-kind dates live under the profile's settings key, so a settings or day-kind change refreshes them too. */
export const dayKeys = {
  lists: (profileId: number) => [...settingsKeys.all, profileId, 'days'] as const,
  list: (profileId: number, from: string, to: string) => settingsKeys.days(profileId, from, to),
};

export const fetchDayKindDays = (profileId: number, from: string, to: string) =>
  apiFetch<{ days: DayKindDay[] }>(`/profiles/${profileId}/days?from=${from}&to=${to}`).then((r) => r.days);
export const dayKindDaysQueryOptions = (profileId: number, from: string, to: string) =>
  queryOptions({ queryKey: dayKeys.list(profileId, from, to), queryFn: () => fetchDayKindDays(profileId, from, to) });

/** The day kind in force on each date from..to ("YYYY-MM-DD", inclusive). */
export function useDayKindDays(profileId: number | undefined, from: string, to: string) {
  return useQuery({ ...dayKindDaysQueryOptions(profileId ?? 0, from, to), enabled: !!profileId });
}

/** Sets the day kind of one date (null puts it back to the default); refreshes every cached day range. */
export function useSetDayKindDay(profileId: number | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ date, dayKindId }: { date: string } & DayKindDayInput) =>
      apiFetch<DayKindDay>(`/profiles/${profileId}/days/${date}`, { method: 'PUT', body: { dayKindId } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: dayKeys.lists(profileId ?? 0) }),
  });
}
