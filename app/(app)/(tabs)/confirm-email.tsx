import { Stack, useLocalSearchParams } from 'expo-router';
import { ConfirmEmailScreen } from '@/components/more/confirm-email-screen';

export default function ConfirmEmailRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'Confirm e-mail address · Carbwright' }} />
      <ConfirmEmailScreen token={token ?? ''} />
    </>
  );
}
