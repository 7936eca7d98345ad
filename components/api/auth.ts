import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { profileActionAllowed, type ProfileAction } from '../../shared/schemas/profile-actions';
import type { ChangePasswordInput, EmailChangeInput, EmailChangeRequested, Me, PasswordResetInput, PasswordResetRequestInput, Session, SignInInput, SignUpInput } from '../../shared/schemas/auth';
import { activeProfileStore, useActiveProfileId } from '../auth/active-profile-store';
import { useSession } from '../auth/session';
import { apiFetch } from './client';

export const authKeys = { all: ['auth'] as const, me: () => [...authKeys.all, 'me'] as const };

export const fetchMe = () => apiFetch<Me>('/me');
export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: fetchMe });

/** The signed-in person and their profiles. */
export function useMe() {
  const { status } = useSession();
  return useQuery({ ...meQueryOptions(), enabled: status === 'signed-in' });
}

/** The profile the person is working on: the one they switched to (kept on this device), else their own, else the first. */
export function useActiveProfile() {
  const me = useMe();
  const chosen = useActiveProfileId();
  const profiles = me.data?.profiles ?? [];
  return { ...me, profile: profiles.find((p) => p.id === chosen) ?? profiles[0] };
}

/** Whether the active profile's grant allows the action, by the server's own rule (false until /me has loaded). */
export function useProfileCan(action: ProfileAction): boolean {
  const { profile } = useActiveProfile();
  return !!profile && profileActionAllowed({ role: profile.access, permissions: profile.permissions }, action);
}

/** Makes another profile the active one; every screen and call follows it. */
export const switchProfile = (id: number) => activeProfileStore.set(id);

function useStartSession() {
  const { signIn } = useSession();
  const queryClient = useQueryClient();
  return (session: Session) => {
    queryClient.clear();
    queryClient.setQueryData(authKeys.me(), session.me);
    signIn();
  };
}

export function useSignIn() {
  const start = useStartSession();
  return useMutation({
    mutationFn: (input: SignInInput) => apiFetch<Session>('/auth/sign-in', { method: 'POST', body: input }),
    onSuccess: start,
  });
}

export function useSignUp() {
  const start = useStartSession();
  return useMutation({
    mutationFn: (input: SignUpInput) => apiFetch<Session>('/auth/sign-up', { method: 'POST', body: input }),
    onSuccess: start,
  });
}

export function useChangePassword() {
  const start = useStartSession();
  return useMutation({
    mutationFn: (input: ChangePasswordInput) => apiFetch<Session>('/auth/password', { method: 'POST', body: input }),
    onSuccess: start,
  });
}

/** Asks for a reset link; the answer is the same whether or not an account uses the address. */
export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: PasswordResetRequestInput) => apiFetch<{ message: string }>('/auth/password-reset', { method: 'POST', body: input }),
  });
}

/** Sets a new password with the token from the mailed link, and signs in. */
export function useResetPassword() {
  const start = useStartSession();
  return useMutation({
    mutationFn: (input: PasswordResetInput) => apiFetch<Session>('/auth/password-reset/confirm', { method: 'POST', body: input }),
    onSuccess: start,
  });
}

/** Asks to move the account to a new address; a link goes there (the answer is the same if another account uses it). */
export function useRequestEmailChange() {
  return useMutation({
    mutationFn: (input: EmailChangeInput) => apiFetch<EmailChangeRequested>('/auth/email', { method: 'POST', body: input }),
  });
}

/** Confirms the new address with the token from its link; this device gets a fresh session, others are signed out. */
export function useConfirmEmailChange() {
  const start = useStartSession();
  return useMutation({
    mutationFn: (token: string) => apiFetch<Session>('/auth/email/confirm', { method: 'POST', body: { token } }),
    onSuccess: start,
  });
}

export function useSignOut() {
  const { signOut } = useSession();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiFetch<void>('/auth/sign-out', { method: 'POST' }).catch(() => undefined),
    onSettled: () => {
      signOut();
      queryClient.clear();
    },
  });
}
