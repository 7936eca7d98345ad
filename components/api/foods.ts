import { keepPreviousData, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreatePackFoodValues, DatasetImport, Food, FoodSearchPage, FoodSource } from '../../shared/schemas/food';
import { apiFetch, apiFetchBlob } from './client';
import { recipeKeys } from './recipes';

export type FoodFilters = { q: string; source?: FoodSource; group?: string; limit?: number };

export const foodKeys = {
  all: ['foods'] as const,
  lists: () => [...foodKeys.all, 'list'] as const,
  list: (filters: FoodFilters) => [...foodKeys.lists(), filters] as const,
  detail: (id: number) => [...foodKeys.all, 'detail', id] as const,
};
export const importKeys = { all: ['imports'] as const, detail: (id: number) => ['imports', id] as const };

/** Searches foods; the signal lets TanStack Query cancel a request the user has typed past. */
export function fetchFoods(filters: FoodFilters, signal?: AbortSignal, cursor?: string | null) {
  const params = new URLSearchParams({ q: filters.q, limit: String(filters.limit ?? 20) });
  if (cursor) params.set('cursor', cursor);
  if (filters.source) params.set('source', filters.source);
  if (filters.group) params.set('group', filters.group);
  return apiFetch<FoodSearchPage>(`/foods?${params.toString()}`, { signal });
}
export const fetchFood = (id: number) => apiFetch<{ food: Food }>(`/foods/${id}`).then((r) => r.food);
export const foodQueryOptions = (id: number) => queryOptions({ queryKey: foodKeys.detail(id), queryFn: () => fetchFood(id) });
export const foodSearchQueryOptions = (filters: FoodFilters) =>
  queryOptions({ queryKey: foodKeys.list(filters), queryFn: ({ signal }) => fetchFoods(filters, signal), staleTime: 5 * 60_000 });

/** Search results for already-debounced filters; keeps the previous hits on screen while the next ones load. */
export function useFoodSearch(filters: FoodFilters, enabled = true) {
  return useQuery({ ...foodSearchQueryOptions(filters), placeholderData: keepPreviousData, enabled });
}

/** Search results page by page ("Show more"), cancelling requests the user has typed past. */
export function useFoodSearchPages(filters: FoodFilters, enabled = true) {
  return useInfiniteQuery({
    queryKey: [...foodKeys.list(filters), 'pages'],
    queryFn: ({ signal, pageParam }) => fetchFoods(filters, signal, pageParam),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
    placeholderData: keepPreviousData,
    enabled,
    staleTime: 5 * 60_000,
  });
}

/** One food with measures, source and licence. */
export function useFood(id: number) {
  return useQuery({ ...foodQueryOptions(id), enabled: Number.isInteger(id) && id > 0 });
}

export type PackPhotoFile = { blob: Blob; name: string };

/** Adds a food from a package label (with the label photo when given). */
export function useCreatePackFood() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ values, photo }: { values: CreatePackFoodValues; photo?: PackPhotoFile | null }) => {
      if (!photo) return apiFetch<{ food: Food }>('/foods', { method: 'POST', body: values });
      const form = new FormData();
      form.append('data', JSON.stringify(values));
      form.append('photo', photo.blob, photo.name);
      return apiFetch<{ food: Food }>('/foods', { method: 'POST', body: form });
    },
    onSuccess: ({ food }) => {
      queryClient.setQueryData(foodKeys.detail(food.id), food);
      void queryClient.invalidateQueries({ queryKey: foodKeys.lists() });
    },
  });
}

/** Saves new values for one of your pack foods (JSON; the photo stays). Recipes count them from now on. */
export function useUpdatePackFood(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (values: CreatePackFoodValues) => apiFetch<{ food: Food }>(`/foods/${id}`, { method: 'PUT', body: values }),
    onSuccess: ({ food }) => {
      queryClient.setQueryData(foodKeys.detail(food.id), food);
      void queryClient.invalidateQueries({ queryKey: foodKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: recipeKeys.all });
    },
  });
}

/** Deletes one of your pack foods; a 409 names the recipes that still use it (`fieldErrors.recipes`). */
export function useDeletePackFood() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiFetch<void>(`/foods/${id}`, { method: 'DELETE' }),
    onSuccess: (_r, id) => {
      queryClient.removeQueries({ queryKey: foodKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: foodKeys.lists() });
    },
  });
}

/** The label photo as an object URL (the endpoint needs the bearer token, so a plain image URL will not do). */
export function useFoodPhoto(id: number, enabled: boolean) {
  return useQuery({
    queryKey: [...foodKeys.detail(id), 'photo'],
    enabled,
    staleTime: Infinity,
    queryFn: async () => URL.createObjectURL(await apiFetchBlob(`/foods/${id}/photo`)),
  });
}

/** Dataset imports, newest first (admins). */
export function useImports() {
  return useQuery({ queryKey: importKeys.all, queryFn: () => apiFetch<{ imports: DatasetImport[] }>('/admin/imports').then((r) => r.imports) });
}

/** One import, polled every second while it runs. */
export function useImport(id: number | null) {
  return useQuery({
    queryKey: importKeys.detail(id ?? 0),
    enabled: id != null,
    queryFn: () => apiFetch<{ import: DatasetImport }>(`/admin/imports/${id}`).then((r) => r.import),
    refetchInterval: (query) => (query.state.data?.status === 'running' || !query.state.data ? 1000 : false),
  });
}

/** Uploads dataset files and starts an import. */
export function useStartImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ kind, files }: { kind: 'fdc' | 'sr28'; files: File[] }) => {
      const form = new FormData();
      form.append('kind', kind);
      for (const f of files) form.append('files', f, f.name);
      return apiFetch<{ import: DatasetImport }>('/admin/imports', { method: 'POST', body: form }).then((r) => r.import);
    },
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: importKeys.all }),
  });
}
