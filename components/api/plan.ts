import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  NextPlanMeal, PlanMealInput, PlanSettings, PlanSettingsInput, PlanWeek, PlannedCookInput, ShoppingList, ShoppingTickInput,
} from '../../shared/schemas/plan';
import { invalidateBatches } from './batches';
import { apiFetch, apiFetchBlob, queryString } from './client';

export const planKeys = {
  all: ['plan'] as const,
  week: (profileId: number, date: string | undefined) => [...planKeys.all, profileId, 'week', date ?? 'today'] as const,
  next: (profileId: number) => [...planKeys.all, profileId, 'next-meal'] as const,
  settings: (profileId: number) => [...planKeys.all, profileId, 'settings'] as const,
  shopping: (profileId: number, date: string | undefined) => [...planKeys.all, profileId, 'shopping', date ?? 'today'] as const,
};

export const planWeekQueryOptions = (profileId: number, date?: string) =>
  queryOptions({ queryKey: planKeys.week(profileId, date), queryFn: () => apiFetch<PlanWeek>(`/profiles/${profileId}/plan/week${queryString({ date })}`) });

/** The week holding `date` (today when not given) with its numbers and warnings. */
export function usePlanWeek(profileId: number | undefined, date?: string) {
  return useQuery({ ...planWeekQueryOptions(profileId ?? 0, date), enabled: !!profileId });
}

/** The next planned meal not yet logged: the logging flow offers it first. */
export function useNextPlanMeal(profileId: number | undefined) {
  return useQuery({ queryKey: planKeys.next(profileId ?? 0), queryFn: () => apiFetch<NextPlanMeal>(`/profiles/${profileId}/plan/next-meal`), enabled: !!profileId });
}

/** Week start, weekly pattern and named meals. */
export function usePlanSettings(profileId: number | undefined) {
  return useQuery({ queryKey: planKeys.settings(profileId ?? 0), queryFn: () => apiFetch<PlanSettings>(`/profiles/${profileId}/plan/settings`), enabled: !!profileId });
}

/** Every plan query of the profile (and the inventory: planned cooks turn into batches) is refreshed after a change. */
function usePlanMutation<I, O>(profileId: number | undefined, fn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: [...planKeys.all, profileId ?? 0] });
      invalidateBatches(qc);
    },
  });
}

export const useSavePlanSettings = (profileId: number | undefined) =>
  usePlanMutation(profileId, (input: PlanSettingsInput) => apiFetch<PlanSettings>(`/profiles/${profileId}/plan/settings`, { method: 'PUT', body: input }));

export const useCreatePlanMeal = (profileId: number | undefined) =>
  usePlanMutation(profileId, (input: PlanMealInput) => apiFetch<{ ids: number[] }>(`/profiles/${profileId}/plan/meals`, { method: 'POST', body: input }));

export const useDeletePlanMeal = (profileId: number | undefined) =>
  usePlanMutation(profileId, (id: number) => apiFetch<void>(`/profiles/${profileId}/plan/meals/${id}`, { method: 'DELETE' }));

export const useCreatePlannedCook = (profileId: number | undefined) =>
  usePlanMutation(profileId, (input: PlannedCookInput) => apiFetch<{ id: number }>(`/profiles/${profileId}/plan/cooks`, { method: 'POST', body: input }));

export const useDeletePlannedCook = (profileId: number | undefined) =>
  usePlanMutation(profileId, (id: number) => apiFetch<void>(`/profiles/${profileId}/plan/cooks/${id}`, { method: 'DELETE' }));

/** The shopping list of the week holding `date`. */
export function useShoppingList(profileId: number | undefined, date?: string) {
  return useQuery({
    queryKey: planKeys.shopping(profileId ?? 0, date),
    queryFn: () => apiFetch<ShoppingList>(`/profiles/${profileId}/plan/shopping-list${queryString({ date })}`),
    enabled: !!profileId,
  });
}

export const useShoppingTick = (profileId: number | undefined) =>
  usePlanMutation(profileId, (input: ShoppingTickInput) => apiFetch<{ ticked: boolean }>(`/profiles/${profileId}/plan/shopping-list/ticks`, { method: 'PUT', body: input }));

/** The shopping list as a CSV file (behind the bearer token). */
export const fetchShoppingCsv = (profileId: number, date: string) => apiFetchBlob(`/profiles/${profileId}/plan/shopping-list.csv${queryString({ date })}`);
