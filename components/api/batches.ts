import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { BatchDetail, BatchSummary, CreateBatchInput, UpdateBatchInput } from '../../shared/schemas/batch';
import type { LabelSheet } from '../../shared/schemas/portion';
import { apiFetch } from './client';
import { portionKeys } from './portions';

export type BatchListFilters = { profileId: number; include: 'available' | 'all' };

export const batchKeys = {
  all: ['batches'] as const,
  lists: () => [...batchKeys.all, 'list'] as const,
  list: (filters: BatchListFilters) => [...batchKeys.lists(), filters] as const,
  details: () => [...batchKeys.all, 'detail'] as const,
  detail: (profileId: number, id: number) => [...batchKeys.details(), profileId, id] as const,
  labels: (profileId: number, id: number) => [...batchKeys.all, 'labels', profileId, id] as const,
};

export const fetchBatches = ({ profileId, include }: BatchListFilters) =>
  apiFetch<{ items: BatchSummary[] }>(`/profiles/${profileId}/batches?include=${include}`).then((r) => r.items);
export const fetchBatch = (profileId: number, id: number) => apiFetch<BatchDetail>(`/profiles/${profileId}/batches/${id}`);
export const fetchLabels = (profileId: number, id: number) => apiFetch<LabelSheet>(`/profiles/${profileId}/batches/${id}/labels`);

export const batchListQueryOptions = (filters: BatchListFilters) => queryOptions({ queryKey: batchKeys.list(filters), queryFn: () => fetchBatches(filters) });
export const batchQueryOptions = (profileId: number, id: number) =>
  queryOptions({ queryKey: batchKeys.detail(profileId, id), queryFn: () => fetchBatch(profileId, id) });
export const labelSheetQueryOptions = (profileId: number, id: number) =>
  queryOptions({ queryKey: batchKeys.labels(profileId, id), queryFn: () => fetchLabels(profileId, id) });

/** The inventory: batches with portions left (or every batch). */
export function useBatches(profileId: number | undefined, include: 'available' | 'all' = 'all') {
  return useQuery({ ...batchListQueryOptions({ profileId: profileId ?? 0, include }), enabled: !!profileId });
}

export function useBatch(profileId: number | undefined, id: number) {
  return useQuery({ ...batchQueryOptions(profileId ?? 0, id), enabled: !!profileId });
}

export function useLabelSheet(profileId: number | undefined, id: number) {
  return useQuery({ ...labelSheetQueryOptions(profileId ?? 0, id), enabled: !!profileId });
}

/** Batches, their label sheets and their portions are shown in many places: a change to one refreshes them all. */
export function invalidateBatches(qc: QueryClient) {
  void qc.invalidateQueries({ queryKey: batchKeys.all });
  void qc.invalidateQueries({ queryKey: portionKeys.all });
}

export function useCreateBatch(profileId: number | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateBatchInput) => apiFetch<BatchDetail>(`/profiles/${profileId}/batches`, { method: 'POST', body: input }),
    onSuccess: (batch) => {
      invalidateBatches(qc);
      qc.setQueryData(batchKeys.detail(batch.profileId, batch.id), batch);
    },
  });
}

export function useUpdateBatch(profileId: number, id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateBatchInput) => apiFetch<BatchDetail>(`/profiles/${profileId}/batches/${id}`, { method: 'PATCH', body: input }),
    onSuccess: (batch) => {
      invalidateBatches(qc);
      qc.setQueryData(batchKeys.detail(profileId, id), batch);
    },
  });
}
