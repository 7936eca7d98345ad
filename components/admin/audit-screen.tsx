import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { AccessAuditEntry, AccountAuditEntry, AdminAuditEntry } from '../../shared/schemas/accounts-admin';
import { useAdminAudit } from '../api/admin';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { ChoiceGroup } from '../ui/choice-group';
import { dateTimeText } from '../ui/date-format';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { AdminScreen } from './admin-screen';

const EXTRA = { settings: 'may change settings', ratios: 'may change kinds of day and ratios' } as const;

function accessAs(e: AccessAuditEntry): string {
  return e.role ? ` as ${[e.role, ...e.permissions.map((p) => EXTRA[p])].join(', ')}` : '';
}

function accountLine(e: AccountAuditEntry, actor: string): string {
  if (e.action === 'role_changed') return `${actor} changed the role of ${e.user.email} from ${e.oldValue ?? '—'} to ${e.newValue ?? '—'}`;
  return `${actor} ${e.action} the account of ${e.user.email}`;
}

function accessLine(e: AccessAuditEntry, actor: string): string {
  const who = e.user?.email ?? e.email ?? 'someone';
  const profile = `profile “${e.profile.displayName}”`;
  switch (e.action) {
    case 'invited':
      return `${actor} invited ${who} to ${profile}${accessAs(e)}`;
    case 'invitation_cancelled':
      return `${actor} withdrew the invitation of ${who} to ${profile}`;
    case 'granted':
      return `${who} was given access to ${profile}${accessAs(e)}`;
    case 'changed':
      return `${actor} changed the access of ${who} to ${profile}: now${accessAs(e)}`;
    case 'revoked':
      return `${actor} revoked the access of ${who} to ${profile} (was${accessAs(e)})`;
    case 'handed_over':
      return `${who} took over ${profile} as its owner`;
  }
}

/** One line of the admin's audit, in words: who did what to whom. */
export function auditLine(e: AdminAuditEntry): string {
  const actor = e.actor?.email ?? 'Someone (account since removed)';
  return e.source === 'account' ? accountLine(e, actor) : accessLine(e, actor);
}

type Filter = 'all' | AdminAuditEntry['source'];
const FILTERS: { value: Filter; label: string }[] = [
  { value: 'all', label: 'Everything' },
  { value: 'account', label: 'Roles and disabled accounts' },
  { value: 'access', label: 'Access to profiles' },
];

/** The audit: role changes, disabled and enabled accounts, and access to profiles given, changed or revoked. */
export function AuditScreen() {
  return (
    <AdminScreen title="Audit" subtitle="Newest first, the latest 200 changes" current="/admin/audit">
      <Audit />
    </AdminScreen>
  );
}

function Audit() {
  const t = useTheme();
  const audit = useAdminAudit();
  const [filter, setFilter] = useState<Filter>('all');
  const shown = audit.data?.filter((e) => filter === 'all' || e.source === filter) ?? [];
  return (
    <>
      <ChoiceGroup label="Show" value={filter} onChange={setFilter} choices={FILTERS} />
      {audit.isPending ? (
        <LoadingState label="Loading the audit…" />
      ) : audit.isError ? (
        <ErrorState error={audit.error} onRetry={() => void audit.refetch()} />
      ) : shown.length === 0 ? (
        <EmptyState title="Nothing yet">Changes to roles, accounts and access to profiles will be listed here.</EmptyState>
      ) : (
        <Card>
          <View role="list" aria-label="Audit">
            {shown.map((e) => (
              <View key={`${e.source}-${e.id}`} role="listitem" style={[styles.row, { borderColor: t.colors.border }]}>
                <Text>{auditLine(e)}</Text>
                {e.source === 'account' && e.reason ? <Text variant="caption">Reason: {e.reason}</Text> : null}
                <Text variant="caption" color="textMuted">
                  {dateTimeText(e.createdAt)}
                </Text>
              </View>
            ))}
          </View>
        </Card>
      )}
    </>
  );
}

const styles = StyleSheet.create({ row: { borderTopWidth: 1, paddingVertical: 8, gap: 2 } });
