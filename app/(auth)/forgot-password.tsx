import { Stack } from 'expo-router';
import { ForgotPasswordScreen } from '@/components/auth/forgot-password-screen';

export default function ForgotPasswordRoute() {
  return (
    <>
      <Stack.Screen options={{ title: 'Forgotten password · Carbwright' }} />
      <ForgotPasswordScreen />
    </>
  );
}
