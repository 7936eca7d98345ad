import { Stack } from 'expo-router';
import { ChangeEmailScreen } from '@/components/more/change-email-screen';

export default function ChangeEmailRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Change e-mail address · Carbwright' }} />
      <ChangeEmailScreen />
    </>
  );
}
