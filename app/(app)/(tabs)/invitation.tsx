import { Stack, useLocalSearchParams } from 'expo-router';
import { AcceptInvitationScreen } from '@/components/access/accept-invitation-screen';

export default function InvitationRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Invitation · Carbwright' }} />
      <AcceptInvitationScreen token={token ?? ''} />
    </>
  );
}
