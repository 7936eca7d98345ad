import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AdminAuditEntry, AdminUser, ChangeRoleInput, DisableAccountInput } from '../../shared/schemas/accounts-admin';
import type { OutboxFilter, OutboxMail } from '../../shared/schemas/mail';
import { apiFetch, queryString } from './client';

export const adminKeys = {
  all: ['admin'] as const,
  users: (q: string) => [...adminKeys.all, 'users', q] as const,
  audit: () => [...adminKeys.all, 'audit'] as const,
  outbox: (status: OutboxFilter | 'all') => [...adminKeys.all, 'outbox', status] as const,
};

/** Accounts whose e-mail address or name contains `q` (all, oldest first, when empty); the last list stays while typing. */
export function useAdminUsers(q: string) {
  return useQuery({
    queryKey: adminKeys.users(q),
    queryFn: () => apiFetch<{ users: AdminUser[] }>(`/admin/users${queryString({ q })}`).then((r) => r.users),
    placeholderData: keepPreviousData,
  });
}

/** Role changes, disabled and enabled accounts, and access to profiles given or taken away, newest first. */
export function useAdminAudit() {
  return useQuery({ queryKey: adminKeys.audit(), queryFn: () => apiFetch<{ entries: AdminAuditEntry[] }>('/admin/audit').then((r) => r.entries) });
}

/** The mail outbox, newest first, filtered by status (`unsent` = pending or failed). */
export function useOutbox(status: OutboxFilter | 'all') {
  return useQuery({
    queryKey: adminKeys.outbox(status),
    queryFn: () => apiFetch<{ mails: OutboxMail[] }>(`/admin/mail${queryString({ status: status === 'all' ? undefined : status })}`).then((r) => r.mails),
  });
}

function useAdminMutation<T, R>(fn: (input: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: adminKeys.all }) });
}

/** Changes an account's role, with the reason recorded. */
export const useChangeRole = () =>
  useAdminMutation(({ userId, ...body }: ChangeRoleInput & { userId: number }) => apiFetch<AdminUser>(`/admin/users/${userId}/role`, { method: 'PUT', body }));

/** Disables (its sessions end) or enables an account, with the reason recorded. */
export const useSetDisabled = () =>
  useAdminMutation(({ userId, disabled, ...body }: DisableAccountInput & { userId: number; disabled: boolean }) =>
    apiFetch<AdminUser>(`/admin/users/${userId}/${disabled ? 'disable' : 'enable'}`, { method: 'POST', body }),
  );

/** Queues a failed mail again. */
export const useResendMail = () => useAdminMutation((id: number) => apiFetch<OutboxMail>(`/admin/mail/${id}/resend`, { method: 'POST' }));
