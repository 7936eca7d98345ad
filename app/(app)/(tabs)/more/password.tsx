import { Stack } from 'expo-router';
import { ChangePasswordScreen } from '@/components/more/change-password-screen';

export default function ChangePasswordRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Change password · Carbwright' }} />
      <ChangePasswordScreen />
    </>
  );
}
