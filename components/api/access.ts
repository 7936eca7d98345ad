import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AccessChangeInput, AuditEntry, InvitationInput, InvitationPreview, ManagedProfileInput, OpenInvitation, ProfileAccessList } from '../../shared/schemas/access';
import type { Me } from '../../shared/schemas/auth';
import { authKeys, switchProfile } from './auth';
import { apiFetch } from './client';

export const accessKeys = {
  all: ['access'] as const,
  list: (profileId: number) => [...accessKeys.all, profileId, 'list'] as const,
  audit: (profileId: number) => [...accessKeys.all, profileId, 'audit'] as const,
  invitation: (token: string) => [...accessKeys.all, 'invitation', token] as const,
};

/** Everyone with access to the profile and the open invitations (owner only). */
export function useProfileAccess(profileId: number | undefined) {
  return useQuery({
    queryKey: accessKeys.list(profileId ?? 0),
    queryFn: () => apiFetch<ProfileAccessList>(`/profiles/${profileId}/access`),
    enabled: !!profileId,
  });
}

/** Grants, changes, revocations and settings changes on the profile, newest first. */
export function useAccessAudit(profileId: number | undefined) {
  return useQuery({
    queryKey: accessKeys.audit(profileId ?? 0),
    queryFn: () => apiFetch<{ entries: AuditEntry[] }>(`/profiles/${profileId}/audit`).then((r) => r.entries),
    enabled: !!profileId,
  });
}

function useAccessMutation<T>(profileId: number, fn: (input: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...accessKeys.all, profileId] }),
  });
}

export const useInvite = (profileId: number) =>
  useAccessMutation(profileId, (input: InvitationInput) => apiFetch<OpenInvitation>(`/profiles/${profileId}/invitations`, { method: 'POST', body: input }));

export const useCancelInvitation = (profileId: number) =>
  useAccessMutation(profileId, (id: number) => apiFetch<void>(`/profiles/${profileId}/invitations/${id}`, { method: 'DELETE' }));

export const useChangeAccess = (profileId: number) =>
  useAccessMutation(profileId, ({ userId, ...input }: AccessChangeInput & { userId: number }) =>
    apiFetch(`/profiles/${profileId}/access/${userId}`, { method: 'PATCH', body: input }),
  );

export const useRevokeAccess = (profileId: number) =>
  useAccessMutation(profileId, (userId: number) => apiFetch<void>(`/profiles/${profileId}/access/${userId}`, { method: 'DELETE' }));

/** What an invitation link offers (works signed out too). */
export function useInvitation(token: string) {
  return useQuery({ queryKey: accessKeys.invitation(token), queryFn: () => apiFetch<InvitationPreview>(`/invitations/${token}`), enabled: token.length >= 20, retry: false });
}

/** Accepts an invitation and makes that profile the active one. */
export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => apiFetch<{ profileId: number; me: Me }>('/invitations/accept', { method: 'POST', body: { token } }),
    onSuccess: ({ profileId, me }) => {
      queryClient.setQueryData(authKeys.me(), me);
      switchProfile(profileId);
    },
  });
}

/** Creates a profile kept for someone without an account and switches to it. */
export function useCreateManagedProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ManagedProfileInput) => apiFetch<{ id: number; me: Me }>('/profiles', { method: 'POST', body: input }),
    onSuccess: ({ id, me }) => {
      queryClient.setQueryData(authKeys.me(), me);
      switchProfile(id);
    },
  });
}
