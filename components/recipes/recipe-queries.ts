import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { FoodSearchPage } from '../../shared/schemas/food';
import type {
  RecipeDetail,
  RecipeInput,
  RecipePhoto,
  RecipeScope,
  RecipeShare,
  RecipeSort,
  RecipeSummary,
} from '../../shared/schemas/recipe';
import { apiFetch } from '../api/client';

export type RecipeFilters = { scope: RecipeScope; q: string; sort: RecipeSort; profileId?: number };
export type RecipeView = { profileId?: number; factor?: number; portions?: number };

export const recipeKeys = {
  all: ['recipes'] as const,
  lists: () => [...recipeKeys.all, 'list'] as const,
  list: (filters: RecipeFilters) => [...recipeKeys.lists(), filters] as const,
  details: () => [...recipeKeys.all, 'detail'] as const,
  detail: (id: number, view: RecipeView) => [...recipeKeys.details(), id, view] as const,
  foods: (q: string) => ['foods', 'search', q] as const,
};

const query = (params: Record<string, string | number | undefined>) => {
  const parts = Object.entries(params)
    .filter(([, v]) => v !== undefined && v !== '')
    .map(([k, v]) => `${k}=${encodeURIComponent(String(v))}`);
  return parts.length ? `?${parts.join('&')}` : '';
};

export const fetchRecipes = (f: RecipeFilters) =>
  apiFetch<{ items: RecipeSummary[] }>(`/recipes${query({ scope: f.scope, q: f.q, sort: f.sort, profileId: f.profileId })}`).then((r) => r.items);
export const fetchRecipe = (id: number, v: RecipeView) =>
  apiFetch<RecipeDetail>(`/recipes/${id}${query({ profileId: v.profileId, factor: v.factor, portions: v.portions })}`);

export const recipeQueryOptions = (id: number, view: RecipeView) =>
  queryOptions({ queryKey: recipeKeys.detail(id, view), queryFn: () => fetchRecipe(id, view) });

/** One library shelf from the server (search by title, tag and ingredient happens there too). */
export function useRecipes(filters: RecipeFilters, enabled = true) {
  return useQuery({ queryKey: recipeKeys.list(filters), queryFn: () => fetchRecipes(filters), enabled, placeholderData: (prev) => prev });
}

/** One recipe with its computed breakdown in the profile's basis and unit. */
export function useRecipe(id: number | undefined, view: RecipeView, enabled = true) {
  return useQuery({ ...recipeQueryOptions(id ?? 0, view), enabled: enabled && !!id });
}

/** Food search for the ingredient picker (the foods API, ranked by the server). */
export function useFoodSearch(q: string) {
  return useQuery({
    queryKey: recipeKeys.foods(q),
    queryFn: () => apiFetch<FoodSearchPage>(`/foods${query({ q, limit: 8 })}`),
    enabled: q.trim().length >= 2,
    placeholderData: (prev) => prev,
  });
}

function useInvalidate() {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: recipeKeys.all });
}

export function useCreateRecipe() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (input: RecipeInput) => apiFetch<RecipeDetail>('/recipes', { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useUpdateRecipe(id: number) {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (input: RecipeInput) => apiFetch<RecipeDetail>(`/recipes/${id}`, { method: 'PUT', body: input }),
    onSuccess: invalidate,
  });
}

export function useDeleteRecipe() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (id: number) => apiFetch<void>(`/recipes/${id}`, { method: 'DELETE' }), onSuccess: invalidate });
}

export function useCopyRecipe() {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (id: number) => apiFetch<RecipeDetail>(`/recipes/${id}/copy`, { method: 'POST' }),
    onSuccess: invalidate,
  });
}

export function useUploadRecipePhoto(id: number) {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (file: Blob) => {
      const form = new FormData();
      form.append('photo', file, 'photo');
      return apiFetch<RecipePhoto>(`/recipes/${id}/photo`, { method: 'PUT', body: form });
    },
    onSuccess: invalidate,
  });
}

export function useShareRecipe(id: number) {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (email: string) => apiFetch<{ items: RecipeShare[] }>(`/recipes/${id}/shares`, { method: 'POST', body: { email } }),
    onSuccess: invalidate,
  });
}

export function useRevokeShare(id: number) {
  const invalidate = useInvalidate();
  return useMutation({
    mutationFn: (userId: number) => apiFetch<void>(`/recipes/${id}/shares/${userId}`, { method: 'DELETE' }),
    onSuccess: invalidate,
  });
}
