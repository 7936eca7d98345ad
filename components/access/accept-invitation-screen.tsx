import { router } from 'expo-router';
import { useInvitation, useAcceptInvitation } from '../api/access';
import { useMe } from '../api/auth';
import { Button } from '../ui/button';
import { Callout } from '../ui/callout';
import { Card } from '../ui/card';
import { Screen } from '../ui/screen';
import { ErrorState, LoadingState } from '../ui/states';
import { Text } from '../ui/text';

const ROLE_WORDS = {
  owner: 'as its owner: the profile becomes yours',
  carer: 'as a carer: you can plan, cook, log and check doses for them',
  clinician: 'as a clinician: you can read their profile',
} as const;

/** The page an invitation link opens (signed in): what it offers, and accept. */
export function AcceptInvitationScreen({ token }: { token: string }) {
  const invitation = useInvitation(token);
  const me = useMe();
  const accept = useAcceptInvitation();
  if (invitation.isPending || me.isPending) return <LoadingState />;
  if (invitation.isError) return <ErrorState error={invitation.error} />;
  const inv = invitation.data;
  const wrongAccount = me.data && me.data.user.email !== inv.email;
  return (
    <Screen title="Invitation" subtitle={`To ${inv.profileName}'s profile`}>
      <Card>
        <Text>
          {inv.inviterName} invites you to {inv.profileName}&apos;s profile {ROLE_WORDS[inv.role]}.
        </Text>
        {inv.status !== 'open' ? (
          <Callout tone="caution" title={inv.status === 'used' ? 'Already used' : 'Expired'}>
            This link no longer works. Ask {inv.inviterName} for a new invitation.
          </Callout>
        ) : wrongAccount ? (
          <Callout tone="caution" title="Another account">
            This invitation was sent to {inv.email}. Sign out and sign in (or sign up) with that address to accept it.
          </Callout>
        ) : (
          <Button
            label="Accept invitation"
            loading={accept.isPending}
            onPress={() => accept.mutate(token, { onSuccess: () => router.replace('/') })}
          />
        )}
        {accept.isError ? <ErrorState error={accept.error} /> : null}
      </Card>
    </Screen>
  );
}
