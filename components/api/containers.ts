import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Container, CreateContainerInput } from '../../shared/schemas/container';
import { apiFetch } from './client';

export const containerKeys = {
  all: ['containers'] as const,
  lists: () => [...containerKeys.all, 'list'] as const,
  list: (profileId: number) => [...containerKeys.lists(), profileId] as const,
};

export const fetchContainers = (profileId: number) => apiFetch<{ items: Container[] }>(`/profiles/${profileId}/containers`).then((r) => r.items);
export const containersQueryOptions = (profileId: number) =>
  queryOptions({ queryKey: containerKeys.list(profileId), queryFn: () => fetchContainers(profileId) });

/** A profile's saved pots and containers with their empty weights. */
export function useContainers(profileId: number | undefined) {
  return useQuery({ ...containersQueryOptions(profileId ?? 0), enabled: !!profileId });
}

export function useCreateContainer(profileId: number | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateContainerInput) => apiFetch<Container>(`/profiles/${profileId}/containers`, { method: 'POST', body: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: containerKeys.all }),
  });
}

export function useDeleteContainer(profileId: number | undefined) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiFetch<void>(`/profiles/${profileId}/containers/${id}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: containerKeys.all }),
  });
}
