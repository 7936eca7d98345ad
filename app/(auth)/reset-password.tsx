import { Stack, useLocalSearchParams } from 'expo-router';
import { ResetPasswordScreen } from '@/components/auth/reset-password-screen';

export default function ResetPasswordRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <>
      <Stack.Screen options={{ title: 'New password · Carbwright' }} />
      <ResetPasswordScreen token={token ?? ''} />
    </>
  );
}
