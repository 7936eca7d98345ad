import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Me } from '../../shared/schemas/auth';
import { clinicianDeskSchema, peopleOfferResultSchema } from '../../shared/schemas/clinician-desk';
import { useMe } from './auth';
import { apiFetch } from './client';
import { recipeKeys } from './recipes';

export const clinicianDeskKeys = { all: ['clinician-desk'] as const };

/** The desk: the people the signed-in account supports as clinician, and invitations waiting for its address. */
export const fetchClinicianDesk = async () => clinicianDeskSchema.parse(await apiFetch<unknown>('/clinician-desk'));

/** True for an account with the clinician role or clinician access to at least one profile: the desk is for them. */
export function isClinicianAccount(me: Me | undefined): boolean {
  return !!me && (me.user.role === 'clinician' || me.profiles.some((p) => p.access === 'clinician'));
}

/** Whether the signed-in account gets the clinician's desk (read from /me, no extra request). */
export function useIsClinician(): boolean {
  return isClinicianAccount(useMe().data);
}

export function useClinicianDesk() {
  return useQuery({ queryKey: clinicianDeskKeys.all, queryFn: fetchClinicianDesk });
}

/** Offers a recipe the clinician owns to every person they support (each accepts or declines). */
export function useOfferToMyPeople(recipeId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => peopleOfferResultSchema.parse(await apiFetch<unknown>(`/recipes/${recipeId}/offers-to-my-people`, { method: 'POST' })),
    // A private recipe becomes shared, and its open offers are listed on its page.
    onSuccess: () => qc.invalidateQueries({ queryKey: recipeKeys.all }),
  });
}
