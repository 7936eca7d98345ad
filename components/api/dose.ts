import { useMutation } from '@tanstack/react-query';
import type { DoseRequest, DoseSuggestion } from '../../shared/schemas/dose';
import type { PortionDetail } from '../../shared/schemas/portion';
import { apiFetch } from './client';

export const fetchDoseSuggestion = (profileId: number, input: DoseRequest) =>
  apiFetch<DoseSuggestion>(`/profiles/${profileId}/dose-suggestions`, { method: 'POST', body: input });

/** Asks the server (the authority) for a dose suggestion; nothing is saved. */
export function useDoseSuggestion(profileId: number) {
  return useMutation({ mutationFn: (input: DoseRequest) => fetchDoseSuggestion(profileId, input) });
}

/** A portion by its label code, for filling in the carbohydrate of a dose check. */
export const fetchPortionForDose = (code: string) => apiFetch<PortionDetail>(`/portions/${encodeURIComponent(code.trim())}`);

export function usePortionLookup() {
  return useMutation({ mutationFn: fetchPortionForDose });
}
