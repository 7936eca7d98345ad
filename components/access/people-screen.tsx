import { StyleSheet, View } from 'react-native';
import type { AccessPerson } from '../../shared/schemas/access';
import { useAccessAudit, useCancelInvitation, useProfileAccess, useRevokeAccess } from '../api/access';
import { useActiveProfile } from '../api/auth';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { EmptyState, ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';
import { TextLink } from '../ui/text-link';
import { InviteForm } from './invite-form';

const ROLE = { owner: 'Owner', carer: 'Carer', clinician: 'Clinician' } as const;
const EXTRA = { settings: 'may change settings, kinds of day and ratios', ratios: 'may change kinds of day and ratios' } as const;
const AUDIT = {
  invited: 'invited',
  invitation_cancelled: 'withdrew the invitation of',
  granted: 'was given access:',
  changed: 'changed the permissions of',
  revoked: 'revoked the access of',
  handed_over: 'took the profile over:',
  settings: 'changed',
} as const;

const ADD_PROFILE = <TextLink href="/more/new-profile" label="Add a profile for someone you care for" />;

const day = (iso: string) => iso.slice(0, 10);

function describe(p: Pick<AccessPerson, 'role' | 'permissions'>) {
  return [ROLE[p.role], ...p.permissions.map((x) => EXTRA[x])].join(', ');
}

/** The owner's page: everyone with access to the active profile, open invitations, the invite form and the audit. */
export function PeopleScreen() {
  const { profile, isPending } = useActiveProfile();
  const owner = profile?.access === 'owner';
  const list = useProfileAccess(owner ? profile.id : undefined);
  const audit = useAccessAudit(owner ? profile.id : undefined);
  const revoke = useRevokeAccess(profile?.id ?? 0);
  const cancel = useCancelInvitation(profile?.id ?? 0);
  if (isPending) return <LoadingState />;
  if (!profile || !owner) {
    return (
      <Screen title="People with access" backHref="/more">
        <EmptyState title="Only the owner sees this" action={ADD_PROFILE}>
          Switch to a profile you own to see and change who has access, or add a profile for someone you care for.
        </EmptyState>
      </Screen>
    );
  }
  if (list.isPending) return <LoadingState />;
  if (list.isError) return <ErrorState error={list.error} onRetry={() => void list.refetch()} />;
  return (
    <Screen title="People with access" subtitle={`To ${profile.displayName}'s profile`} backHref="/more">
      <Card>
        <Text variant="heading">Who has access</Text>
        <View role="list" aria-label="People with access" style={styles.list}>
          {list.data.people.map((p) => (
            <View key={p.userId} role="listitem" style={styles.row}>
              <View style={styles.grow}>
                <Text weight="bold">{p.displayName}</Text>
                <Text variant="caption" color="textMuted">
                  {p.email} · {describe(p)} · since {day(p.since)}
                </Text>
              </View>
              {p.role !== 'owner' ? (
                <Button variant="danger" label={`Revoke ${p.displayName}`} onPress={() => revoke.mutate(p.userId)} loading={revoke.isPending && revoke.variables === p.userId} />
              ) : null}
            </View>
          ))}
        </View>
      </Card>
      {list.data.invitations.length ? (
        <Card>
          <Text variant="heading">Open invitations</Text>
          {list.data.invitations.map((i) => (
            <View key={i.id} style={styles.row}>
              <View style={styles.grow}>
                <Text weight="bold">{i.email}</Text>
                <Text variant="caption" color="textMuted">
                  {describe(i)} · until {day(i.expiresAt)}
                </Text>
              </View>
              <Button variant="quiet" label={`Withdraw invitation to ${i.email}`} onPress={() => cancel.mutate(i.id)} />
            </View>
          ))}
        </Card>
      ) : null}
      <InviteForm profileId={profile.id} managed={profile.managed} />
      <Card>
        <Text variant="heading">Someone without an account?</Text>
        <Text color="textMuted">Keep a profile for them (a child, say) and hand it over later by inviting them as its owner.</Text>
        {ADD_PROFILE}
      </Card>
      <Card>
        <Text variant="heading">Audit</Text>
        {audit.data?.length ? (
          audit.data.map((e, n) => (
            <Text key={n} variant="caption">
              {day(e.at)} · {e.kind === 'granted' || e.kind === 'handed_over' ? `${e.about} ${AUDIT[e.kind]} ${e.role ? ROLE[e.role] : ''}` : `${e.actorName ?? 'Someone'} ${AUDIT[e.kind]} ${e.about ?? ''}`}
            </Text>
          ))
        ) : (
          <Text color="textMuted">Nothing yet.</Text>
        )}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: 8 },
  row: { flexDirection: 'row', alignItems: 'center', gap: 8, flexWrap: 'wrap' },
  grow: { flexGrow: 1, flexShrink: 1, minWidth: 200 },
});
