import { queryOptions, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { RecipeDetail, RecipeInput, RecipeOffer, RecipePhoto, RecipeScope, RecipeSort, RecipeSummary } from '../../shared/schemas/recipe';
import { apiFetch, queryString } from './client';

export type RecipeFilters = { scope: RecipeScope; q: string; sort: RecipeSort; profileId?: number };
export type RecipeView = { profileId?: number; factor?: number; portions?: number };

export const recipeKeys = {
  all: ['recipes'] as const,
  lists: () => [...recipeKeys.all, 'list'] as const,
  list: (filters: RecipeFilters) => [...recipeKeys.lists(), filters] as const,
  /** Every shelf a profile may cook from (its own, shared with it, public). */
  cookable: (profileId: number) => [...recipeKeys.lists(), 'cookable', profileId] as const,
  details: () => [...recipeKeys.all, 'detail'] as const,
  detail: (id: number, view: RecipeView = {}) => [...recipeKeys.details(), id, view] as const,
};

export const fetchRecipes = (f: RecipeFilters) =>
  apiFetch<{ items: RecipeSummary[] }>(`/recipes${queryString({ scope: f.scope, q: f.q, sort: f.sort, profileId: f.profileId })}`).then((r) => r.items);
export const fetchRecipe = (id: number, v: RecipeView) =>
  apiFetch<RecipeDetail>(`/recipes/${id}${queryString({ profileId: v.profileId, factor: v.factor, portions: v.portions })}`);

/** The profile's own recipes, those shared with it and the public ones, each once. */
export async function fetchCookableRecipes(profileId: number) {
  const shelves = await Promise.all((['mine', 'shared', 'public'] as const).map((scope) => fetchRecipes({ scope, q: '', sort: 'recent', profileId })));
  const seen = new Set<number>();
  return shelves.flat().filter((r) => (seen.has(r.id) ? false : (seen.add(r.id), true)));
}

export const recipeListQueryOptions = (filters: RecipeFilters) => queryOptions({ queryKey: recipeKeys.list(filters), queryFn: () => fetchRecipes(filters) });
export const recipeQueryOptions = (id: number, view: RecipeView) =>
  queryOptions({ queryKey: recipeKeys.detail(id, view), queryFn: () => fetchRecipe(id, view) });
export const cookableRecipesQueryOptions = (profileId: number) =>
  queryOptions({ queryKey: recipeKeys.cookable(profileId), queryFn: () => fetchCookableRecipes(profileId) });

/** One library shelf from the server (search by title, tag and ingredient happens there too). */
export function useRecipes(filters: RecipeFilters, enabled = true) {
  return useQuery({ ...recipeListQueryOptions(filters), enabled, placeholderData: (prev) => prev });
}

/** One recipe with its computed breakdown in the profile's basis and unit. */
export function useRecipe(id: number | undefined, view: RecipeView, enabled = true) {
  return useQuery({ ...recipeQueryOptions(id ?? 0, view), enabled: enabled && !!id });
}

/** The recipes a profile can start a batch from. */
export function useCookableRecipes(profileId: number | undefined) {
  return useQuery({ ...cookableRecipesQueryOptions(profileId ?? 0), enabled: !!profileId });
}

/**
 * Every cached copy of recipes: library shelves, recipe pages and the cook screen's copy (a detail in the profile's
 * view) all live under recipeKeys.all, so one invalidation refreshes them all.
 */
export const invalidateRecipes = (qc: QueryClient) => qc.invalidateQueries({ queryKey: recipeKeys.all });

function useRecipeMutation<I, O>(mutationFn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => invalidateRecipes(qc) });
}

export const useCreateRecipe = () => useRecipeMutation((input: RecipeInput) => apiFetch<RecipeDetail>('/recipes', { method: 'POST', body: input }));

export const useUpdateRecipe = (id: number) =>
  useRecipeMutation((input: RecipeInput) => apiFetch<RecipeDetail>(`/recipes/${id}`, { method: 'PUT', body: input }));

export const useDeleteRecipe = () => useRecipeMutation((id: number) => apiFetch<void>(`/recipes/${id}`, { method: 'DELETE' }));

export const useCopyRecipe = () => useRecipeMutation((id: number) => apiFetch<RecipeDetail>(`/recipes/${id}/copy`, { method: 'POST' }));

export const useUploadRecipePhoto = (id: number) =>
  useRecipeMutation((file: Blob) => {
    const form = new FormData();
    form.append('photo', file, 'photo');
    return apiFetch<RecipePhoto>(`/recipes/${id}/photo`, { method: 'PUT', body: form });
  });

export const useShareRecipe = (id: number) =>
  useRecipeMutation((email: string) => apiFetch<{ status: 'offered' }>(`/recipes/${id}/shares`, { method: 'POST', body: { email } }));

export const offerKeys = { mine: ['recipe-offers'] as const };

/** Recipes offered to me and not yet answered. */
export function useRecipeOffers() {
  return useQuery({ queryKey: offerKeys.mine, queryFn: () => apiFetch<{ items: RecipeOffer[] }>('/recipe-offers').then((r) => r.items) });
}

/** Accepts (the recipe joins my shared shelf) or declines an offer. */
export function useAnswerOffer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, accept }: { id: number; accept: boolean }) => apiFetch<void>(`/recipe-offers/${id}/${accept ? 'accept' : 'decline'}`, { method: 'POST' }),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}

export const useRevokeShare = (id: number) =>
  useRecipeMutation((userId: number) => apiFetch<void>(`/recipes/${id}/shares/${userId}`, { method: 'DELETE' }));
