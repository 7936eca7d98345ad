import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { AdminUser } from '../../shared/schemas/accounts-admin';
import { useAdminUsers } from '../api/admin';
import { useMe } from '../api/auth';
import { useDebouncedValue } from '../foods/use-debounced-value';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { dateTimeText } from '../ui/date-format';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { DisableForm, RoleForm } from './account-forms';
import { AdminScreen } from './admin-screen';

const ROLE_LABEL = { member: 'Member', clinician: 'Clinician', admin: 'Admin' } as const;
type Open = { userId: number; what: 'role' | 'disable' };

function AccountRow({ user, self, open, onOpen, onDone }: { user: AdminUser; self: boolean; open: Open['what'] | null; onOpen: (what: Open['what'] | null) => void; onDone: (m: string) => void }) {
  const t = useTheme();
  return (
    <View role="listitem" aria-label={user.displayName} style={[styles.row, { borderColor: t.colors.border }]}>
      <View style={styles.head}>
        <View style={styles.grow}>
          <Text weight="bold">
            {user.displayName}
            {self ? ' (you)' : ''}
          </Text>
          <Text variant="caption" color="textMuted">
            {user.email} · {ROLE_LABEL[user.role]} · since {dateTimeText(user.createdAt)}
          </Text>
          {user.disabledAt ? (
            <Text variant="caption" color="danger">
              Disabled {dateTimeText(user.disabledAt)}: {user.disabledReason ?? 'no reason given'}
            </Text>
          ) : null}
        </View>
        {self || open ? null : (
          <View style={styles.actions}>
            <Button variant="secondary" label={`Change role of ${user.displayName}`} onPress={() => onOpen('role')} />
            <Button variant={user.disabledAt ? 'secondary' : 'danger'} label={`${user.disabledAt ? 'Enable' : 'Disable'} ${user.displayName}`} onPress={() => onOpen('disable')} />
          </View>
        )}
      </View>
      {open === 'role' ? <RoleForm user={user} onDone={onDone} onCancel={() => onOpen(null)} /> : null}
      {open === 'disable' ? <DisableForm user={user} onDone={onDone} onCancel={() => onOpen(null)} /> : null}
    </View>
  );
}

/** Accounts: search by e-mail address or name, change a role or disable an account, each with a reason. */
export function AccountsScreen() {
  return (
    <AdminScreen title="Accounts" subtitle="Roles and disabled accounts; every change asks why" current="/admin/accounts">
      <Accounts />
    </AdminScreen>
  );
}

function Accounts() {
  const me = useMe();
  const [text, setText] = useState('');
  const q = useDebouncedValue(text.trim(), 300);
  const users = useAdminUsers(q);
  const [open, setOpen] = useState<Open | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const finish = (message: string) => {
    setOpen(null);
    setDone(message);
  };
  return (
    <>
      <TextField label="Search by e-mail address or name" value={text} onChangeText={setText} autoCapitalize="none" placeholder="e.g. nurse, @clinic.example" />
      {done ? <Callout tone="ok" title="Saved">{done}</Callout> : null}
      {users.isPending ? (
        <LoadingState label="Loading accounts…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => void users.refetch()} />
      ) : users.data.length === 0 ? (
        <EmptyState title="No account matches">Try part of the e-mail address or of the name.</EmptyState>
      ) : (
        <Card>
          <Text variant="caption" color="textMuted">
            {users.data.length === 200 ? 'The first 200 accounts; search to narrow them down.' : `${users.data.length} account${users.data.length === 1 ? '' : 's'}`}
          </Text>
          <View role="list" aria-label="Accounts">
            {users.data.map((u) => (
              <AccountRow
                key={u.id}
                user={u}
                self={u.id === me.data?.user.id}
                open={open?.userId === u.id ? open.what : null}
                onOpen={(what) => {
                  setDone(null);
                  setOpen(what ? { userId: u.id, what } : null);
                }}
                onDone={finish}
              />
            ))}
          </View>
        </Card>
      )}
    </>
  );
}

const styles = StyleSheet.create({
  row: { borderTopWidth: 1, paddingVertical: 10, gap: 4 },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: 8 },
  grow: { flexGrow: 1, flexShrink: 1, flexBasis: 240, gap: 2 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 8 },
});
