import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { changeRoleInputSchema, disableAccountInputSchema, type AdminUser, type ChangeRoleInput, type DisableAccountInput } from '../../shared/schemas/accounts-admin';
import type { UserRole } from '../../shared/schemas/auth';
import { useChangeRole, useSetDisabled } from '../api/admin';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { applyServerErrors } from '../ui/form-errors';
import { FormChoiceGroup } from '../ui/form-choice-group';
import { FormTextField } from '../ui/form-text-field';
import { Text } from '../ui/text';

/** What each role may do, in a line. */
export const ROLE_WORDS: Record<UserRole, string> = {
  member: 'Member: their own profiles and those shared with them',
  clinician: 'Clinician: can be invited to support people',
  admin: 'Admin: this desk, imports and every account',
};
const ROLE_NAME: Record<UserRole, string> = { member: 'a member', clinician: 'a clinician', admin: 'an admin' };

type FormProps = { user: AdminUser; onDone: (message: string) => void; onCancel: () => void };

function Actions({ confirm, danger, busy, error, onConfirm, onCancel }: { confirm: string; danger?: boolean; busy: boolean; error: string | null; onConfirm: () => void; onCancel: () => void }) {
  return (
    <>
      {error ? <Callout tone="danger" title="Not changed">{error}</Callout> : null}
      <View style={styles.actions}>
        <Button variant={danger ? 'danger' : 'primary'} label={confirm} loading={busy} onPress={onConfirm} />
        <Button variant="quiet" label="Cancel" onPress={onCancel} />
      </View>
    </>
  );
}

/** Change an account's role to one of the other two, saying why (the reason goes into the audit). */
export function RoleForm({ user, onDone, onCancel }: FormProps) {
  const others = (Object.keys(ROLE_WORDS) as UserRole[]).filter((r) => r !== user.role);
  const form = useForm<ChangeRoleInput>({ resolver: zodResolver(changeRoleInputSchema), defaultValues: { role: others[0], reason: '' } });
  const change = useChangeRole();
  const [error, setError] = useState<string | null>(null);
  const submit = form.handleSubmit((body) => {
    setError(null);
    change.mutate(
      { userId: user.id, ...body },
      {
        onSuccess: (saved) => onDone(`${saved.displayName} is now ${ROLE_NAME[saved.role]}.`),
        onError: (err) => setError(applyServerErrors(err, form.setError, ['role', 'reason']) ?? null),
      },
    );
  });
  return (
    <View style={styles.form}>
      <Text color="textMuted">
        {user.displayName} is {ROLE_NAME[user.role]} now.
      </Text>
      <FormChoiceGroup control={form.control} name="role" label="New role" choices={others.map((r) => ({ value: r, label: ROLE_WORDS[r] }))} />
      <FormTextField control={form.control} name="reason" label="Reason for the change" hint="Kept in the audit with your name." multiline />
      <Actions confirm={`Change the role of ${user.displayName}`} busy={change.isPending} error={error} onConfirm={() => void submit()} onCancel={onCancel} />
    </View>
  );
}

/** Disable an account (it is signed out at once and cannot sign in) or enable it again, saying why. */
export function DisableForm({ user, onDone, onCancel }: FormProps) {
  const disabling = !user.disabledAt;
  const form = useForm<DisableAccountInput>({ resolver: zodResolver(disableAccountInputSchema), defaultValues: { reason: '' } });
  const set = useSetDisabled();
  const [error, setError] = useState<string | null>(null);
  const submit = form.handleSubmit((body) => {
    setError(null);
    set.mutate(
      { userId: user.id, disabled: disabling, ...body },
      {
        onSuccess: (saved) => onDone(`${saved.displayName}'s account is ${disabling ? 'disabled' : 'enabled again'}.`),
        onError: (err) => setError(applyServerErrors(err, form.setError, ['reason']) ?? null),
      },
    );
  });
  return (
    <View style={styles.form}>
      {disabling ? (
        <Callout tone="caution" title="Signed out at once">
          {`${user.displayName} is signed out everywhere and cannot sign in or reset the password until an admin enables the account again. Their profiles and logs stay as they are.`}
        </Callout>
      ) : (
        <Text color="textMuted">{user.displayName} can sign in again once enabled.</Text>
      )}
      <FormTextField control={form.control} name="reason" label={disabling ? 'Reason for disabling' : 'Reason for enabling'} hint="Kept in the audit with your name." multiline />
      <Actions
        confirm={disabling ? `Yes, disable ${user.displayName}` : `Yes, enable ${user.displayName}`}
        danger={disabling}
        busy={set.isPending}
        error={error}
        onConfirm={() => void submit()}
        onCancel={onCancel}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: 12, paddingTop: 8 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
});
