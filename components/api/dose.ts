import { useMutation } from '@tanstack/react-query';
import type { DoseRequest, DoseSuggestion } from '../../shared/schemas/dose';
import { apiFetch } from './client';

export const fetchDoseSuggestion = (profileId: number, input: DoseRequest) =>
  apiFetch<DoseSuggestion>(`/profiles/${profileId}/dose-suggestions`, { method: 'POST', body: input });

/** Asks the server (the authority) for a dose suggestion; nothing is saved. */
export function useDoseSuggestion(profileId: number) {
  return useMutation({ mutationFn: (input: DoseRequest) => fetchDoseSuggestion(profileId, input) });
}
