import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PortionDetail, PortionStatus } from '../../shared/schemas/portion';
import { batchKeys } from './batches';
import { apiFetch } from './client';

export const portionKeys = {
  all: ['portions'] as const,
  detail: (code: string) => [...portionKeys.all, 'detail', code.trim()] as const,
};

/** A portion by the code on its label. */
export const fetchPortion = (code: string) => apiFetch<PortionDetail>(`/portions/${encodeURIComponent(code.trim())}`);
export const portionQueryOptions = (code: string) => queryOptions({ queryKey: portionKeys.detail(code), queryFn: () => fetchPortion(code) });

export function usePortion(code: string) {
  return useQuery(portionQueryOptions(code));
}

/** Looks a typed code up on demand (the dose check's "Use this portion"), through the same cache. */
export function usePortionLookup() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (code: string) => qc.fetchQuery(portionQueryOptions(code)) });
}

/** Marks a portion eaten or thrown away (once), or back to not eaten yet (`available`, the undo). */
export function useSetPortionStatus() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ code, status }: { code: string; status: PortionStatus }) =>
      apiFetch<PortionDetail>(`/portions/${encodeURIComponent(code)}/status`, { method: 'POST', body: { status } }),
    onSuccess: (portion) => {
      qc.setQueryData(portionKeys.detail(portion.code), portion);
      // The batch pages, the kitchen shelf and Today list portion states.
      void qc.invalidateQueries({ queryKey: batchKeys.all });
    },
  });
}
