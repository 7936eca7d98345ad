import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DayKind, DayKindInput, ProfileSettingsInput, ProfileSettingsView, SettingsChange } from '../../shared/schemas/profile-settings';
import { authKeys } from './auth';
import { apiFetch } from './client';

export const settingsKeys = {
  all: ['profile-settings'] as const,
  settings: (profileId: number) => [...settingsKeys.all, profileId, 'settings'] as const,
  dayKinds: (profileId: number) => [...settingsKeys.all, profileId, 'day-kinds'] as const,
  history: (profileId: number) => [...settingsKeys.all, profileId, 'history'] as const,
  days: (profileId: number, from: string, to: string) => [...settingsKeys.all, profileId, 'days', from, to] as const,
};

export const fetchSettings = (profileId: number) => apiFetch<ProfileSettingsView>(`/profiles/${profileId}/settings`);
export const fetchDayKinds = (profileId: number) => apiFetch<{ dayKinds: DayKind[] }>(`/profiles/${profileId}/day-kinds`).then((r) => r.dayKinds);
export const fetchHistory = (profileId: number) =>
  apiFetch<{ changes: SettingsChange[] }>(`/profiles/${profileId}/settings/history`).then((r) => r.changes);

export const settingsQueryOptions = (profileId: number) => queryOptions({ queryKey: settingsKeys.settings(profileId), queryFn: () => fetchSettings(profileId) });
export const dayKindsQueryOptions = (profileId: number) => queryOptions({ queryKey: settingsKeys.dayKinds(profileId), queryFn: () => fetchDayKinds(profileId) });

/** Units and safety limits of a profile (settings null until set up). */
export function useProfileSettings(profileId: number | undefined) {
  return useQuery({ ...settingsQueryOptions(profileId ?? 0), enabled: !!profileId });
}

/** The profile's day kinds with their times of day. */
export function useDayKinds(profileId: number | undefined) {
  return useQuery({ ...dayKindsQueryOptions(profileId ?? 0), enabled: !!profileId });
}

/** Every recorded change to settings and day kinds, newest first. */
export function useSettingsHistory(profileId: number | undefined) {
  return useQuery({ queryKey: settingsKeys.history(profileId ?? 0), queryFn: () => fetchHistory(profileId!), enabled: !!profileId });
}

function useInvalidate(profileId: number) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: [...settingsKeys.all, profileId] });
    void queryClient.invalidateQueries({ queryKey: authKeys.me() });
  };
}

export function useUpdateSettings(profileId: number) {
  const invalidate = useInvalidate(profileId);
  return useMutation({
    mutationFn: (input: ProfileSettingsInput) => apiFetch<ProfileSettingsView>(`/profiles/${profileId}/settings`, { method: 'PUT', body: input }),
    onSuccess: invalidate,
  });
}

export function useSaveDayKind(profileId: number, dayKindId: number | null) {
  const invalidate = useInvalidate(profileId);
  return useMutation({
    mutationFn: (input: DayKindInput) =>
      dayKindId
        ? apiFetch<DayKind>(`/profiles/${profileId}/day-kinds/${dayKindId}`, { method: 'PUT', body: input })
        : apiFetch<DayKind>(`/profiles/${profileId}/day-kinds`, { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useDeleteDayKind(profileId: number) {
  const invalidate = useInvalidate(profileId);
  return useMutation({
    mutationFn: (dayKindId: number) => apiFetch<void>(`/profiles/${profileId}/day-kinds/${dayKindId}`, { method: 'DELETE' }),
    onSuccess: invalidate,
  });
}
