import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DayKindDay, DayKindDayInput } from '../../shared/schemas/profile-settings';
import { settingsKeys } from '../api/profile-settings';
import { apiFetch } from '../api/client';

/** Sets the day kind of one date (null puts it back to the default); refreshes every cached day range. */
export function useSetDayKindDay(profileId: number | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ date, dayKindId }: { date: string } & DayKindDayInput) =>
      apiFetch<DayKindDay>(`/profiles/${profileId}/days/${date}`, { method: 'PUT', body: { dayKindId } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...settingsKeys.all, profileId ?? 0, 'days'] }),
  });
}
