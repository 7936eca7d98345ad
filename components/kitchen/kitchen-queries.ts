import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BatchDetail, BatchSummary, CreateBatchInput } from '../../shared/schemas/batch';
import type { Container, CreateContainerInput } from '../../shared/schemas/container';
import type { LabelSheet, PortionDetail } from '../../shared/schemas/portion';
import type { FoodSearchPage } from '../../shared/schemas/food';
import type { RecipeDetail, RecipeSummary } from '../../shared/schemas/recipe';
import { apiFetch } from '../api/client';

export const kitchenKeys = {
  all: ['kitchen'] as const,
  batches: (profileId: number) => [...kitchenKeys.all, profileId, 'batches'] as const,
  batchList: (profileId: number, include: 'available' | 'all') => [...kitchenKeys.batches(profileId), 'list', include] as const,
  batch: (profileId: number, id: number) => [...kitchenKeys.batches(profileId), 'detail', id] as const,
  labels: (profileId: number, id: number) => [...kitchenKeys.batches(profileId), 'labels', id] as const,
  containers: (profileId: number) => [...kitchenKeys.all, profileId, 'containers'] as const,
  portion: (code: string) => [...kitchenKeys.all, 'portion', code] as const,
  recipes: () => [...kitchenKeys.all, 'recipes'] as const,
  recipe: (id: number, profileId: number) => [...kitchenKeys.all, 'recipe', id, profileId] as const,
  foods: (q: string) => [...kitchenKeys.all, 'foods', q] as const,
};

export const fetchBatches = (profileId: number, include: 'available' | 'all') =>
  apiFetch<{ items: BatchSummary[] }>(`/profiles/${profileId}/batches?include=${include}`).then((r) => r.items);
export const fetchBatch = (profileId: number, id: number) => apiFetch<BatchDetail>(`/profiles/${profileId}/batches/${id}`);
export const fetchLabels = (profileId: number, id: number) => apiFetch<LabelSheet>(`/profiles/${profileId}/batches/${id}/labels`);
export const fetchContainers = (profileId: number) =>
  apiFetch<{ items: Container[] }>(`/profiles/${profileId}/containers`).then((r) => r.items);
export const fetchPortion = (code: string) => apiFetch<PortionDetail>(`/portions/${encodeURIComponent(code)}`);

export const batchQueryOptions = (profileId: number, id: number) =>
  queryOptions({ queryKey: kitchenKeys.batch(profileId, id), queryFn: () => fetchBatch(profileId, id) });

/** The inventory: batches with portions left (or every batch). */
export function useBatches(profileId: number | undefined, include: 'available' | 'all' = 'all') {
  return useQuery({
    queryKey: kitchenKeys.batchList(profileId ?? 0, include),
    queryFn: () => fetchBatches(profileId!, include),
    enabled: !!profileId,
  });
}

export function useBatch(profileId: number | undefined, id: number) {
  return useQuery({ ...batchQueryOptions(profileId ?? 0, id), enabled: !!profileId });
}

export function useLabelSheet(profileId: number | undefined, id: number) {
  return useQuery({ queryKey: kitchenKeys.labels(profileId ?? 0, id), queryFn: () => fetchLabels(profileId!, id), enabled: !!profileId });
}

export function useContainers(profileId: number | undefined) {
  return useQuery({ queryKey: kitchenKeys.containers(profileId ?? 0), queryFn: () => fetchContainers(profileId!), enabled: !!profileId });
}

export function usePortion(code: string) {
  return useQuery({ queryKey: kitchenKeys.portion(code), queryFn: () => fetchPortion(code) });
}

/** The cook's own recipes and the public ones, to start a batch from. */
export function useRecipesToCook(profileId: number | undefined) {
  return useQuery({
    queryKey: kitchenKeys.recipes(),
    enabled: !!profileId,
    queryFn: async () => {
      const [mine, shared, pub] = await Promise.all(
        (['mine', 'shared', 'public'] as const).map((scope) =>
          apiFetch<{ items: RecipeSummary[] } | RecipeSummary[]>(`/recipes?scope=${scope}&profileId=${profileId}`).then((r) =>
            Array.isArray(r) ? r : r.items,
          ),
        ),
      );
      const seen = new Set<number>();
      return [...mine, ...shared, ...pub].filter((r) => (seen.has(r.id) ? false : (seen.add(r.id), true)));
    },
  });
}

/** A recipe with its foods' per-100 g values, optionally scaled, in the profile's basis and unit. */
export function useRecipeToCook(id: number, profileId: number | undefined) {
  return useQuery({
    queryKey: kitchenKeys.recipe(id, profileId ?? 0),
    queryFn: () => apiFetch<RecipeDetail>(`/recipes/${id}?profileId=${profileId}`),
    enabled: !!profileId && id > 0,
  });
}

/** Food search for swapping an ingredient. */
export function useFoodSearch(q: string) {
  return useQuery({
    queryKey: kitchenKeys.foods(q),
    queryFn: () => apiFetch<FoodSearchPage>(`/foods?q=${encodeURIComponent(q)}`),
    enabled: q.trim().length >= 2,
  });
}

export function useCreateBatch(profileId: number | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateBatchInput) => apiFetch<BatchDetail>(`/profiles/${profileId}/batches`, { method: 'POST', body: input }),
    onSuccess: (batch) => {
      queryClient.invalidateQueries({ queryKey: kitchenKeys.batches(batch.profileId) });
      queryClient.setQueryData(kitchenKeys.batch(batch.profileId, batch.id), batch);
    },
  });
}

export function useUpdateBatch(profileId: number, id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { storage?: 'fridge' | 'freezer'; useBy?: string; region?: 'uk' | 'us' }) =>
      apiFetch<BatchDetail>(`/profiles/${profileId}/batches/${id}`, { method: 'PATCH', body: input }),
    onSuccess: (batch) => {
      queryClient.invalidateQueries({ queryKey: kitchenKeys.batches(profileId) });
      queryClient.setQueryData(kitchenKeys.batch(profileId, id), batch);
    },
  });
}

export function useCreateContainer(profileId: number | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateContainerInput) => apiFetch<Container>(`/profiles/${profileId}/containers`, { method: 'POST', body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitchenKeys.containers(profileId ?? 0) }),
  });
}

export function useDeleteContainer(profileId: number | undefined) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiFetch<void>(`/profiles/${profileId}/containers/${id}`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: kitchenKeys.containers(profileId ?? 0) }),
  });
}

/** Marks a portion eaten or thrown away (the server lets this happen once). */
export function useSetPortionStatus() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ code, status }: { code: string; status: 'eaten' | 'discarded' }) =>
      apiFetch<PortionDetail>(`/portions/${encodeURIComponent(code)}/status`, { method: 'POST', body: { status } }),
    onSuccess: (portion) => {
      queryClient.setQueryData(kitchenKeys.portion(portion.code), portion);
      queryClient.invalidateQueries({ queryKey: kitchenKeys.batches(portion.profileId) });
    },
  });
}
